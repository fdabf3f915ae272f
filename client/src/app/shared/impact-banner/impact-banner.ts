import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { Impact } from './impact';

/**
 * The warning on a layup revision or an export that was computed on an
 * allowable since superseded or rejected (PRODUCT.md, "Impact"): which
 * allowables, which ply fields, and where the replacement is.
 */
@Component({
  selector: 'app-impact-banner',
  imports: [MatIconModule, RouterLink],
  templateUrl: './impact-banner.html',
  styleUrl: './impact-banner.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ImpactBanner {
  readonly impact = input.required<readonly Impact[]>();
  /** What carries the impact, for the sentence: "layup revision", "export". */
  readonly subject = input('layup revision');

  protected readonly entries = computed(() =>
    this.impact().map((entry) => ({
      ...entry,
      what: [entry.materialCode, entry.propertyCode, entry.conditionCode, entry.basis ? `${entry.basis}-basis` : null]
        .filter(Boolean)
        .join(' '),
    })),
  );
}
