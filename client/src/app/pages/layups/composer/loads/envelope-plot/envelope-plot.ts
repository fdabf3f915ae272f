import { ChangeDetectionStrategy, Component, computed, inject, input, model } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { ChartConfiguration } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import { toDisplay, unitLabel } from '../../../../../core/units/unit-conversion';
import { UnitSystemService } from '../../../../../core/units/unit-system';
import { CRITERION_LABELS, CriterionName, EnvelopeAxes, FailureEnvelope } from '../../../../../shared/laminate/laminate-wire';
import { SERIES_COLOURS } from '../../../../../shared/laminate/series-colours';
import { EnvelopeSettings } from '../../live-plots';

/**
 * The first-ply failure envelope in (Nx, Ny) or (Nx, Nxy): for each load
 * direction, the line load at which the first ply fails by one criterion,
 * with the applied load marked.
 */
@Component({
  selector: 'app-envelope-plot',
  imports: [BaseChartDirective, MatButtonToggleModule, MatFormFieldModule, MatSelectModule],
  templateUrl: './envelope-plot.html',
  styleUrl: './envelope-plot.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EnvelopePlot {
  private readonly units = inject(UnitSystemService);

  readonly envelope = input.required<FailureEnvelope | null>();
  readonly loading = input(false);
  readonly criteria = input.required<readonly CriterionName[]>();
  /** The applied [Nx, Ny, Nxy], N/mm. */
  readonly appliedN = input.required<readonly number[]>();
  readonly settings = model.required<EnvelopeSettings>();

  protected readonly labels = CRITERION_LABELS;
  protected readonly unit = computed(() => unitLabel('lineLoad', this.units.system()));
  protected readonly secondAxis = computed(() => (this.settings().axes === 'Nx-Ny' ? 'Ny' : 'Nxy'));

  protected readonly data = computed<ChartConfiguration<'scatter'>['data']>(() => {
    const system = this.units.system();
    const envelope = this.envelope();
    const show = (v: number) => toDisplay(v, 'lineLoad', system);
    const points = (envelope?.points ?? []).flatMap((p) => (p.N ? [{ x: show(p.N[0]), y: show(p.N[1]) }] : []));
    const applied = this.appliedN();
    const second = this.settings().axes === 'Nx-Ny' ? applied[1] : applied[2];
    return {
      datasets: [
        {
          label: envelope ? `${CRITERION_LABELS[envelope.criterion]} first-ply failure` : 'first-ply failure',
          data: points.length ? [...points, points[0]] : [],
          showLine: true,
          borderColor: SERIES_COLOURS[0],
          backgroundColor: 'rgba(26, 104, 114, 0.12)',
          fill: true,
          borderWidth: 2,
          pointRadius: 0,
        },
        {
          label: 'applied load',
          data: [{ x: show(applied[0]), y: show(second) }],
          borderColor: SERIES_COLOURS[5],
          backgroundColor: SERIES_COLOURS[5],
          pointRadius: 5,
          pointStyle: 'crossRot',
          borderWidth: 2,
        },
      ],
    };
  });

  protected readonly options = computed<ChartConfiguration<'scatter'>['options']>(() => {
    const unit = this.unit();
    return {
      animation: false,
      aspectRatio: 1,
      plugins: { legend: { position: 'bottom' }, tooltip: { enabled: false } },
      scales: {
        x: { title: { display: true, text: `Nx (${unit})` } },
        y: { title: { display: true, text: `${this.secondAxis()} (${unit})` } },
      },
    };
  });

  protected setCriterion(criterion: CriterionName): void {
    this.settings.update((s) => ({ ...s, criterion }));
  }

  protected setAxes(axes: EnvelopeAxes): void {
    this.settings.update((s) => ({ ...s, axes }));
  }
}
