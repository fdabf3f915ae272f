import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';

import { formatSignificant, withoutRoundOff } from '../../../../../core/units/number-format';
import { toDisplay, unitLabel } from '../../../../../core/units/unit-conversion';
import { UnitSystemService } from '../../../../../core/units/unit-system';
import { PlyResult, Surface } from '../../../../../shared/laminate/laminate-wire';
import { formatAngle } from '../../../../../shared/laminate/ply-angles';

type Axes = 'ply' | 'laminate';

const HEADINGS: Readonly<Record<Axes, { stress: string[]; strain: string[] }>> = {
  ply: { stress: ['σ1', 'σ2', 'τ12'], strain: ['ε1', 'ε2', 'γ12'] },
  laminate: { stress: ['σx', 'σy', 'τxy'], strain: ['εx', 'εy', 'γxy'] },
};

/** Stress and strain at the bottom and top of every ply, in ply or laminate axes. */
@Component({
  selector: 'app-ply-stress-table',
  imports: [MatButtonToggleModule],
  templateUrl: './ply-stress-table.html',
  styleUrl: './ply-stress-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlyStressTable {
  private readonly units = inject(UnitSystemService);

  readonly plies = input.required<readonly PlyResult[]>();

  protected readonly axes = signal<Axes>('ply');
  protected readonly headings = computed(() => HEADINGS[this.axes()]);
  protected readonly stressUnit = computed(() => unitLabel('stress', this.units.system()));

  protected readonly rows = computed(() => {
    const system = this.units.system();
    const axes = this.axes();
    const surfaces: Surface[] = ['top', 'bottom'];
    const pick = (ply: PlyResult, surface: Surface) => ({
      stress: axes === 'ply' ? ply[surface].stressPly : ply[surface].stressLaminate,
      strain: axes === 'ply' ? ply[surface].strainPly : ply[surface].strainLaminate,
    });
    const all = this.plies().flatMap((ply) => surfaces.map((surface) => pick(ply, surface)));
    const stressScale = Math.max(0, ...all.flatMap((r) => r.stress.map(Math.abs)));
    const strainScale = Math.max(0, ...all.flatMap((r) => r.strain.map(Math.abs)));
    // Top of the laminate first, as the plies lie.
    return [...this.plies()].reverse().flatMap((ply) =>
      surfaces.map((surface) => {
        const { stress, strain } = pick(ply, surface);
        return {
          key: `${ply.index}-${surface}`,
          ply: ply.index + 1,
          angle: formatAngle(ply.thetaDeg),
          surface,
          first: surface === 'top',
          stress: stress.map((s) => formatSignificant(toDisplay(withoutRoundOff(s, stressScale), 'stress', system), 4)),
          strain: strain.map((e) => formatSignificant(toDisplay(withoutRoundOff(e, strainScale), 'strain', system), 4)),
        };
      }),
    );
  });
}
