import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { catchError, combineLatest, map, of, startWith, switchMap } from 'rxjs';

import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { MaterialDetail } from '../../../shared/catalogue/catalogue-wire';
import { MaterialsApi } from '../../../shared/catalogue/materials-api';
import { PlyBasis, PlyMapping, PlyPropertySet, PlySetField } from '../../../shared/catalogue/ply-property-wire';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { PlyMappingDialog, PlyMappingDialogData } from '../ply-mapping-dialog/ply-mapping-dialog';

interface PlyState {
  readonly loading: boolean;
  readonly mapping: PlyMapping | null;
  readonly sets: readonly PlyPropertySet[];
  readonly failure: ApiFailure | null;
}

/** The quantity a lamina field of each kind is shown as (see shared/catalogue/quantity-display). */
const KIND_QUANTITY: Readonly<Record<string, string>> = { modulus: 'modulus', strength: 'strength', strain: 'failure-strain', poisson: 'poisson-ratio' };

/**
 * The ply property sets of a material: for each lamina field, the test method
 * and property it is taken from (stated per material, else the usual one),
 * and its value per condition, citing the allowable it came from or marked
 * typical (coupon mean) or unapproved.
 */
@Component({
  selector: 'app-ply-properties',
  imports: [MatButtonModule, MatButtonToggleModule, MatIconModule, MatProgressBarModule, QuantityUnitPipe, QuantityValuePipe, RouterLink],
  templateUrl: './ply-properties.html',
  styleUrl: './ply-properties.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlyProperties {
  private readonly api = inject(MaterialsApi);
  private readonly dialog = inject(MatDialog);

  readonly material = input.required<MaterialDetail>();
  readonly mayEdit = input(false);

  protected readonly basis = signal<PlyBasis>('B');
  private readonly reloadCount = signal(0);

  protected readonly state = toSignal(
    combineLatest([toObservable(this.material), toObservable(this.basis), toObservable(this.reloadCount)]).pipe(
      switchMap(([material, basis]) =>
        combineLatest([this.api.plyMapping(material.id), this.api.plyPropertySets(material.id, basis)]).pipe(
          map(([mapping, sets]): PlyState => ({ loading: false, mapping, sets, failure: null })),
          catchError((error: unknown) => of<PlyState>({ loading: false, mapping: null, sets: [], failure: catalogueFailureOf(error) })),
          startWith<PlyState>({ loading: true, mapping: null, sets: [], failure: null }),
        ),
      ),
    ),
    { initialValue: { loading: true, mapping: null, sets: [], failure: null } as PlyState },
  );

  /** One row per lamina field: its mapping, then its value in each condition. */
  protected readonly rows = computed(() => {
    const { mapping, sets } = this.state();
    if (!mapping) return [];
    return mapping.fields.map((field) => ({
      field,
      quantity: KIND_QUANTITY[field.kind] ?? field.kind,
      values: sets.map((set) => set.fields.find((f) => f.field === field.field) ?? null),
    }));
  });

  protected statusLabel(value: PlySetField): string {
    switch (value.status) {
      case 'approved':
        return `approved allowable, rev. ${value.allowable?.revision ?? '?'}`;
      case 'unapproved':
        return `${value.allowable?.status ?? 'open'} allowable, not approved`;
      case 'typical':
        return value.n ? `typical: mean of ${value.n}` : 'typical';
      default:
        return 'no data';
    }
  }

  protected editMapping(): void {
    const mapping = this.state().mapping;
    if (!mapping) return;
    this.dialog
      .open<PlyMappingDialog, PlyMappingDialogData, PlyMapping>(PlyMappingDialog, { data: { materialId: this.material().id, mapping }, width: '760px' })
      .afterClosed()
      .subscribe((saved) => {
        if (saved) this.reloadCount.update((n) => n + 1);
      });
  }
}
