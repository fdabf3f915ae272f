import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/**
 * The caution PRODUCT.md asks for wherever values are approved, margins are
 * shown or sections are exported (and on the home page).
 */
@Component({
  selector: 'app-engineering-caution',
  imports: [MatIconModule],
  templateUrl: './engineering-caution.html',
  styleUrl: './engineering-caution.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EngineeringCaution {}
