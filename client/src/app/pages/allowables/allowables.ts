import { ChangeDetectionStrategy, Component } from '@angular/core';

import { PagePlaceholder } from '../../shared/page-placeholder/page-placeholder';

/** Placeholder page; the real one comes with a later issue. */
@Component({
  selector: 'app-allowables',
  imports: [PagePlaceholder],
  templateUrl: './allowables.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllowablesPage {}
