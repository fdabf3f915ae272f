import { ChangeDetectionStrategy, Component } from '@angular/core';

import { PageNotice } from '../../shared/page-notice/page-notice';

/** Any address the application does not know. */
@Component({
  selector: 'app-not-found',
  imports: [PageNotice],
  templateUrl: './not-found.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFoundPage {}
