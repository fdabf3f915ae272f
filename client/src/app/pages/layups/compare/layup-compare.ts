import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { catchError, combineLatest, map, of, startWith, switchMap } from 'rxjs';

import { formatMargin, formatSignificant } from '../../../core/units/number-format';
import { Quantity, toDisplay, unitLabel } from '../../../core/units/unit-conversion';
import { UnitSystemService } from '../../../core/units/unit-system';
import { EngineeringCaution } from '../../../shared/engineering-caution/engineering-caution';
import { ImpactBanner } from '../../../shared/impact-banner/impact-banner';
import { apiFailureOf } from '../../../shared/laminate/api-problem';
import { CRITERION_LABELS, CriterionName } from '../../../shared/laminate/laminate-wire';
import { MatrixDisplay } from '../../../shared/matrix-display/matrix-display';
import { LayupApi } from '../data/layup-api';
import { Comparison, ComparisonSide } from '../data/layup-wire';
import { RevisionPick } from './revision-pick';

const CONSTANT_ROWS: readonly { label: string; quantity: Quantity; pick: (s: ComparisonSide) => number }[] = [
  { label: 'Thickness', quantity: 'length', pick: (s) => s.thicknessMm },
  { label: 'Areal mass', quantity: 'arealMass', pick: (s) => s.arealMass },
  { label: 'Ex (membrane)', quantity: 'modulus', pick: (s) => s.membrane.Ex },
  { label: 'Ey (membrane)', quantity: 'modulus', pick: (s) => s.membrane.Ey },
  { label: 'Gxy (membrane)', quantity: 'modulus', pick: (s) => s.membrane.Gxy },
  { label: 'Ex (flexural)', quantity: 'modulus', pick: (s) => s.flexural.Ex },
  { label: 'Ey (flexural)', quantity: 'modulus', pick: (s) => s.flexural.Ey },
  { label: 'Gxy (flexural)', quantity: 'modulus', pick: (s) => s.flexural.Gxy },
];

/** Two layup revisions side by side: stiffness, and first-ply failure under one load case. */
@Component({
  selector: 'app-layup-compare',
  imports: [EngineeringCaution, ImpactBanner, MatIconModule, MatProgressBarModule, MatrixDisplay, RevisionPick, RouterLink],
  templateUrl: './layup-compare.html',
  styleUrl: './layup-compare.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LayupCompare {
  private readonly api = inject(LayupApi);
  private readonly router = inject(Router);
  private readonly units = inject(UnitSystemService);

  /** Revision ids from ?a=&b=. */
  readonly a = input<string>();
  readonly b = input<string>();

  protected readonly layups = toSignal(this.api.list().pipe(catchError(() => of([]))), { initialValue: [] });

  protected readonly result = toSignal(
    combineLatest([toObservable(this.a), toObservable(this.b)]).pipe(
      switchMap(([a, b]) =>
        a && b
          ? this.api.compare(Number(a), Number(b)).pipe(
              map((comparison) => ({ loading: false, comparison, failure: null })),
              catchError((error: unknown) => of({ loading: false, comparison: null, failure: apiFailureOf(error) })),
              startWith({ loading: true, comparison: null as Comparison | null, failure: null }),
            )
          : of({ loading: false, comparison: null, failure: null }),
      ),
    ),
    { initialValue: { loading: false, comparison: null, failure: null } },
  );

  protected readonly constants = computed(() => {
    const comparison = this.result().comparison;
    if (!comparison) return [];
    const system = this.units.system();
    return CONSTANT_ROWS.map((row) => {
      const a = row.pick(comparison.a);
      const b = row.pick(comparison.b);
      return {
        label: row.label,
        unit: unitLabel(row.quantity, system),
        a: formatSignificant(toDisplay(a, row.quantity, system), 4),
        b: formatSignificant(toDisplay(b, row.quantity, system), 4),
        change: a !== 0 ? `${b >= a ? '+' : ''}${(((b - a) / a) * 100).toFixed(1)} %` : '–',
      };
    });
  });

  protected readonly firstPly = computed(() => {
    const comparison = this.result().comparison;
    if (!comparison?.loads) return [];
    return comparison.criteria.map((criterion: CriterionName) => {
      const side = (s: ComparisonSide) => {
        const f = s.firstPlyFailure?.[criterion];
        return f && f.ply !== null
          ? { text: `ply ${f.ply + 1} (${f.surface}), ${f.mode}`, margin: formatMargin(f.marginOfSafety), negative: (f.marginOfSafety ?? 0) < 0 }
          : { text: 'no ply fails', margin: '–', negative: false };
      };
      return { criterion, label: CRITERION_LABELS[criterion], a: side(comparison.a), b: side(comparison.b) };
    });
  });

  protected pick(which: 'a' | 'b', revisionId: number): void {
    void this.router.navigate([], { queryParams: { [which]: revisionId }, queryParamsHandling: 'merge' });
  }

  /** Round-off in B is judged against |A|max · h, as in the composer. */
  protected couplingScale(side: ComparisonSide): number {
    return Math.max(...side.A.flat().map(Math.abs)) * side.thicknessMm;
  }

  protected sideLayupId(side: 'a' | 'b'): number | null {
    return this.result().comparison?.[side].layupId ?? null;
  }
}
