import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { Study, StudyDetail } from '@tallyfit/contracts';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { StudiesApi } from '../../core/api/studies-api';

export interface StudyFormData {
  /** The study to rename and describe; without it the dialog creates a new one. */
  study?: Pick<Study, 'id' | 'name' | 'description'>;
}

/** Creates a study, or renames and re-describes one; closes with the stored study. */
@Component({
  selector: 'tf-study-form-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule],
  templateUrl: './study-form-dialog.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
  styles: `
    form { display: flex; flex-direction: column; gap: 8px; min-width: min(440px, 100%); }
    mat-form-field { width: 100%; }
    .error { color: var(--mat-sys-error); margin: 0; }
  `,
})
export class StudyFormDialog {
  private readonly api = inject(StudiesApi);
  private readonly dialogRef = inject<MatDialogRef<StudyFormDialog, StudyDetail>>(MatDialogRef);
  protected readonly existing = inject<StudyFormData | null>(MAT_DIALOG_DATA, { optional: true })?.study;

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.existing?.name ?? '', [Validators.required, Validators.maxLength(200)]],
    description: [this.existing?.description ?? '', Validators.maxLength(2000)],
  });
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const name = this.form.controls.name.value.trim();
    const description = this.form.controls.description.value.trim();
    this.busy.set(true);
    this.error.set(null);
    const request = this.existing
      ? this.api.update(this.existing.id, { name, description: description || null })
      : this.api.create({ name, ...(description ? { description } : {}) });
    request.subscribe({
      next: (study) => this.dialogRef.close(study),
      error: (error: unknown) => {
        this.busy.set(false);
        this.error.set(apiErrorMessage(error));
      },
    });
  }
}
