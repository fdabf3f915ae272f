import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { catchError, debounceTime, map, merge, of, scan, startWith, Subject, switchMap } from 'rxjs';

import { EngineeringCaution } from '../../shared/engineering-caution/engineering-caution';
import { ImpactBanner } from '../../shared/impact-banner/impact-banner';
import { ApiFailure, apiFailureOf } from '../../shared/laminate/api-problem';
import { LayupApi } from '../layups/data/layup-api';
import { ExportApi } from './data/export-api';
import { ExportPreview, ExportSummary } from './data/export-wire';
import { ExportForm, ExportSettings } from './export-form/export-form';
import { ExportHistory } from './export-history/export-history';
import { SectionChecks } from './section-checks/section-checks';

interface PreviewState {
  readonly loading: boolean;
  readonly preview: ExportPreview | null;
  readonly failure: ApiFailure | null;
}

/**
 * The analyst's page: a layup revision's shell section in a solver's syntax
 * and unit system, previewed with its checks beside it, then downloaded or
 * copied. Every download or copy is recorded (POST /exports) and listed.
 */
@Component({
  selector: 'app-section-export',
  imports: [
    EngineeringCaution,
    ExportForm,
    ExportHistory,
    ImpactBanner,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    SectionChecks,
  ],
  templateUrl: './section-export.html',
  styleUrl: './section-export.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SectionExportPage {
  private readonly exportsApi = inject(ExportApi);
  private readonly document = inject(DOCUMENT);

  /** ?layup=<id>&revision=<id> preselect a revision (links from a layup). */
  readonly layup = input<string>();
  readonly revision = input<string>();

  protected readonly layups = toSignal(inject(LayupApi).list().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly initialLayupId = computed(() => (this.layup() ? Number(this.layup()) : null));
  protected readonly initialRevisionId = computed(() => (this.revision() ? Number(this.revision()) : null));

  protected readonly settings = signal<ExportSettings | null>(null);
  protected readonly recording = signal(false);
  protected readonly message = signal<{ text: string; error: boolean } | null>(null);
  private readonly recorded = new Subject<void>();

  protected readonly state = toSignal(
    toObservable(this.settings).pipe(
      debounceTime(250),
      switchMap((settings) =>
        settings
          ? this.exportsApi.preview(settings.request, settings.checks).pipe(
              map((preview): Partial<PreviewState> => ({ loading: false, preview, failure: null })),
              catchError((error: unknown) => of<Partial<PreviewState>>({ loading: false, failure: apiFailureOf(error) })),
              startWith<Partial<PreviewState>>({ loading: true }),
            )
          : of<Partial<PreviewState>>({ loading: false, preview: null, failure: null }),
      ),
      scan((state: PreviewState, change: Partial<PreviewState>) => ({ ...state, ...change }), { loading: false, preview: null, failure: null }),
    ),
    { initialValue: { loading: false, preview: null, failure: null } as PreviewState },
  );

  protected readonly history = toSignal(
    merge(toObservable(computed(() => this.settings()?.request.layupRevisionId ?? null)), this.recorded.pipe(map(() => this.settings()?.request.layupRevisionId ?? null))).pipe(
      switchMap((revisionId) => (revisionId ? this.exportsApi.history(revisionId).pipe(catchError(() => of([] as readonly ExportSummary[]))) : of([] as readonly ExportSummary[]))),
    ),
    { initialValue: [] as readonly ExportSummary[] },
  );

  protected download(): void {
    const settings = this.settings();
    if (!settings) return;
    this.startRecording();
    this.exportsApi.recordFile(settings.request).subscribe({
      next: (file) => {
        this.saveFile(file.fileName, file.contentType, file.text);
        this.finishRecording(`Downloaded ${file.fileName}; export ${file.id ?? ''} recorded.`);
      },
      error: (error: unknown) => this.failRecording(error),
    });
  }

  protected copy(): void {
    const settings = this.settings();
    if (!settings) return;
    this.startRecording();
    this.exportsApi.recordJson(settings.request).subscribe({
      next: async (recorded) => {
        const copied = await this.writeClipboard(recorded.text);
        this.finishRecording(
          copied
            ? `Copied ${recorded.fileName} to the clipboard; export ${recorded.id} recorded.`
            : `Export ${recorded.id} recorded, but the browser refused the clipboard: select the preview and copy it.`,
        );
      },
      error: (error: unknown) => this.failRecording(error),
    });
  }

  private startRecording(): void {
    this.recording.set(true);
    this.message.set(null);
  }

  private finishRecording(text: string): void {
    this.recording.set(false);
    this.message.set({ text, error: false });
    this.recorded.next();
  }

  private failRecording(error: unknown): void {
    this.recording.set(false);
    this.message.set({ text: `Not exported: ${apiFailureOf(error).message}`, error: true });
  }

  /** Hands the text to the browser as a file download (an object URL, so nothing is fetched twice). */
  private saveFile(fileName: string, contentType: string, text: string): void {
    const url = URL.createObjectURL(new Blob([text], { type: contentType }));
    const link = this.document.createElement('a');
    link.href = url;
    link.download = fileName;
    this.document.body.appendChild(link);
    link.click();
    link.remove();
    setTimeout(() => URL.revokeObjectURL(url), 10_000);
  }

  private async writeClipboard(text: string): Promise<boolean> {
    try {
      await this.document.defaultView?.navigator.clipboard.writeText(text);
      return true;
    } catch {
      return false;
    }
  }
}
