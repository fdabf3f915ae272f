import { ChangeDetectionStrategy, Component, effect, input, output } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

export interface SaveRequest {
  readonly name: string;
  readonly description: string;
  readonly comment: string;
}

/**
 * Saving: a new layup gets its name and revision 1; a saved one gets a new
 * revision (a revision is a record and never changes). The comment says what
 * changed and why.
 */
@Component({
  selector: 'app-save-panel',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './save-panel.html',
  styleUrl: './save-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SavePanel {
  /** null for a layup never saved. */
  readonly revision = input<number | null>(null);
  readonly name = input('');
  readonly description = input('');
  readonly saving = input(false);
  readonly canSave = input(true);
  readonly message = input<{ text: string; error: boolean } | null>(null);
  readonly save = output<SaveRequest>();

  protected readonly form = new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    description: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(4000)] }),
    comment: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(4000)] }),
  });

  constructor() {
    effect(() => {
      this.form.patchValue({ name: this.name(), description: this.description(), comment: '' }, { emitEvent: false });
    });
  }

  protected submit(): void {
    if (this.form.invalid || this.saving() || !this.canSave()) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, description, comment } = this.form.getRawValue();
    this.save.emit({ name: name.trim(), description: description.trim(), comment: comment.trim() });
  }
}
