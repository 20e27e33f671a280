import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { Comment } from '@tallyfit/contracts';
import { combineLatest, forkJoin, switchMap } from 'rxjs';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { ReviewsApi } from '../../core/api/reviews-api';
import { AuthSession } from '../../core/auth/auth-session';
import { can } from '@tallyfit/contracts';
import { failureMessage, LOADING, loadedValue, toLoadState } from '../../core/load/load-state';
import { threadEntries } from './thread-entries';

const MAX_COMMENT_LENGTH = 5000;

/**
 * The conversation on one analysis: comments and review decisions, oldest first, and a box to add
 * a comment. Embed it wherever an analysis is shown: `<tf-comments-thread [analysisId]="id" />`.
 */
@Component({
  selector: 'tf-comments-thread',
  imports: [DatePipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule],
  templateUrl: './comments-thread.html',
  styleUrl: './comments-thread.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CommentsThread {
  private readonly api = inject(ReviewsApi);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly role = inject(AuthSession).role;

  readonly analysisId = input.required<number>();
  /** Change it to load the thread again (after a review decision made elsewhere on the page). */
  readonly reloadKey = input(0);

  protected readonly maxLength = MAX_COMMENT_LENGTH;
  protected readonly canComment = computed(() => can(this.role(), 'analyses.comment'));
  private readonly posted = signal<Comment[]>([]);

  private readonly state = toSignal(
    combineLatest([toObservable(this.analysisId), toObservable(this.reloadKey)]).pipe(
      switchMap(([id]) => {
        this.posted.set([]);
        return toLoadState(forkJoin({ comments: this.api.comments(id), reviews: this.api.reviews(id) }));
      }),
    ),
    { initialValue: LOADING },
  );
  protected readonly loading = computed(() => this.state().status === 'loading');
  protected readonly failure = computed(() => failureMessage(this.state()));
  protected readonly entries = computed(() => {
    const loaded = loadedValue(this.state());
    return loaded ? threadEntries([...loaded.comments, ...this.posted()], loaded.reviews) : [];
  });

  protected readonly form = inject(NonNullableFormBuilder).group({
    body: ['', [Validators.required, Validators.maxLength(MAX_COMMENT_LENGTH)]],
  });
  protected readonly sending = signal(false);
  protected readonly sendError = signal<string | null>(null);

  protected post(): void {
    const body = this.form.controls.body.value.trim();
    if (!body || this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.sending.set(true);
    this.sendError.set(null);
    this.api.addComment(this.analysisId(), body).subscribe({
      next: (comment) => {
        this.posted.update((list) => [...list, comment]);
        this.form.reset();
        this.sending.set(false);
        void this.announcer.announce('Comment posted.');
      },
      error: (error: unknown) => {
        this.sending.set(false);
        this.sendError.set(apiErrorMessage(error));
      },
    });
  }
}
