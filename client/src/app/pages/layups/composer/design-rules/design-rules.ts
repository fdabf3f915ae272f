import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { RuleCheck } from '../../../../shared/laminate/laminate-wire';

/** Plain names of the engine's design rules (common practice; reported, never enforced). */
const RULE_NAMES: Readonly<Record<string, string>> = {
  symmetric: 'Symmetric about the mid-plane',
  balanced: 'Balanced (+θ matched by −θ)',
  'ten-percent-rule': 'At least 10 % of plies at each of 0°, ±45°, 90°',
  'max-four-adjacent': 'No more than 4 adjacent plies of one angle',
  'outer-plies-45': '±45° plies on the outer surfaces',
};

/** The design-rule checklist: what holds, what does not and why. */
@Component({
  selector: 'app-design-rules',
  imports: [MatIconModule],
  templateUrl: './design-rules.html',
  styleUrl: './design-rules.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignRules {
  readonly rules = input.required<readonly RuleCheck[]>();

  protected readonly items = computed(() =>
    this.rules().map((rule) => ({ ...rule, name: RULE_NAMES[rule.rule] ?? rule.rule })),
  );
  protected readonly passed = computed(() => this.rules().filter((r) => r.pass).length);
}
