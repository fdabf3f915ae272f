import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { formatMargin, formatSignificant } from '../../../../../core/units/number-format';
import { CRITERION_LABELS, CriterionName, LaminateAnalysis } from '../../../../../shared/laminate/laminate-wire';
import { formatAngle } from '../../../../../shared/laminate/ply-angles';
import { marginOfSafety } from '../load-settings';

/**
 * First-ply failure per criterion, then the failure index and margin of
 * safety of every ply by every criterion (the worse surface of the ply).
 */
@Component({
  selector: 'app-failure-table',
  templateUrl: './failure-table.html',
  styleUrl: './failure-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FailureTable {
  readonly analysis = input.required<LaminateAnalysis>();
  readonly factorOfSafety = input.required<number>();

  protected readonly criteria = computed(() => {
    const first = this.analysis().firstPlyFailure ?? {};
    return (Object.keys(first) as CriterionName[]).map((criterion) => ({ criterion, label: CRITERION_LABELS[criterion] }));
  });

  protected readonly firstPly = computed(() => {
    const first = this.analysis().firstPlyFailure ?? {};
    return this.criteria().map(({ criterion, label }) => {
      const f = first[criterion]!;
      return {
        criterion,
        label,
        found: f.ply !== null,
        ply: f.ply === null ? null : f.ply + 1,
        surface: f.surface,
        mode: f.mode ?? '',
        ratio: formatSignificant(f.strengthRatio, 4),
        margin: formatMargin(f.marginOfSafety),
        negative: (f.marginOfSafety ?? 0) < 0,
      };
    });
  });

  protected readonly rows = computed(() => {
    const analysis = this.analysis();
    const fos = this.factorOfSafety();
    const criteria = this.criteria();
    const firstPlies = new Map(criteria.map(({ criterion }) => [criterion, analysis.firstPlyFailure?.[criterion]?.ply ?? null]));
    return [...analysis.plies].reverse().map((ply) => ({
      index: ply.index,
      ply: ply.index + 1,
      angle: formatAngle(ply.thetaDeg),
      cells: criteria.map(({ criterion }) => {
        const result = ply.failure?.[criterion];
        const margin = marginOfSafety(result?.strengthRatio ?? null, fos);
        return {
          criterion,
          index: formatSignificant(result?.index, 3),
          margin: formatMargin(margin),
          negative: margin !== null && margin < 0,
          first: firstPlies.get(criterion) === ply.index,
          mode: result?.mode ?? '',
        };
      }),
    }));
  });
}
