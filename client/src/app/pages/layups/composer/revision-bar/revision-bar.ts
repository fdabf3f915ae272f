import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { RevisionSummary } from '../../data/layup-wire';

/** A saved layup's revisions (newest first) and where to go from the one open: compare, export. */
@Component({
  selector: 'app-revision-bar',
  imports: [DatePipe, MatButtonModule, MatIconModule, RouterLink],
  templateUrl: './revision-bar.html',
  styleUrl: './revision-bar.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionBar {
  readonly layupId = input.required<number>();
  readonly revisionId = input.required<number>();
  readonly revisions = input.required<readonly RevisionSummary[]>();
}
