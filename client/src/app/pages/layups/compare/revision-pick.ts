import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { catchError, of, switchMap } from 'rxjs';

import { LayupApi } from '../data/layup-api';
import { LayupSummary } from '../data/layup-wire';

/** Chooses one layup revision: the layup, then which of its revisions. */
@Component({
  selector: 'app-revision-pick',
  imports: [MatFormFieldModule, MatSelectModule],
  templateUrl: './revision-pick.html',
  styleUrl: './revision-pick.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionPick {
  private readonly api = inject(LayupApi);

  readonly label = input.required<string>();
  readonly layups = input.required<readonly LayupSummary[]>();
  /** The chosen revision's layup and id, when one is chosen. */
  readonly layupId = input<number | null>(null);
  readonly revisionId = input<number | null>(null);
  readonly picked = output<{ layupId: number; revisionId: number }>();

  protected readonly detail = toSignal(
    toObservable(this.layupId).pipe(switchMap((id) => (id ? this.api.detail(id).pipe(catchError(() => of(null))) : of(null)))),
    { initialValue: null },
  );
  protected readonly revisions = computed(() => this.detail()?.revisions ?? []);

  protected pickLayup(layupId: number): void {
    const layup = this.layups().find((l) => l.id === layupId);
    if (layup) this.picked.emit({ layupId, revisionId: layup.latest.id });
  }

  protected pickRevision(revisionId: number): void {
    const layupId = this.layupId();
    if (layupId) this.picked.emit({ layupId, revisionId });
  }
}
