import { ChangeDetectionStrategy, Component } from '@angular/core';

import { PagePlaceholder } from '../../shared/page-placeholder/page-placeholder';

/** Placeholder page; the real one comes with a later issue. */
@Component({
  selector: 'app-layups',
  imports: [PagePlaceholder],
  templateUrl: './layups.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LayupsPage {}
