import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import { DisplayValuePipe, UnitLabelPipe } from '../../../../../core/units/display-value-pipe';
import { LaminateAnalysis } from '../../../../../shared/laminate/laminate-wire';

/**
 * Membrane and flexural engineering constants, from the full inverse abd as
 * the engine states (laminate free to bend, or to stretch), plus thickness
 * and areal mass.
 */
@Component({
  selector: 'app-engineering-constants',
  imports: [DisplayValuePipe, UnitLabelPipe],
  templateUrl: './engineering-constants.html',
  styleUrl: './engineering-constants.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EngineeringConstants {
  readonly analysis = input.required<LaminateAnalysis>();
}
