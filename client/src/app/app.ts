import { ChangeDetectionStrategy, Component } from '@angular/core';

import { Shell } from './shell/shell';

/** The root component: everything a person sees lives in the shell. */
@Component({
  selector: 'app-root',
  imports: [Shell],
  templateUrl: './app.html',
  styleUrl: './app.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {}
