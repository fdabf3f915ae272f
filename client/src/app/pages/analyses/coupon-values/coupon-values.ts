import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { DisplayValuePipe, UnitLabelPipe } from '../../../core/units/display-value-pipe';
import { AnalysisCoupon } from '../../../shared/catalogue/analysis-wire';
import { ChainCoupon } from '../../../shared/catalogue/allowable-wire';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';

/**
 * The coupons an analysis was run on, with the value the engine saw (normalised
 * to nominal cured ply thickness where the property is fibre-dominated) beside
 * the measured one; with their status now when shown in an allowable's chain.
 */
@Component({
  selector: 'app-coupon-values',
  imports: [DisplayValuePipe, QuantityUnitPipe, QuantityValuePipe, UnitLabelPipe],
  templateUrl: './coupon-values.html',
  styleUrl: './coupon-values.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CouponValues {
  readonly coupons = input.required<readonly (AnalysisCoupon | ChainCoupon)[]>();
  readonly quantity = input.required<string>();
  /** Indices into `coupons` of flagged outliers. */
  readonly outliers = input<readonly number[]>([]);

  protected readonly flagged = computed(() => new Set(this.outliers()));
  protected readonly withStatus = computed(() => this.coupons().some((c) => 'status' in c));
  protected readonly anyNormalised = computed(() => this.coupons().some((c) => c.normalised));

  protected statusOf(coupon: AnalysisCoupon | ChainCoupon): { status: string | null; reason: string | null } {
    return 'status' in coupon ? { status: coupon.status, reason: coupon.statusReason } : { status: null, reason: null };
  }
}
