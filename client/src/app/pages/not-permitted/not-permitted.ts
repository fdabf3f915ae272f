import { ChangeDetectionStrategy, Component } from '@angular/core';

import { PageNotice } from '../../shared/page-notice/page-notice';

/** Where the role guard sends a signed-in person whose roles do not include the page. */
@Component({
  selector: 'app-not-permitted',
  imports: [PageNotice],
  templateUrl: './not-permitted.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotPermittedPage {}
