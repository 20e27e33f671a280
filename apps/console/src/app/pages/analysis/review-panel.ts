import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { reviewStateLines, utcTimeText, type AnalysisRecord } from '@tallyfit/contracts';
import { combineLatest, filter, type Observable, switchMap } from 'rxjs';
import { AnalysesApi } from '../../core/api/analyses-api';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { ReviewsApi } from '../../core/api/reviews-api';
import { AuthSession } from '../../core/auth/auth-session';
import { formatP } from '../../core/format/p-value';
import { LOADING, loadedValue, toLoadState } from '../../core/load/load-state';
import { NotificationsCenter } from '../../core/notifications/notifications-center';
import { ConfirmDialog, type ConfirmData } from '../../shared/confirm-dialog/confirm-dialog';
import { openReturn, reviewActions } from './review-actions';

/**
 * The review loop on the result page: where the analysis stands (in the words the exports use), the
 * reason it was returned, the reviewer's decision with the effect size in view, and the author's
 * moves (submit, withdraw, edit title and notes, change and re-run, delete).
 */
@Component({
  selector: 'tf-review-panel',
  imports: [
    DecimalPipe,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
  ],
  templateUrl: './review-panel.html',
  styleUrl: './review-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewPanel {
  private readonly analysesApi = inject(AnalysesApi);
  private readonly reviewsApi = inject(ReviewsApi);
  private readonly center = inject(NotificationsCenter);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly user = inject(AuthSession).user;

  readonly analysis = input.required<AnalysisRecord>();
  /** Changes when a decision was made, so the review history is read again. */
  readonly reloadKey = input(0);
  /** A decision or edit changed the analysis: the page reads it again. */
  readonly changed = output<void>();

  private readonly reviewsState = toSignal(
    combineLatest([toObservable(this.analysis), toObservable(this.reloadKey)]).pipe(
      switchMap(([analysis]) => toLoadState(this.reviewsApi.reviews(analysis.id))),
    ),
    { initialValue: LOADING },
  );
  private readonly reviews = computed(() => loadedValue(this.reviewsState()) ?? []);
  protected readonly stateLines = computed(() => reviewStateLines(this.analysis().status, this.reviews()));
  protected readonly returned = computed(() => openReturn(this.analysis().status, this.reviews()));
  protected readonly actions = computed(() => {
    const user = this.user();
    return reviewActions(this.analysis(), user ? { id: user.id, role: user.role } : null);
  });
  protected readonly isAuthor = computed(() => this.user()?.id === this.analysis().author.id);
  protected readonly formatP = formatP;
  protected readonly utcTimeText = utcTimeText;

  protected readonly note = new FormControl('', { nonNullable: true, validators: Validators.maxLength(5000) });
  protected readonly noteMissing = signal(false);
  protected readonly editing = signal(false);
  protected readonly details = inject(NonNullableFormBuilder).group({
    title: ['', [Validators.required, Validators.maxLength(200)]],
    notes: ['', Validators.maxLength(10_000)],
  });
  protected readonly busy = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected signOff(): void {
    this.noteMissing.set(false);
    this.act('Signing off…', this.reviewsApi.signOff(this.analysis().id, this.note.value), 'Signed off. The author is told.');
  }

  protected returnToAuthor(): void {
    const reason = this.note.value.trim();
    this.noteMissing.set(!reason);
    if (!reason) return;
    this.act('Returning…', this.reviewsApi.returnToAuthor(this.analysis().id, reason), 'Returned to the author with your note.');
  }

  protected submit(): void {
    this.act('Submitting…', this.reviewsApi.submit(this.analysis().id), 'Submitted for review. Reviewers are told.');
  }

  protected withdraw(): void {
    this.act('Withdrawing…', this.reviewsApi.withdraw(this.analysis().id), 'Submission withdrawn; the analysis is a draft again.');
  }

  protected startEditing(): void {
    const { title, notes } = this.analysis();
    this.details.reset({ title, notes: notes ?? '' });
    this.editing.set(true);
  }

  protected saveDetails(): void {
    if (this.details.invalid) {
      this.details.markAllAsTouched();
      return;
    }
    const { title, notes } = this.details.getRawValue();
    this.act('Saving…', this.analysesApi.update(this.analysis().id, { title: title.trim(), notes: notes.trim() || null }), 'Title and notes saved.', () =>
      this.editing.set(false),
    );
  }

  protected remove(): void {
    const analysis = this.analysis();
    const data: ConfirmData = {
      title: 'Delete this analysis?',
      message: `“${analysis.title}” and all its ${analysis.version} version(s) will be removed from every list. The audit trail keeps a record.`,
      confirm: 'Delete analysis',
    };
    this.dialog
      .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, { data, maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter(Boolean))
      .subscribe(() => {
        this.busy.set('Deleting…');
        this.analysesApi.delete(analysis.id).subscribe({
          next: () => {
            this.busy.set(null);
            void this.announcer.announce('Analysis deleted.');
            void this.router.navigate(['/analyses']);
          },
          error: (error: unknown) => this.failed(error),
        });
      });
  }

  private act(doing: string, request: Observable<unknown>, done: string, after?: () => void): void {
    this.busy.set(doing);
    this.problem.set(null);
    request.subscribe({
      next: () => {
        this.busy.set(null);
        this.note.reset();
        after?.();
        this.center.refresh();
        void this.announcer.announce(done);
        this.changed.emit();
      },
      error: (error: unknown) => this.failed(error),
    });
  }

  private failed(error: unknown): void {
    this.busy.set(null);
    this.problem.set(apiErrorMessage(error));
  }
}
