import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { ChartConfiguration, ChartDataset } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import { toDisplay, unitLabel } from '../../../core/units/unit-conversion';
import { UnitSystemService } from '../../../core/units/unit-system';
import { FitsReport } from '../../../shared/catalogue/analysis-wire';
import { displayQuantityOf } from '../../../shared/catalogue/quantity-display';
import { SERIES_COLOURS } from '../../../shared/laminate/series-colours';
import { CHART_FONT, provideAnalysisCharts } from './chart-setup';
import { CdfPoint, empiricalCdfSteps, lognormalCdf, normalCdf, sampleCdf, weibullCdf } from './distribution-curves';

/**
 * The empirical distribution of the values (a staircase) with the fitted
 * normal, lognormal and Weibull distributions drawn over it; a fit the
 * Anderson-Darling test rejects (OSL <= 0.05) is dashed.
 */
@Component({
  selector: 'app-distribution-plot',
  imports: [BaseChartDirective],
  providers: [provideAnalysisCharts()],
  templateUrl: './distribution-plot.html',
  styleUrl: './chart.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DistributionPlot {
  private readonly units = inject(UnitSystemService);

  readonly values = input.required<readonly number[]>();
  readonly fits = input.required<FitsReport | null>();
  readonly quantity = input.required<string>();

  protected readonly unit = computed(() => {
    const display = displayQuantityOf(this.quantity());
    return display ? unitLabel(display, this.units.system()) : '';
  });

  protected readonly data = computed<ChartConfiguration<'scatter'>['data']>(() => {
    const display = displayQuantityOf(this.quantity());
    const system = this.units.system();
    const convert = (points: CdfPoint[]) => points.map((p) => ({ x: display ? toDisplay(p.x, display, system) : p.x, y: p.y }));
    const values = this.values();
    const low = Math.min(...values);
    const high = Math.max(...values);
    const margin = (high - low || Math.abs(high) || 1) * 0.25;
    const from = low - margin;
    const to = high + margin;
    const datasets: ChartDataset<'scatter'>[] = [
      { label: 'coupons (empirical)', data: convert(empiricalCdfSteps(values)), showLine: true, pointRadius: 0, borderWidth: 2, borderColor: '#1f2328', backgroundColor: '#1f2328' },
    ];
    const fits = this.fits();
    const curve = (label: string, colour: string, rejected: boolean | null, cdf: (x: number) => number) =>
      datasets.push({
        label: `${label}${rejected ? ' (rejected)' : ''}`,
        data: convert(sampleCdf(cdf, from, to)),
        showLine: true,
        pointRadius: 0,
        borderWidth: 2,
        borderDash: rejected ? [6, 4] : [],
        borderColor: colour,
        backgroundColor: colour,
      });
    if (fits?.normal.mean != null && fits.normal.sd) {
      const { mean, sd } = fits.normal;
      curve('normal', SERIES_COLOURS[0], fits.normal.rejected, (x) => normalCdf(x, mean, sd));
    }
    if (fits?.lognormal.mu != null && fits.lognormal.sigma) {
      const { mu, sigma } = fits.lognormal;
      curve('lognormal', SERIES_COLOURS[1], fits.lognormal.rejected, (x) => lognormalCdf(x, mu, sigma));
    }
    if (fits?.weibull.shape && fits.weibull.scale) {
      const { shape, scale } = fits.weibull;
      curve('Weibull', SERIES_COLOURS[2], fits.weibull.rejected, (x) => weibullCdf(x, shape, scale));
    }
    return { datasets };
  });

  protected readonly options = computed<ChartConfiguration<'scatter'>['options']>(() => {
    const unit = this.unit();
    return {
      animation: false,
      maintainAspectRatio: false,
      plugins: { legend: { position: 'bottom', labels: { font: CHART_FONT } }, tooltip: { enabled: false } },
      scales: {
        x: { title: { display: true, text: unit ? `value (${unit})` : 'value', font: CHART_FONT }, ticks: { font: CHART_FONT } },
        y: { min: 0, max: 1, title: { display: true, text: 'proportion at or below', font: CHART_FONT }, ticks: { font: CHART_FONT } },
      },
    };
  });
}
