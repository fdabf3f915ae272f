import { ChangeDetectionStrategy, Component, computed, input, linkedSignal } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatExpansionModule } from '@angular/material/expansion';

import { AnalysisDetail } from '../../../shared/catalogue/analysis-wire';
import { ChainCoupon } from '../../../shared/catalogue/allowable-wire';
import { BasisSummary } from '../basis-summary/basis-summary';
import { BatchScatter } from '../charts/batch-scatter';
import { DistributionPlot } from '../charts/distribution-plot';
import { CouponValues } from '../coupon-values/coupon-values';
import { DescriptiveTable } from '../descriptive-table/descriptive-table';
import { Diagnostics } from '../diagnostics/diagnostics';
import { analysisGroup, conditionCodes } from './analysis-group';

/**
 * A stored analysis, read-only: basis values and method, the per-batch scatter
 * and the distribution with its fits, descriptive statistics, diagnostics and
 * the coupons. The analysis page, the review page and the allowable page show it.
 */
@Component({
  selector: 'app-analysis-view',
  imports: [BasisSummary, BatchScatter, CouponValues, DescriptiveTable, Diagnostics, DistributionPlot, MatButtonToggleModule, MatExpansionModule],
  templateUrl: './analysis-view.html',
  styleUrl: './analysis-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AnalysisView {
  readonly analysis = input.required<AnalysisDetail>();
  /** The coupons with their status now (an allowable's chain); else the analysis's own. */
  readonly chainCoupons = input<readonly ChainCoupon[] | null>(null);
  /** Open on this condition (an allowable's), when the analysis has several. */
  readonly initialCondition = input<string | null>(null);

  protected readonly conditions = computed(() => conditionCodes(this.analysis()));
  protected readonly several = computed(() => this.conditions().length > 1);
  protected readonly condition = linkedSignal(() => {
    if (!this.several()) return null;
    const wanted = this.initialCondition();
    return wanted && this.conditions().includes(wanted) ? wanted : this.conditions()[0];
  });

  protected readonly group = computed(() => analysisGroup(this.analysis(), this.condition()));
  protected readonly groupCoupons = computed(() => this.group().couponIndices.map((i) => this.analysis().coupons[i]));
  protected readonly groupValues = computed(() => this.groupCoupons().map((c) => c.value));

  /** Outlier indices re-counted within the group's coupons, for the scatter. */
  protected readonly groupOutliers = computed(() => {
    const position = new Map(this.group().couponIndices.map((index, k) => [index, k]));
    const condition = this.condition();
    return this.analysis()
      .result.outliers.filter((o) => condition === null || o.condition === undefined || o.condition === condition)
      .flatMap((o) => (position.has(o.index) ? [position.get(o.index)!] : []));
  });
  protected readonly allOutliers = computed(() => this.analysis().result.outliers.map((o) => o.index));

  protected readonly basisLines = computed(() => [
    { label: 'B-basis', value: this.group().bBasis },
    { label: 'A-basis', value: this.group().aBasis },
  ]);
  protected readonly couponsShown = computed(() => this.chainCoupons() ?? this.analysis().coupons);
}
