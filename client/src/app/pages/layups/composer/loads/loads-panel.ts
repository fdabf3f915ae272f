import { ChangeDetectionStrategy, Component, input, model } from '@angular/core';

import { EngineeringCaution } from '../../../../shared/engineering-caution/engineering-caution';
import { FailureEnvelope, LaminateAnalysis } from '../../../../shared/laminate/laminate-wire';
import { EnvelopeSettings, PlotState } from '../live-plots';
import { EnvelopePlot } from './envelope-plot/envelope-plot';
import { FailureTable } from './failure-table/failure-table';
import { LoadSettings } from './load-settings';
import { LoadsForm } from './loads-form/loads-form';
import { PlyStressTable } from './ply-stress-table/ply-stress-table';
import { StressPlot } from './stress-plot/stress-plot';

/** Loads in; ply stresses, failure indices, margins, first-ply failure and the envelope out. */
@Component({
  selector: 'app-loads-panel',
  imports: [EngineeringCaution, EnvelopePlot, FailureTable, LoadsForm, PlyStressTable, StressPlot],
  templateUrl: './loads-panel.html',
  styleUrl: './loads-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadsPanel {
  readonly settings = model.required<LoadSettings>();
  readonly analysis = input.required<LaminateAnalysis | null>();
  readonly envelope = input.required<PlotState<FailureEnvelope>>();
  readonly envelopeSettings = model.required<EnvelopeSettings>();
}
