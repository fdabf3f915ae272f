import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { Matrix } from '../../../../../shared/laminate/laminate-wire';
import { MatrixDisplay } from '../../../../../shared/matrix-display/matrix-display';

/** The laminate's A, B, D and transverse shear H matrices (CLT, ENGINEERING.md section 3). */
@Component({
  selector: 'app-abd-matrices',
  imports: [MatrixDisplay],
  templateUrl: './abd-matrices.html',
  styleUrl: './abd-matrices.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AbdMatrices {
  readonly A = input.required<Matrix>();
  readonly B = input.required<Matrix>();
  readonly D = input.required<Matrix>();
  readonly H = input.required<Matrix>();
  /** mm */
  readonly thickness = input.required<number>();

  /** Coupling is small or not against membrane stiffness times thickness (N/mm · mm = N). */
  protected readonly couplingScale = computed(() => Math.max(...this.A().flat().map(Math.abs)) * this.thickness());
}
