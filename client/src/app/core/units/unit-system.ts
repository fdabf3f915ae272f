import { DOCUMENT } from '@angular/common';
import { inject, Injectable, signal } from '@angular/core';

import type { UnitSystem } from './unit-conversion';

export type { UnitSystem };

const STORAGE_KEY = 'plyledger.unit-system';

/**
 * The unit system the person reads and enters values in, kept across visits
 * in localStorage. Pages convert through it; the API keeps its own units.
 */
@Injectable({ providedIn: 'root' })
export class UnitSystemService {
  private readonly storage = inject(DOCUMENT).defaultView?.localStorage ?? null;
  private readonly systemSignal = signal<UnitSystem>(this.readStored());

  readonly system = this.systemSignal.asReadonly();

  set(system: UnitSystem): void {
    this.systemSignal.set(system);
    try {
      this.storage?.setItem(STORAGE_KEY, system);
    } catch {
      // Storage can be full or blocked by the browser: the choice then lasts for this visit only.
    }
  }

  private readStored(): UnitSystem {
    try {
      return this.storage?.getItem(STORAGE_KEY) === 'US' ? 'US' : 'SI';
    } catch {
      return 'SI';
    }
  }
}
