import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/**
 * The frame of a page that is not built yet: its title, a plain "not built yet"
 * notice, and (projected) what the page will hold.
 */
@Component({
  selector: 'app-page-placeholder',
  imports: [MatIconModule],
  templateUrl: './page-placeholder.html',
  styleUrl: './page-placeholder.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PagePlaceholder {
  readonly heading = input.required<string>();
  readonly icon = input.required<string>();
}
