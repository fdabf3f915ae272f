import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { ChartConfiguration } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import { toDisplay, unitLabel } from '../../../../../core/units/unit-conversion';
import { UnitSystemService } from '../../../../../core/units/unit-system';
import { PolarStiffness } from '../../../../../shared/laminate/laminate-wire';
import { roundAxisLimit, SERIES_COLOURS } from '../../../../../shared/laminate/series-colours';

/**
 * Ex, Ey and Gxy of the laminate turned by θ about its normal, drawn as
 * polar curves r(θ): a stiffness that does not depend on θ is a circle.
 * The engine sends 0–180°; a fibre at θ + 180° is the same, so the curve
 * is completed by symmetry.
 */
@Component({
  selector: 'app-polar-plot',
  imports: [BaseChartDirective],
  templateUrl: './polar-plot.html',
  styleUrl: './polar-plot.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PolarPlot {
  private readonly units = inject(UnitSystemService);

  readonly polar = input.required<PolarStiffness>();

  protected readonly unit = computed(() => unitLabel('modulus', this.units.system()));

  protected readonly data = computed<ChartConfiguration<'scatter'>['data']>(() => {
    const system = this.units.system();
    const points = this.polar().points;
    const curve = (pick: (p: (typeof points)[number]) => number) => {
      const half = points.map((p) => ({ angle: p.angleDeg, r: toDisplay(pick(p), 'modulus', system) }));
      const full = [...half, ...half.map((p) => ({ angle: p.angle + 180, r: p.r }))];
      return full.map(({ angle, r }) => ({
        x: r * Math.cos((angle * Math.PI) / 180),
        y: r * Math.sin((angle * Math.PI) / 180),
      }));
    };
    const series = (label: string, colour: string, pick: (p: (typeof points)[number]) => number, dash: number[] = []) => ({
      label,
      data: curve(pick),
      showLine: true,
      borderColor: colour,
      backgroundColor: colour,
      borderWidth: 2,
      borderDash: dash,
      pointRadius: 0,
    });
    return {
      datasets: [
        series('Ex', SERIES_COLOURS[0], (p) => p.Ex),
        // Dashed: on a quasi-isotropic laminate it lies on Ex.
        series('Ey', SERIES_COLOURS[1], (p) => p.Ey, [6, 5]),
        series('Gxy', SERIES_COLOURS[2], (p) => p.Gxy),
      ],
    };
  });

  protected readonly options = computed<ChartConfiguration<'scatter'>['options']>(() => {
    const largest = Math.max(
      1e-9,
      ...this.data().datasets.flatMap((d) => d.data.map((p) => Math.hypot((p as { x: number }).x, (p as { y: number }).y))),
    );
    const limit = roundAxisLimit(largest * 1.04);
    const unit = this.unit();
    return {
      animation: false,
      aspectRatio: 1,
      maintainAspectRatio: true,
      plugins: {
        legend: { position: 'bottom', labels: { usePointStyle: true, pointStyle: 'line' } },
        tooltip: { enabled: false },
      },
      scales: {
        x: { min: -limit, max: limit, title: { display: true, text: `along x (${unit})` }, ticks: { stepSize: limit / 2 } },
        y: { min: -limit, max: limit, title: { display: true, text: `along y (${unit})` }, ticks: { stepSize: limit / 2 } },
      },
    };
  });
}
