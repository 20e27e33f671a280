import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { AnalysisStatus, AnalysisSummary } from '@tallyfit/contracts';
import type { Observable } from 'rxjs';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { ReviewsApi } from '../../core/api/reviews-api';
import { AuthSession } from '../../core/auth/auth-session';
import { can } from '@tallyfit/contracts';
import { formatP } from '../../core/format/p-value';
import { AnalysisStatusChip } from '../../shared/analysis-status/analysis-status-chip';
import { testWords } from '../../shared/analysis-status/analysis-status-words';
import { CommentsThread } from '../../shared/comments-thread/comments-thread';

/** What the dialog hands back: the status the analysis has now, if a decision changed it. */
export type ReviewDialogResult = AnalysisStatus | undefined;

/**
 * One analysis from the history, with its conversation; leads and admins sign it off or return it
 * with a reason while it waits for review.
 */
@Component({
  selector: 'tf-review-dialog',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    AnalysisStatusChip,
    CommentsThread,
  ],
  templateUrl: './review-dialog.html',
  styleUrl: './review-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewDialog {
  private readonly api = inject(ReviewsApi);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly dialogRef = inject<MatDialogRef<ReviewDialog, ReviewDialogResult>>(MatDialogRef);
  private readonly role = inject(AuthSession).role;

  protected readonly analysis = inject<AnalysisSummary>(MAT_DIALOG_DATA);
  protected readonly status = signal<AnalysisStatus>(this.analysis.status);
  protected readonly canDecide = computed(() => can(this.role(), 'analyses.review') && this.status() === 'in_review');
  protected readonly note = new FormControl('', { nonNullable: true, validators: Validators.maxLength(5000) });
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly threadKey = signal(0);
  protected readonly formatP = formatP;
  protected readonly testWords = testWords;

  protected signOff(): void {
    this.decide(this.api.signOff(this.analysis.id, this.note.value), 'Signed off.');
  }

  protected returnToAuthor(): void {
    if (!this.note.value.trim()) {
      this.error.set('Say what the author should change before returning the analysis.');
      return;
    }
    this.decide(this.api.returnToAuthor(this.analysis.id, this.note.value.trim()), 'Returned to the author.');
  }

  protected close(): void {
    this.dialogRef.close(this.status() === this.analysis.status ? undefined : this.status());
  }

  private decide(request: Observable<{ status: AnalysisStatus }>, done: string): void {
    this.busy.set(true);
    this.error.set(null);
    request.subscribe({
      next: (record) => {
        this.busy.set(false);
        this.status.set(record.status);
        this.note.reset();
        this.threadKey.update((key) => key + 1);
        void this.announcer.announce(done);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.error.set(apiErrorMessage(error));
      },
    });
  }
}
