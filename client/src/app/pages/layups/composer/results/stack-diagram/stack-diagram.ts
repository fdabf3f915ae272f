import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';

import { formatSignificant } from '../../../../../core/units/number-format';
import { toDisplay, unitLabel } from '../../../../../core/units/unit-conversion';
import { UnitSystemService } from '../../../../../core/units/unit-system';
import { PlyResult } from '../../../../../shared/laminate/laminate-wire';
import { ANGLE_SWATCHES, angleFamily, angleSwatch } from '../../../../../shared/laminate/ply-angle-palette';
import { formatAngle } from '../../../../../shared/laminate/ply-angles';

const WIDTH = 420;
const PLOT_LEFT = 78;
const PLOT_RIGHT = 300;
const PADDING = 14;
/** Plies thinner than this on screen get no label of their own. */
const LABEL_MIN_PX = 13;

/**
 * The stack through the thickness, to scale: the first ply at the bottom
 * (z = -h/2), each ply coloured by its angle in Plyledger's palette.
 */
@Component({
  selector: 'app-stack-diagram',
  templateUrl: './stack-diagram.html',
  styleUrl: './stack-diagram.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StackDiagram {
  private readonly units = inject(UnitSystemService);

  readonly plies = input.required<readonly PlyResult[]>();
  readonly thickness = input.required<number>();

  protected readonly width = WIDTH;
  protected readonly plotLeft = PLOT_LEFT;
  protected readonly plotWidth = PLOT_RIGHT - PLOT_LEFT;

  protected readonly height = computed(() => Math.max(300, Math.min(560, this.plies().length * 20 + 2 * PADDING)));

  protected readonly layout = computed(() => {
    const plies = this.plies();
    const h = this.thickness();
    const height = this.height();
    const scale = (height - 2 * PADDING) / h;
    const y = (z: number) => PADDING + (h / 2 - z) * scale;
    const system = this.units.system();
    const unit = unitLabel('length', system);
    const zText = (z: number) => `${formatSignificant(toDisplay(z, 'length', system), 3)} ${unit}`;
    return {
      rects: plies.map((ply) => {
        const top = y(ply.zTop);
        const size = Math.max(0.5, y(ply.zBottom) - top);
        const swatch = angleSwatch(ply.thetaDeg);
        return {
          index: ply.index,
          y: top,
          height: size,
          fill: swatch.fill,
          text: swatch.text,
          label: size >= LABEL_MIN_PX ? `${ply.index + 1}  ·  ${formatAngle(ply.thetaDeg)}` : null,
          title: `Ply ${ply.index + 1}: ${formatAngle(ply.thetaDeg)}, z ${zText(ply.zBottom)} to ${zText(ply.zTop)}`,
        };
      }),
      ticks: [
        { y: y(h / 2), text: '+h/2' },
        { y: y(0), text: 'z = 0' },
        { y: y(-h / 2), text: '−h/2' },
      ],
      top: y(h / 2),
      bottom: y(-h / 2),
      mid: y(0),
      thicknessText: zText(h),
    };
  });

  protected readonly legend = computed(() => {
    const families = new Set(this.plies().map((ply) => angleFamily(ply.thetaDeg)));
    return Object.values(ANGLE_SWATCHES).filter((swatch) => families.has(swatch.family));
  });

  protected readonly summary = computed(
    () => `Stack of ${this.plies().length} plies, ${this.plies().map((p) => formatAngle(p.thetaDeg)).join(', ')} from the bottom.`,
  );
}
