import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { GroupSummary } from '../../../shared/catalogue/analysis-wire';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';
import { AnalysisGroup } from '../analysis-view/analysis-group';

/** Descriptive statistics (n, mean, SD, CV, min, max) of the group pooled and of each batch. */
@Component({
  selector: 'app-descriptive-table',
  imports: [DecimalPipe, QuantityUnitPipe, QuantityValuePipe],
  templateUrl: './descriptive-table.html',
  styleUrl: './descriptive-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DescriptiveTable {
  readonly group = input.required<AnalysisGroup>();
  readonly quantity = input.required<string>();

  protected readonly rows = computed<readonly { label: string; s: GroupSummary; pooled: boolean }[]>(() => [
    { label: 'All batches', s: this.group().summary, pooled: true },
    ...this.group().byBatch.map((b) => ({ label: `Batch ${b.batch}`, s: b, pooled: false })),
  ]);
}
