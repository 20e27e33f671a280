import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { STUDY_ROLES, type StudyDetail, type StudyRole } from '@tallyfit/contracts';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { PeopleApi } from '../../core/api/people-api';
import { StudiesApi } from '../../core/api/studies-api';
import { LOADING, toLoadState } from '../../core/load/load-state';
import { STUDY_ROLE_WORDS } from './study-role-words';

export interface AddMemberData {
  studyId: number;
  /** People already in the study, left out of the choice. */
  memberIds: number[];
}

/** Picks a person and their role in the study; closes with the study as the API stored it. */
@Component({
  selector: 'tf-add-member-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatProgressBarModule, MatSelectModule],
  templateUrl: './add-member-dialog.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
  styles: `
    form { display: flex; flex-direction: column; gap: 8px; min-width: min(400px, 100%); }
    mat-form-field { width: 100%; }
    .error { color: var(--mat-sys-error); margin: 0; }
  `,
})
export class AddMemberDialog {
  private readonly data = inject<AddMemberData>(MAT_DIALOG_DATA);
  private readonly studies = inject(StudiesApi);
  private readonly dialogRef = inject<MatDialogRef<AddMemberDialog, StudyDetail>>(MatDialogRef);

  protected readonly roles = STUDY_ROLES;
  protected readonly roleWords = STUDY_ROLE_WORDS;
  protected readonly form = inject(NonNullableFormBuilder).group({
    userId: this.fromNull<number>(),
    studyRole: this.fromNull<StudyRole>('contributor'),
  });

  private readonly people = toSignal(toLoadState(inject(PeopleApi).directory()), { initialValue: LOADING });
  protected readonly candidates = computed(() => {
    const state = this.people();
    if (state.status !== 'loaded') return [];
    return state.value.filter((person) => !this.data.memberIds.includes(person.id));
  });
  protected readonly loadFailure = computed(() => {
    const state = this.people();
    return state.status === 'failed' ? state.message : null;
  });
  protected readonly loading = computed(() => this.people().status === 'loading');
  private readonly chosenId = toSignal(this.form.controls.userId.valueChanges, { initialValue: null });
  /** Viewers may only read, so they can only join as readers (the API's rule too). */
  protected readonly chosenIsViewer = computed(
    () => this.candidates().find((person) => person.id === this.chosenId())?.role === 'viewer',
  );
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  protected submit(): void {
    const { userId, studyRole } = this.form.getRawValue();
    if (this.form.invalid || userId === null || studyRole === null) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    this.studies.addMember(this.data.studyId, { userId, studyRole }).subscribe({
      next: (study) => this.dialogRef.close(study),
      error: (error: unknown) => {
        this.busy.set(false);
        this.error.set(apiErrorMessage(error));
      },
    });
  }

  private fromNull<T>(initial: T | null = null) {
    return inject(NonNullableFormBuilder).control<T | null>(initial, Validators.required);
  }
}
