import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { catchError, of, switchMap } from 'rxjs';

import { Upload } from '../../../../shared/catalogue/coupon-wire';
import { CouponsApi } from '../../../../shared/catalogue/coupons-api';

/** The latest uploads with their checksum, each with its coupons and the stored file. */
@Component({
  selector: 'app-recent-uploads',
  imports: [DatePipe, DecimalPipe, RouterLink],
  templateUrl: './recent-uploads.html',
  styleUrl: './recent-uploads.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecentUploads {
  private readonly api = inject(CouponsApi);
  /** Changes after each upload, so the list is read again. */
  readonly refresh = input(0);

  protected readonly uploads = toSignal(
    toObservable(this.refresh).pipe(switchMap(() => this.api.uploads(10).pipe(catchError(() => of([] as readonly Upload[]))))),
    { initialValue: [] as readonly Upload[] },
  );

  protected fileUrl(upload: Upload): string {
    return this.api.storedFileUrl(upload.id);
  }
}
