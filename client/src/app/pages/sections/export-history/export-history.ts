import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { ExportSummary, FORMAT_LABELS } from '../data/export-wire';

/** The exports recorded for a layup revision, newest first, each downloadable again. */
@Component({
  selector: 'app-export-history',
  imports: [DatePipe, MatIconModule],
  templateUrl: './export-history.html',
  styleUrl: './export-history.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ExportHistory {
  readonly exports = input.required<readonly ExportSummary[]>();

  protected readonly formatLabels = FORMAT_LABELS;
}
