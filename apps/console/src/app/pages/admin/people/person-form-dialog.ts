import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { ROLES, type Person, type Role } from '@tallyfit/contracts';
import { apiErrorMessage } from '../../../core/api/api-error-message';
import { PeopleApi } from '../../../core/api/people-api';
import { ROLE_WORDS } from './role-words';

/** The API's own minimum for a first password. */
const MIN_PASSWORD_LENGTH = 10;

/** Adds a person with a role and a first password; closes with the stored person. */
@Component({
  selector: 'tf-person-form-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, MatSelectModule],
  templateUrl: './person-form-dialog.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
  styles: `
    form { display: flex; flex-direction: column; gap: 4px; min-width: min(420px, 100%); }
    mat-form-field { width: 100%; }
    .error { color: var(--mat-sys-error); margin: 0; }
  `,
})
export class PersonFormDialog {
  private readonly api = inject(PeopleApi);
  private readonly dialogRef = inject<MatDialogRef<PersonFormDialog, Person>>(MatDialogRef);

  protected readonly roles = ROLES;
  protected readonly roleWords = ROLE_WORDS;
  protected readonly minPassword = MIN_PASSWORD_LENGTH;
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(200)]],
    email: ['', [Validators.required, Validators.email, Validators.maxLength(254)]],
    role: ['analyst' as Role, Validators.required],
    password: ['', [Validators.required, Validators.minLength(MIN_PASSWORD_LENGTH), Validators.maxLength(200)]],
  });
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    this.busy.set(true);
    this.error.set(null);
    this.api.create({ ...value, name: value.name.trim(), email: value.email.trim() }).subscribe({
      next: (person) => this.dialogRef.close(person),
      error: (error: unknown) => {
        this.busy.set(false);
        this.error.set(apiErrorMessage(error));
      },
    });
  }
}
