import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { catchError, combineLatest, EMPTY, map, of, switchMap } from 'rxjs';

import { SessionService } from '../../../core/session/session';
import { MaterialsApi } from '../../../shared/catalogue/materials-api';
import { ImpactBanner } from '../../../shared/impact-banner/impact-banner';
import { ApiFailure, apiFailureOf, codeErrorPosition } from '../../../shared/laminate/api-problem';
import { LayupApi } from '../data/layup-api';
import { CodeDraft, LayupDraft, LayupRevision } from '../data/layup-wire';
import { DesignRules } from './design-rules/design-rules';
import { LaminaBadge } from './lamina-badge/lamina-badge';
import { LivePlots, EnvelopeSettings } from './live-plots';
import { LivePreview, PreviewEvent } from './live-preview';
import { DEFAULT_LOAD_SETTINGS, layupSettingsOf, LoadSettings, loadSettingsOf } from './loads/load-settings';
import { LoadsPanel } from './loads/loads-panel';
import { MaterialPicker } from './material-picker/material-picker';
import { ComposerPly, draftPlies, MaterialChoice, newPly, pliesFromRevision } from './ply-list';
import { laminaOptions } from './ply-table/lamina-options';
import { PlyTable } from './ply-table/ply-table';
import { RevisionBar } from './revision-bar/revision-bar';
import { StiffnessPanel } from './results/stiffness-panel';
import { StackDiagram } from './results/stack-diagram/stack-diagram';
import { SavePanel, SaveRequest } from './save-panel/save-panel';
import { CodeError, StackingCodeField } from './stacking-code-field/stacking-code-field';
import { plyProblemsOf } from './ply-problems';

/** The saved revision the composer started from. */
interface Origin {
  readonly layupId: number;
  readonly revisionId: number;
  readonly revision: number;
  readonly name: string;
  readonly description: string;
  readonly isLatest: boolean;
  readonly impact: LayupRevision['impact'];
}

/**
 * The designer's page: compose a stacking sequence (table, drag and drop or
 * laminate code), read its stiffness, load it, check the rules, save a
 * revision. Every edit goes to the API (POST /layups/preview); only the
 * latest edit's answer is shown.
 */
@Component({
  selector: 'app-layup-composer',
  imports: [
    DesignRules,
    ImpactBanner,
    LaminaBadge,
    LoadsPanel,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MaterialPicker,
    PlyTable,
    RevisionBar,
    RouterLink,
    SavePanel,
    StackDiagram,
    StackingCodeField,
    StiffnessPanel,
  ],
  providers: [LivePreview, LivePlots],
  templateUrl: './layup-composer.html',
  styleUrl: './layup-composer.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LayupComposer {
  private readonly layups = inject(LayupApi);
  private readonly router = inject(Router);
  private readonly session = inject(SessionService);
  protected readonly live = inject(LivePreview);
  protected readonly plots = inject(LivePlots);

  /** Route parameter (absent on /layups/new) and ?revision= query parameter. */
  readonly layupId = input<string>();
  readonly revision = input<string>();

  private readonly catalogue = inject(MaterialsApi);
  protected readonly materials = toSignal(this.catalogue.materials(), { initialValue: [] });
  protected readonly conditions = toSignal(this.catalogue.conditions$, { initialValue: [] });
  protected readonly laminaOptions = computed(() => laminaOptions(this.conditions()));

  protected readonly plies = signal<ComposerPly[]>([]);
  protected readonly choice = signal<MaterialChoice | null>(null);
  protected readonly printedCode = signal('');
  protected readonly codeError = signal<CodeError | null>(null);
  protected readonly loadSettings = signal<LoadSettings>(DEFAULT_LOAD_SETTINGS);
  protected readonly envelopeSettings = signal<EnvelopeSettings>({ criterion: 'tsai-wu', axes: 'Nx-Ny', deltaT: 0 });
  protected readonly origin = signal<Origin | null>(null);
  protected readonly loadFailure = signal<ApiFailure | null>(null);
  protected readonly saving = signal(false);
  protected readonly saveMessage = signal<{ text: string; error: boolean } | null>(null);
  /** Bumped after a save, so the revision list is read again. */
  private readonly saves = signal(0);
  protected readonly detail = toSignal(
    combineLatest([toObservable(this.layupId), toObservable(this.saves)]).pipe(
      switchMap(([layupId]) =>
        layupId && layupId !== 'new' ? this.layups.detail(Number(layupId)).pipe(catchError(() => of(null))) : of(null),
      ),
    ),
    { initialValue: null },
  );

  protected readonly state = this.live.state;
  protected readonly preview = computed(() => this.state().preview);
  protected readonly busy = computed(() => ['waiting', 'loading'].includes(this.state().status));
  protected readonly mayWrite = computed(() => this.session.roles().includes('designer'));
  protected readonly plyProblems = computed(() => plyProblemsOf(this.state().failure));
  protected readonly otherProblems = computed(() => {
    const failure = this.state().failure;
    return failure ? failure.problems.filter((p) => p.field !== 'code' && !/^plies\[\d+\]/.test(p.field)) : [];
  });
  /** The saved revision's superseded allowables; for a draft, those the preview would use. */
  protected readonly impact = computed(() => {
    const saved = this.origin()?.impact ?? [];
    return saved.length > 0 ? saved : (this.preview()?.impact ?? []);
  });
  protected readonly laminae = computed(() => this.preview()?.laminae ?? []);

  private lastCode = '';

  constructor() {
    this.live.events$.pipe(takeUntilDestroyed()).subscribe((event) => this.onPreviewEvent(event));
    this.loadRevisionFromRoute();
    // A unidirectional tape of the catalogue until the person picks a material, so a typed code computes at once.
    effect(() => {
      const materials = this.materials();
      const conditions = this.conditions();
      untracked(() => {
        if (this.choice() || materials.length === 0 || conditions.length === 0) return;
        const condition = conditions.find((c) => c.code === 'RTD') ?? conditions[0];
        const material = materials.find((m) => m.form === 'unidirectional-tape') ?? materials.find((m) => m.form !== 'core') ?? materials[0];
        this.choice.set({ materialId: material.id, lamina: { source: 'ply-property-set', conditionId: condition.id, basis: 'B' }, thicknessMm: null });
      });
    });
    // The envelope follows the chosen criteria and the ΔT of the load case.
    effect(() => {
      const settings = this.loadSettings();
      untracked(() =>
        this.envelopeSettings.update((current) => ({
          ...current,
          deltaT: settings.deltaT,
          criterion: current.criterion && settings.criteria.includes(current.criterion) ? current.criterion : (settings.criteria[0] ?? null),
        })),
      );
    });
    effect(() => this.plots.envelopeSettings.set(this.envelopeSettings()));
  }

  protected onTableEdited(plies: ComposerPly[]): void {
    this.plies.set(plies);
    this.requestFromTable();
  }

  protected onCodeTyped(code: string): void {
    this.lastCode = code;
    const draft = this.codeDraft(code);
    if (!draft) {
      this.codeError.set({ message: 'Pick a ply material first: the code gives every ply the chosen material.', position: null });
      return;
    }
    this.live.request({ origin: 'code', draft });
  }

  protected onLoadsChanged(settings: LoadSettings): void {
    this.loadSettings.set(settings);
    if (this.plies().length > 0) this.requestFromTable();
    else if (this.lastCode) this.onCodeTyped(this.lastCode);
  }

  protected addPly(): void {
    const choice = this.choice();
    if (!choice) return;
    this.onTableEdited([...this.plies(), newPly(choice, 0)]);
  }

  protected applyToAll(choice: MaterialChoice): void {
    if (this.plies().length === 0) return;
    this.onTableEdited(this.plies().map((ply) => ({ ...ply, materialId: choice.materialId, lamina: choice.lamina, thicknessMm: choice.thicknessMm })));
  }

  protected onSave(request: SaveRequest): void {
    const origin = this.origin();
    const draft: LayupDraft = {
      name: request.name,
      ...(request.description ? { description: request.description } : {}),
      ...(request.comment ? { comment: request.comment } : {}),
      plies: draftPlies(this.plies()),
      settings: layupSettingsOf(this.loadSettings()),
    };
    this.saving.set(true);
    this.saveMessage.set(null);
    const saved$ = origin
      ? this.layups.revise(origin.layupId, draft, origin.revision)
      : this.layups.create({ ...draft, name: request.name });
    saved$.subscribe({
      next: (revision) => {
        this.saving.set(false);
        this.applyRevision(revision, false);
        this.saves.update((n) => n + 1);
        this.saveMessage.set({ text: `Saved as revision ${revision.revision} of “${revision.name}”.`, error: false });
        void this.router.navigate(['/layups', revision.layupId], { queryParams: { revision: revision.id }, replaceUrl: true });
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const failure = apiFailureOf(error);
        const text =
          failure.status === 409 && origin
            ? `Not saved: ${failure.message}. Someone saved a newer revision; open it, then make your change again.`
            : `Not saved: ${failure.message}`;
        this.saveMessage.set({ text, error: true });
      },
    });
  }

  private requestFromTable(): void {
    if (this.plies().length === 0) return;
    this.live.request({ origin: 'table', draft: { plies: draftPlies(this.plies()), settings: layupSettingsOf(this.loadSettings()) } });
  }

  private codeDraft(code: string): CodeDraft | null {
    const choice = this.choice();
    if (!choice) return null;
    return { code, material: { materialId: choice.materialId, lamina: choice.lamina, thicknessMm: choice.thicknessMm }, settings: layupSettingsOf(this.loadSettings()) };
  }

  private onPreviewEvent(event: PreviewEvent): void {
    if (event.kind === 'ready') {
      if (event.request.origin === 'code') this.plies.set(pliesFromRevision(event.preview.plies, this.plies()));
      this.codeError.set(null);
      this.printedCode.set(event.preview.code);
      this.plots.laminate.set(event.preview.laminate.plies);
    } else if (event.kind === 'error' && event.request.origin === 'code') {
      const problem = event.failure.problems.find((p) => p.field === 'code');
      this.codeError.set(problem ? { message: problem.message, position: codeErrorPosition(problem) } : null);
    }
  }

  /** Opens /layups/:layupId (latest revision) or ?revision=<id>, whenever the route changes. */
  private loadRevisionFromRoute(): void {
    combineLatest([toObservable(this.layupId), toObservable(this.revision)])
      .pipe(
        switchMap(([layupId, revisionId]) => {
          this.loadFailure.set(null);
          const revision$ = revisionId
            ? this.layups.revision(Number(revisionId))
            : layupId && layupId !== 'new'
              ? this.layups.detail(Number(layupId)).pipe(map((detail) => detail.latest))
              : EMPTY;
          return revision$.pipe(
            catchError((error: unknown) => {
              this.loadFailure.set(apiFailureOf(error));
              return EMPTY;
            }),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((revision) => this.applyRevision(revision, true));
  }

  private applyRevision(revision: LayupRevision, recompute: boolean): void {
    this.origin.set({
      layupId: revision.layupId,
      revisionId: revision.id,
      revision: revision.revision,
      name: revision.name,
      description: revision.description ?? '',
      isLatest: revision.isLatest,
      impact: revision.impact,
    });
    if (!recompute) return;
    const plies = pliesFromRevision(revision.plies);
    this.plies.set(plies);
    this.printedCode.set(revision.code);
    this.loadSettings.set(loadSettingsOf(revision.settings));
    const first = plies[0];
    if (first) this.choice.set({ materialId: first.materialId, lamina: first.lamina, thicknessMm: first.thicknessMm });
    this.requestFromTable();
  }
}
