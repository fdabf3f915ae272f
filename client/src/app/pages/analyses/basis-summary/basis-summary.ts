import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { DisplayValuePipe, UnitLabelPipe } from '../../../core/units/display-value-pipe';
import { AnalysisDetail, METHOD_LABELS } from '../../../shared/catalogue/analysis-wire';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';
import { conditionCodes } from '../analysis-view/analysis-group';

/**
 * The outcome of an analysis: the method used (and who chose it), both basis
 * values with the provisional flag and its reasons, the decision steps, and
 * for several conditions one line per condition.
 */
@Component({
  selector: 'app-basis-summary',
  imports: [DisplayValuePipe, MatIconModule, QuantityUnitPipe, QuantityValuePipe, UnitLabelPipe],
  templateUrl: './basis-summary.html',
  styleUrl: './basis-summary.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BasisSummary {
  readonly analysis = input.required<AnalysisDetail>();

  protected readonly methodLabels = METHOD_LABELS;
  protected readonly result = computed(() => this.analysis().result);
  protected readonly overridden = computed(() => this.analysis().methodRequested !== 'auto');
  /** Warnings other than the provisional ones, which the box above the decision already lists. */
  protected readonly warnings = computed(() => this.result().warnings.filter((w) => !/\bis provisional\b/.test(w)));
  protected readonly perCondition = computed(() => {
    const result = this.result();
    const codes = conditionCodes(this.analysis());
    if (codes.length < 2 || !result.byCondition) return [];
    return codes.map((code) => ({ code, report: result.byCondition![code] })).filter((c) => c.report);
  });
}
