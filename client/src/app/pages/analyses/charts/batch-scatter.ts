import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { ChartConfiguration, ChartDataset } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import { toDisplay, unitLabel } from '../../../core/units/unit-conversion';
import { UnitSystemService } from '../../../core/units/unit-system';
import { AnalysisCoupon } from '../../../shared/catalogue/analysis-wire';
import { displayQuantityOf } from '../../../shared/catalogue/quantity-display';
import { SERIES_COLOURS } from '../../../shared/laminate/series-colours';
import { CHART_FONT, provideAnalysisCharts } from './chart-setup';

const OUTLIER_COLOUR = '#b0413e';
type Point = { x: number; y: number; code: string };

/**
 * Every coupon value of the analysis by batch (spread sideways within a batch
 * so equal values stay visible), coloured by condition, with the flagged
 * outliers marked and the basis values drawn across.
 */
@Component({
  selector: 'app-batch-scatter',
  imports: [BaseChartDirective],
  providers: [provideAnalysisCharts()],
  templateUrl: './batch-scatter.html',
  styleUrl: './chart.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BatchScatter {
  private readonly units = inject(UnitSystemService);

  readonly coupons = input.required<readonly AnalysisCoupon[]>();
  readonly quantity = input.required<string>();
  /** Indices into `coupons` of the values the MNR test flagged. */
  readonly outliers = input<readonly number[]>([]);
  readonly basisLines = input<readonly { label: string; value: number | null }[]>([]);

  private readonly convert = computed(() => {
    const display = displayQuantityOf(this.quantity());
    const system = this.units.system();
    return (v: number) => (display ? toDisplay(v, display, system) : v);
  });
  protected readonly unit = computed(() => {
    const display = displayQuantityOf(this.quantity());
    return display ? unitLabel(display, this.units.system()) : '';
  });
  private readonly batches = computed(() => [...new Set(this.coupons().map((c) => c.batch))]);

  protected readonly data = computed<ChartConfiguration<'scatter', Point[]>['data']>(() => {
    const coupons = this.coupons();
    const conditions = [...new Set(coupons.map((c) => c.condition))];
    const batches = this.batches();
    const convert = this.convert();
    const flagged = new Set(this.outliers());
    const groupWidth = 0.7 / conditions.length;
    const datasets: ChartDataset<'scatter', Point[]>[] = conditions.map((condition, ci) => {
      const points: Point[] = [];
      batches.forEach((batch, bi) => {
        const inGroup = coupons.map((c, index) => ({ c, index })).filter(({ c, index }) => c.batch === batch && c.condition === condition && !flagged.has(index));
        const centre = bi + 1 - 0.35 + groupWidth * (ci + 0.5);
        inGroup.forEach(({ c }, k) => {
          const spread = inGroup.length > 1 ? (k / (inGroup.length - 1) - 0.5) * groupWidth * 0.7 : 0;
          points.push({ x: centre + spread, y: convert(c.value), code: c.specimenCode });
        });
      });
      const colour = SERIES_COLOURS[ci % SERIES_COLOURS.length];
      return { label: condition, data: points, backgroundColor: colour, borderColor: colour, pointRadius: 3.5 };
    });
    const outlierPoints = [...flagged].flatMap((index) => {
      const c = coupons[index];
      return c ? [{ x: batches.indexOf(c.batch) + 1, y: convert(c.value), code: c.specimenCode }] : [];
    });
    if (outlierPoints.length > 0) {
      datasets.push({ label: 'flagged outlier', data: outlierPoints, pointStyle: 'triangle', pointRadius: 7, backgroundColor: OUTLIER_COLOUR, borderColor: OUTLIER_COLOUR });
    }
    this.basisLines().forEach((line, li) => {
      if (line.value === null) return;
      const y = convert(line.value);
      datasets.push({
        label: line.label,
        data: [{ x: 0.5, y, code: '' }, { x: batches.length + 0.5, y, code: '' }],
        showLine: true,
        pointRadius: 0,
        borderWidth: 2,
        borderDash: li === 0 ? [6, 4] : [2, 3],
        borderColor: SERIES_COLOURS[4 - li] ?? SERIES_COLOURS[4],
        backgroundColor: SERIES_COLOURS[4 - li] ?? SERIES_COLOURS[4],
      });
    });
    return { datasets };
  });

  protected readonly options = computed<ChartConfiguration<'scatter', Point[]>['options']>(() => {
    const batches = this.batches();
    const unit = this.unit();
    return {
      animation: false,
      maintainAspectRatio: false,
      plugins: {
        legend: { position: 'bottom', labels: { usePointStyle: true, font: CHART_FONT } },
        tooltip: {
          callbacks: { label: (item) => `${(item.raw as Point).code || item.dataset.label}: ${item.parsed.y?.toPrecision(4)} ${unit}` },
        },
      },
      scales: {
        x: {
          min: 0.5,
          max: batches.length + 0.5,
          title: { display: true, text: 'batch', font: CHART_FONT },
          // one tick per batch, at its centre, labelled with its code
          afterBuildTicks: (axis) => {
            axis.ticks = batches.map((_, i) => ({ value: i + 1 }));
          },
          ticks: { font: CHART_FONT, callback: (value) => batches[Number(value) - 1] ?? '' },
          grid: { display: false },
        },
        y: { title: { display: true, text: unit ? `value (${unit})` : 'value', font: CHART_FONT }, ticks: { font: CHART_FONT } },
      },
    };
  });
}
