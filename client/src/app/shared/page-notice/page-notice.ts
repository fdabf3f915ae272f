import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

/** A page that only tells the person something (not permitted, not found) and leads home. */
@Component({
  selector: 'app-page-notice',
  imports: [MatButtonModule, MatIconModule, RouterLink],
  templateUrl: './page-notice.html',
  styleUrl: './page-notice.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PageNotice {
  readonly heading = input.required<string>();
  readonly icon = input.required<string>();
}
