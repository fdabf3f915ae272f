import { HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { map } from 'rxjs';

import { SessionService } from '../../../core/session/session';
import { UnitSystemService } from '../../../core/units/unit-system';
import { UploadResult } from '../../../shared/catalogue/coupon-wire';
import { CouponsApi } from '../../../shared/catalogue/coupons-api';
import { previewProblems } from './cell-checks';
import { ColumnMapping, doubleMapped, guessMapping, mappingForServer, missingRequired, unitsStatedByHeaders, unitStatedBy } from './column-mapping';
import { FilePreview, readFilePreview } from './csv-reading';
import { MappingPanel, UnitChoice } from './mapping-panel/mapping-panel';
import { MarkedProblem, PreviewTable } from './preview-table/preview-table';
import { RecentUploads } from './recent-uploads/recent-uploads';
import { ForceUnit, LengthUnit, StressUnit, TEMPLATE_FIELDS } from './template-fields';
import { UploadProblems } from './upload-problems/upload-problems';
import { UploadRefusal, uploadRefusalOf } from './upload-refusal';

type Phase = 'choose' | 'reading' | 'preview' | 'sending' | 'checking' | 'stored' | 'refused';

/**
 * Coupon results by CSV: the template, the file read and previewed in the
 * browser (first rows, column mapping, units, problems marked), then sent with
 * a progress bar; the server checks every row and stores all or nothing.
 */
@Component({
  selector: 'app-upload-page',
  imports: [
    MappingPanel,
    MatButtonModule,
    MatButtonToggleModule,
    MatExpansionModule,
    MatIconModule,
    MatProgressBarModule,
    PreviewTable,
    ReactiveFormsModule,
    RecentUploads,
    RouterLink,
    UploadProblems,
  ],
  templateUrl: './upload-page.html',
  styleUrl: './upload-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadPage {
  private readonly api = inject(CouponsApi);
  private readonly session = inject(SessionService);
  private readonly unitSystem = inject(UnitSystemService);

  protected readonly mayUpload = computed(() => this.session.roles().includes('materials-engineer'));
  protected readonly templateSi = this.api.templateUrl('SI');
  protected readonly templateUs = this.api.templateUrl('US');
  protected readonly fieldCount = TEMPLATE_FIELDS.length;

  protected readonly phase = signal<Phase>('choose');
  protected readonly file = signal<File | null>(null);
  protected readonly preview = signal<FilePreview | null>(null);
  protected readonly readFailure = signal<string | null>(null);
  protected readonly mapping = signal<ColumnMapping>({});
  protected readonly progressPct = signal(0);
  protected readonly result = signal<UploadResult | null>(null);
  protected readonly refusal = signal<UploadRefusal | null>(null);
  protected readonly uploadsRefresh = signal(0);

  protected readonly unitForm = new FormGroup({
    stressUnit: new FormControl<StressUnit>('MPa', { nonNullable: true }),
    lengthUnit: new FormControl<LengthUnit>('mm', { nonNullable: true }),
    forceUnit: new FormControl<ForceUnit>('N', { nonNullable: true }),
  });
  protected readonly units = toSignal<UnitChoice, UnitChoice>(this.unitForm.valueChanges.pipe(map(() => this.unitForm.getRawValue())), {
    initialValue: this.unitForm.getRawValue(),
  });

  protected readonly missing = computed(() => missingRequired(this.mapping()));
  protected readonly doubled = computed(() => doubleMapped(this.mapping()));
  protected readonly unitConflicts = computed(() => unitsStatedByHeaders(this.mapping()).conflicts);
  protected readonly mappedCount = computed(() => TEMPLATE_FIELDS.filter((f) => this.mapping()[f.field]).length);
  protected readonly ignoredHeaders = computed(() => {
    const used = new Set(Object.values(this.mapping()));
    return (this.preview()?.headers ?? []).filter((h) => h !== '' && !used.has(h));
  });

  /** Problems of the preview rows: the browser's checks, then the server's for rows in the preview. */
  protected readonly marked = computed<readonly MarkedProblem[]>(() => {
    const preview = this.preview();
    if (!preview) return [];
    const own = previewProblems(preview.headers, preview.rows, this.mapping()).map((p) => ({ row: p.rowIndex + 2, header: p.header, message: p.message }));
    const server = (this.refusal()?.problems ?? [])
      .filter((p) => p.row !== undefined && p.row <= preview.rows.length + 1)
      .map((p) => ({ row: p.row!, header: p.column ?? null, message: p.message }));
    return [...own, ...server];
  });
  /** Cells (or whole rows) marked in the preview, each counted once. */
  protected readonly previewProblemCount = computed(() => new Set(this.marked().map((p) => `${p.row}|${p.header}`)).size);
  /** The preview rows without the blank lines that end most files. */
  protected readonly previewRows = computed(() => {
    const rows = [...(this.preview()?.rows ?? [])];
    while (rows.length > 0 && rows[rows.length - 1].every((cell) => cell.trim() === '')) rows.pop();
    return rows;
  });

  /** Headers whose suffix states another unit than the one chosen (the server would refuse the mapping). */
  protected readonly contradictions = computed(() => {
    const units = this.units();
    return TEMPLATE_FIELDS.flatMap((field) => {
      const header = this.mapping()[field.field];
      const stated = header ? unitStatedBy(field, header) : null;
      const chosen = field.dimension === 'length' ? units.lengthUnit : field.dimension === 'force' ? units.forceUnit : units.stressUnit;
      return header && stated && stated !== chosen ? [header] : [];
    });
  });

  /** What stops sending: the file itself, or a mapping the server would refuse. */
  protected readonly blockers = computed(() => {
    const preview = this.preview();
    if (!preview) return [];
    return [
      ...preview.fileProblems,
      ...this.missing().map((f) => `No column is chosen for the required field “${f.label}”.`),
      ...this.doubled().map((h) => `The column “${h}” is chosen for two fields.`),
      ...this.unitConflicts().map((h) => `The header “${h}” states a unit that disagrees with another header.`),
      ...this.contradictions().map((h) => `The header “${h}” states another unit than the one chosen below.`),
    ];
  });

  protected async chooseFile(files: FileList | null): Promise<void> {
    const file = files?.item(0) ?? null;
    if (!file) return;
    this.file.set(file);
    this.result.set(null);
    this.refusal.set(null);
    this.readFailure.set(null);
    this.phase.set('reading');
    try {
      const preview = await readFilePreview(file);
      const mapping = guessMapping(preview.headers);
      this.preview.set(preview);
      this.mapping.set(mapping);
      this.presetUnits(mapping);
      this.phase.set('preview');
    } catch (error) {
      this.readFailure.set(`The file could not be read: ${(error as Error).message}`);
      this.phase.set('choose');
    }
  }

  protected onDrop(event: DragEvent): void {
    event.preventDefault();
    void this.chooseFile(event.dataTransfer?.files ?? null);
  }

  protected send(): void {
    const file = this.file();
    if (!file || this.blockers().length > 0) return;
    this.phase.set('sending');
    this.progressPct.set(0);
    this.refusal.set(null);
    this.api.upload(file, mappingForServer(this.mapping()), this.unitForm.getRawValue()).subscribe({
      next: (event) => {
        if (event.type === HttpEventType.UploadProgress) {
          const pct = event.total ? Math.round((100 * event.loaded) / event.total) : 0;
          this.progressPct.set(pct);
          if (pct >= 100) this.phase.set('checking');
        } else if (event.type === HttpEventType.Response && event.body) {
          this.result.set(event.body);
          this.phase.set('stored');
          this.uploadsRefresh.update((n) => n + 1);
        }
      },
      error: (error: unknown) => {
        this.refusal.set(uploadRefusalOf(error));
        this.phase.set('refused');
      },
    });
  }

  protected startAgain(): void {
    this.file.set(null);
    this.preview.set(null);
    this.result.set(null);
    this.refusal.set(null);
    this.phase.set('choose');
  }

  /** Units from the headers' suffixes where they state one, else the person's unit system. */
  private presetUnits(mapping: ColumnMapping): void {
    const stated = unitsStatedByHeaders(mapping);
    const us = this.unitSystem.system() === 'US';
    this.unitForm.setValue({
      stressUnit: stated.stressUnit ?? (us ? 'ksi' : 'MPa'),
      lengthUnit: stated.lengthUnit ?? (us ? 'in' : 'mm'),
      forceUnit: stated.forceUnit ?? (us ? 'lbf' : 'N'),
    });
  }
}
