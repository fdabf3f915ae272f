import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { formatSignificant } from '../../../core/units/number-format';
import { AnalysisDetail, FitReport } from '../../../shared/catalogue/analysis-wire';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';
import { AnalysisGroup } from '../analysis-view/analysis-group';

interface FitRow {
  readonly name: string;
  readonly parameters: string;
  readonly fit: FitReport;
  readonly note: string | null;
}

/**
 * The diagnostics behind the basis values (ENGINEERING.md section 2): batch
 * equivalence by the k-sample Anderson-Darling test, outliers by the maximum
 * normed residual test, goodness of fit with observed significance levels,
 * the nonparametric and ANOVA values, and for several conditions Levene's test
 * and the pooled residuals.
 */
@Component({
  selector: 'app-diagnostics',
  imports: [QuantityUnitPipe, QuantityValuePipe],
  templateUrl: './diagnostics.html',
  styleUrl: './diagnostics.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Diagnostics {
  readonly analysis = input.required<AnalysisDetail>();
  readonly group = input.required<AnalysisGroup>();

  protected readonly num = (value: number | null | undefined, digits = 4) => formatSignificant(value, digits);

  protected readonly outlierTests = computed(() => {
    const condition = this.group().condition;
    return this.analysis().result.outlierTests.filter((t) => condition === null || t.condition === undefined || t.condition === condition);
  });

  protected readonly outliers = computed(() => {
    const { coupons, result } = this.analysis();
    const condition = this.group().condition;
    return result.outliers
      .filter((o) => condition === null || o.condition === undefined || o.condition === condition)
      .map((o) => ({ ...o, specimenCode: coupons[o.index]?.specimenCode ?? `value ${o.index + 1}` }));
  });

  protected readonly fitRows = computed<readonly FitRow[]>(() => {
    const fits = this.group().fits;
    if (!fits) return [];
    return [
      { name: 'Weibull (two-parameter)', parameters: `shape ${this.num(fits.weibull.shape)}, scale ${this.num(fits.weibull.scale)}`, fit: fits.weibull, note: fits.weibull.reason ?? null },
      { name: 'Normal', parameters: `mean ${this.num(fits.normal.mean)}, SD ${this.num(fits.normal.sd)}`, fit: fits.normal, note: null },
      { name: 'Lognormal', parameters: `μ ${this.num(fits.lognormal.mu)}, σ ${this.num(fits.lognormal.sigma)} (of ln x)`, fit: fits.lognormal, note: fits.lognormal.reason ?? null },
    ];
  });

  protected readonly weibullApproximate = computed(() => this.group().fits?.weibull ?? null);
  protected readonly pooling = computed(() => {
    const r = this.analysis().result;
    return this.analysis().conditions.length > 1 ? { levene: r.levene ?? null, pooled: r.pooled ?? null } : null;
  });

  protected verdict(fit: FitReport): string {
    if (fit.rejected === null) return 'not tested';
    return fit.rejected ? 'rejected (OSL ≤ 0.05)' : 'not rejected';
  }
}
