import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { catchError, debounceTime, map, merge, of, startWith, Subject, switchMap } from 'rxjs';

import { SessionService } from '../../../core/session/session';
import { DisplayValuePipe, UnitLabelPipe } from '../../../core/units/display-value-pipe';
import { apiFailureOf } from '../../../shared/laminate/api-problem';
import { LayupApi } from '../data/layup-api';
import { LayupSummary } from '../data/layup-wire';

/** The layups: find, open, duplicate, and pick two to compare. */
@Component({
  selector: 'app-layup-list',
  imports: [
    DatePipe,
    DisplayValuePipe,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    ReactiveFormsModule,
    RouterLink,
    UnitLabelPipe,
  ],
  templateUrl: './layup-list.html',
  styleUrl: './layup-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LayupList {
  private readonly api = inject(LayupApi);
  private readonly router = inject(Router);
  private readonly session = inject(SessionService);

  protected readonly mayWrite = computed(() => this.session.roles().includes('designer'));
  protected readonly search = new FormControl('', { nonNullable: true });
  private readonly reload = new Subject<void>();

  protected readonly list = toSignal(
    merge(this.search.valueChanges.pipe(debounceTime(250)), this.reload.pipe(map(() => this.search.value))).pipe(
      startWith(''),
      switchMap((query) =>
        this.api.list(query).pipe(
          map((items) => ({ loading: false, items, failure: null })),
          catchError((error: unknown) => of({ loading: false, items: [] as readonly LayupSummary[], failure: apiFailureOf(error) })),
          startWith({ loading: true, items: null, failure: null }),
        ),
      ),
    ),
    { initialValue: { loading: true, items: null, failure: null } },
  );

  /** Latest revision ids ticked for comparison, in the order they were ticked. */
  protected readonly picked = signal<readonly number[]>([]);
  protected readonly duplicating = signal<number | null>(null);
  protected readonly duplicateName = new FormControl('', { nonNullable: true });
  protected readonly duplicateError = signal<string | null>(null);

  protected togglePick(revisionId: number, on: boolean): void {
    this.picked.update((ids) => (on ? [...ids.filter((id) => id !== revisionId), revisionId].slice(-2) : ids.filter((id) => id !== revisionId)));
  }

  protected compare(): void {
    const [a, b] = this.picked();
    if (a && b) void this.router.navigate(['/layups/compare'], { queryParams: { a, b } });
  }

  protected startDuplicate(layup: LayupSummary): void {
    this.duplicating.set(layup.id);
    this.duplicateError.set(null);
    this.duplicateName.setValue(`${layup.name} (copy)`);
  }

  protected confirmDuplicate(layup: LayupSummary): void {
    const name = this.duplicateName.value.trim();
    if (!name) {
      this.duplicateError.set('Give the copy a name.');
      return;
    }
    this.api.duplicate(layup.id, name).subscribe({
      next: (revision) => void this.router.navigate(['/layups', revision.layupId]),
      error: (error: unknown) => this.duplicateError.set(apiFailureOf(error).message),
    });
  }
}
