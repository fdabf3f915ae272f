import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  input,
  output,
  signal,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

/** A complaint of the code parser, with the 0-based character it points at when it names one. */
export interface CodeError {
  readonly message: string;
  readonly position: number | null;
}

/**
 * The laminate code, kept in step with the ply table: typing emits the code
 * (the composer asks the API to expand it); a new table shows its printed code,
 * except while the person is typing here. A parse error is shown under the
 * character it points at.
 */
@Component({
  selector: 'app-stacking-code-field',
  imports: [MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './stacking-code-field.html',
  styleUrl: './stacking-code-field.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StackingCodeField {
  /** The code printed from the current ply table. */
  readonly printedCode = input.required<string>();
  readonly error = input<CodeError | null>(null);
  readonly disabled = input(false);
  readonly codeTyped = output<string>();

  protected readonly control = new FormControl('', { nonNullable: true });
  private readonly typed = toSignal(this.control.valueChanges, { initialValue: '' });
  private readonly editing = signal(false);

  /** The code split around the character the error points at. */
  protected readonly marked = computed(() => {
    const error = this.error();
    const code = this.typed();
    if (!error || error.position === null) return null;
    const at = Math.min(error.position, code.length);
    return { before: code.slice(0, at), at: code.slice(at, at + 1) || ' ', after: code.slice(at + 1) };
  });

  constructor() {
    effect(() => {
      const printed = this.printedCode();
      if (!this.editing() && printed !== this.control.value) this.control.setValue(printed, { emitEvent: false });
    });
    effect(() => {
      if (this.disabled()) this.control.disable({ emitEvent: false });
      else this.control.enable({ emitEvent: false });
    });
  }

  protected onInput(): void {
    this.editing.set(true);
    this.codeTyped.emit(this.control.value);
  }

  /** Leaving the field hands it back to the table: the next table change prints its code here. */
  protected onBlur(): void {
    this.editing.set(false);
  }
}
