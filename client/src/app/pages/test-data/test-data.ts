import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';

/** The frame of the test data pages: tabs for coupons, upload and analyses. */
@Component({
  selector: 'app-test-data',
  imports: [MatTabsModule, RouterLink, RouterLinkActive, RouterOutlet],
  templateUrl: './test-data.html',
  styleUrl: './test-data.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TestDataPage {
  protected readonly tabs = [
    { path: 'coupons', label: 'Coupons' },
    { path: 'upload', label: 'Upload' },
    { path: 'analyses', label: 'Analyses' },
  ] as const;
}
