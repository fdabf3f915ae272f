import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { ChartConfiguration } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import { toDisplay, unitLabel } from '../../../../../core/units/unit-conversion';
import { UnitSystemService } from '../../../../../core/units/unit-system';
import { PlyResult } from '../../../../../shared/laminate/laminate-wire';
import { SERIES_COLOURS } from '../../../../../shared/laminate/series-colours';

type Axes = 'ply' | 'laminate';

const LABELS: Readonly<Record<Axes, string[]>> = { ply: ['σ1', 'σ2', 'τ12'], laminate: ['σx', 'σy', 'τxy'] };

/**
 * Stress against z through the thickness: within a ply it varies linearly
 * (bending), at an interface it jumps because the stiffness does.
 */
@Component({
  selector: 'app-stress-plot',
  imports: [BaseChartDirective, MatButtonToggleModule],
  templateUrl: './stress-plot.html',
  styleUrl: './stress-plot.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StressPlot {
  private readonly units = inject(UnitSystemService);

  readonly plies = input.required<readonly PlyResult[]>();

  protected readonly axes = signal<Axes>('laminate');

  protected readonly data = computed<ChartConfiguration<'scatter'>['data']>(() => {
    const system = this.units.system();
    const axes = this.axes();
    const plies = this.plies();
    return {
      datasets: LABELS[axes].map((label, k) => ({
        label,
        data: plies.flatMap((ply) => {
          const pick = (surface: 'bottom' | 'top') =>
            (axes === 'ply' ? ply[surface].stressPly : ply[surface].stressLaminate)[k];
          return [
            { x: toDisplay(pick('bottom'), 'stress', system), y: toDisplay(ply.zBottom, 'length', system) },
            { x: toDisplay(pick('top'), 'stress', system), y: toDisplay(ply.zTop, 'length', system) },
          ];
        }),
        showLine: true,
        borderColor: SERIES_COLOURS[k],
        backgroundColor: SERIES_COLOURS[k],
        borderWidth: 2,
        pointRadius: plies.length > 40 ? 0 : 2,
      })),
    };
  });

  protected readonly options = computed<ChartConfiguration<'scatter'>['options']>(() => {
    const system = this.units.system();
    return {
      animation: false,
      aspectRatio: 1.3,
      plugins: { legend: { position: 'bottom', labels: { usePointStyle: true, pointStyle: 'line' } }, tooltip: { enabled: false } },
      scales: {
        x: { title: { display: true, text: `stress (${unitLabel('stress', system)})` } },
        y: { title: { display: true, text: `z (${unitLabel('length', system)})` } },
      },
    };
  });
}
