import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';

import { LaminateAnalysis, PolarStiffness } from '../../../../shared/laminate/laminate-wire';
import { PlotState } from '../live-plots';
import { AbdMatrices } from './abd-matrices/abd-matrices';
import { EngineeringConstants } from './engineering-constants/engineering-constants';
import { PolarPlot } from './polar-plot/polar-plot';

/** Stiffness of the laminate: ABD and H, engineering constants and the polar plot. */
@Component({
  selector: 'app-stiffness-panel',
  imports: [AbdMatrices, EngineeringConstants, MatProgressSpinnerModule, PolarPlot],
  templateUrl: './stiffness-panel.html',
  styleUrl: './stiffness-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StiffnessPanel {
  readonly analysis = input.required<LaminateAnalysis>();
  readonly polar = input.required<PlotState<PolarStiffness>>();
}
