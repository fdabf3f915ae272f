import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { ApiFailure } from '../laminate/api-problem';

/**
 * A refusal of the API shown where the person acted: the message, then each
 * problem with the field it names and the fix the API suggests.
 */
@Component({
  selector: 'app-problem-list',
  imports: [MatIconModule],
  templateUrl: './problem-list.html',
  styleUrl: './problem-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProblemList {
  readonly failure = input.required<ApiFailure>();
  /** Plain names of fields, where the API's names would puzzle a person. */
  readonly fieldLabels = input<Readonly<Partial<Record<string, string>>>>({});
}
