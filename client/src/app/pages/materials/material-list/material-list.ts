import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { catchError, map, of, startWith, Subject, switchMap } from 'rxjs';

import { SessionService } from '../../../core/session/session';
import { DisplayValuePipe, UnitLabelPipe } from '../../../core/units/display-value-pipe';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { Material, MATERIAL_FORMS } from '../../../shared/catalogue/catalogue-wire';
import { MaterialsApi } from '../../../shared/catalogue/materials-api';
import { MaterialForm } from '../material-form/material-form';

/** The material systems of the catalogue; materials engineers register new ones. */
@Component({
  selector: 'app-material-list',
  imports: [DisplayValuePipe, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule, RouterLink, UnitLabelPipe],
  templateUrl: './material-list.html',
  styleUrl: './material-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialList {
  private readonly api = inject(MaterialsApi);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly session = inject(SessionService);
  private readonly reload = new Subject<void>();

  protected readonly mayRegister = computed(() => this.session.roles().includes('materials-engineer'));
  protected readonly columns = ['code', 'name', 'form', 'fibreResin', 'plyThickness', 'density'];
  protected readonly formLabels: Readonly<Partial<Record<string, string>>> = Object.fromEntries(MATERIAL_FORMS.map((f) => [f.value, f.label]));

  protected readonly list = toSignal(
    this.reload.pipe(
      startWith(undefined),
      switchMap(() =>
        this.api.materials().pipe(
          map((items) => ({ loading: false, items, failure: null })),
          catchError((error: unknown) => of({ loading: false, items: [] as readonly Material[], failure: catalogueFailureOf(error) })),
          startWith({ loading: true, items: null, failure: null }),
        ),
      ),
    ),
    { initialValue: { loading: true, items: null, failure: null } },
  );

  protected register(): void {
    this.dialog
      .open<MaterialForm, void, Material>(MaterialForm, { width: '640px', autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((created) => {
        if (created) void this.router.navigate(['/materials', created.id]);
      });
  }
}
