import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { catchError, combineLatest, map, of, startWith, switchMap } from 'rxjs';

import { SessionService } from '../../../core/session/session';
import { DisplayValuePipe, UnitLabelPipe } from '../../../core/units/display-value-pipe';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { DataGroup, MATERIAL_FORMS, MaterialDetail } from '../../../shared/catalogue/catalogue-wire';
import { MaterialsApi } from '../../../shared/catalogue/materials-api';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { BatchList } from '../batch-list/batch-list';
import { PlyProperties } from '../ply-properties/ply-properties';

interface DetailState {
  readonly loading: boolean;
  readonly material: MaterialDetail | null;
  readonly groups: readonly DataGroup[];
  readonly failure: ApiFailure | null;
}

/** One material system: its data, its coupons by data group, its batches and panels, its ply data. */
@Component({
  selector: 'app-material-detail',
  imports: [BatchList, DisplayValuePipe, MatButtonModule, MatIconModule, MatProgressBarModule, PlyProperties, RouterLink, UnitLabelPipe],
  templateUrl: './material-detail.html',
  styleUrl: './material-detail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialDetailPage {
  private readonly api = inject(MaterialsApi);
  private readonly session = inject(SessionService);

  /** The route's :id. */
  readonly id = input.required<string>();
  private readonly reloadCount = signal(0);

  protected readonly mayEdit = computed(() => this.session.roles().includes('materials-engineer'));
  protected readonly formLabels: Readonly<Partial<Record<string, string>>> = Object.fromEntries(MATERIAL_FORMS.map((f) => [f.value, f.label]));

  protected readonly state = toSignal(
    combineLatest([toObservable(this.id), toObservable(this.reloadCount)]).pipe(
      switchMap(([id]) =>
        combineLatest([this.api.material(Number(id)), this.api.dataGroups(Number(id))]).pipe(
          map(([material, groups]): DetailState => ({ loading: false, material, groups, failure: null })),
          catchError((error: unknown) => of<DetailState>({ loading: false, material: null, groups: [], failure: catalogueFailureOf(error) })),
          startWith<DetailState>({ loading: true, material: null, groups: [], failure: null }),
        ),
      ),
    ),
    { initialValue: { loading: true, material: null, groups: [], failure: null } as DetailState },
  );

  /** Data groups as a property × condition matrix, in the order the API lists them. */
  protected readonly matrix = computed(() => {
    const groups = this.state().groups;
    const properties = [...new Set(groups.map((g) => g.property))];
    const conditions = [...new Set(groups.map((g) => g.condition.code ?? '?'))];
    const cell = (property: string, condition: string) =>
      groups.find((g) => g.property === property && (g.condition.code ?? '?') === condition) ?? null;
    return { properties, conditions, cell };
  });

  protected reload(): void {
    this.reloadCount.update((n) => n + 1);
  }
}
