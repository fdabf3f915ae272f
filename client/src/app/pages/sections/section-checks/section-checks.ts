import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { DisplayValuePipe, UnitLabelPipe } from '../../../core/units/display-value-pipe';
import { ExportPreview, PlateCheckResult, StripCheckResult } from '../data/export-wire';

/**
 * The strip cantilever and simply supported plate checks of the section,
 * each by two methods, so an analyst sees the stiffness behaves before the
 * file goes into a model.
 */
@Component({
  selector: 'app-section-checks',
  imports: [DisplayValuePipe, UnitLabelPipe],
  templateUrl: './section-checks.html',
  styleUrl: './section-checks.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SectionChecks {
  readonly checks = input.required<ExportPreview['checks']>();

  protected readonly strip = computed(() => {
    const strip = this.checks().strip;
    return 'error' in strip ? { error: strip.error, result: null } : { error: null, result: strip as StripCheckResult };
  });

  protected readonly plate = computed(() => {
    const plate = this.checks().plate;
    return 'error' in plate ? { error: plate.error, result: null } : { error: null, result: plate as PlateCheckResult };
  });
}
