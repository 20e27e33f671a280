import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router } from '@angular/router';
import type { AnalysisSummary } from '@tallyfit/contracts';
import { AnalysesApi } from '../../core/api/analyses-api';
import { AuthSession } from '../../core/auth/auth-session';
import { failureMessage, LOADING, loadedValue, toLoadState } from '../../core/load/load-state';
import { AnalysesTable, type RowAction } from '../../shared/analyses-table/analyses-table';
import { reviewQueue } from './review-queue';

/** The review queue: analyses waiting for the signed-in reviewer's decision, the longest waiting first. */
@Component({
  selector: 'tf-reviews-page',
  imports: [MatProgressBarModule, AnalysesTable],
  template: `
    <h1>To review</h1>
    <p class="lead">Work submitted for review that you may sign off or return, the longest waiting first.</p>
    @if (loading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the review queue" />
    } @else if (failure(); as message) {
      <p class="error" role="alert">{{ message }}</p>
    } @else if (queue(); as rows) {
      @if (rows.length === 0) {
        <p class="empty">Nothing is waiting for your review.</p>
      } @else {
        <tf-analyses-table
          [analyses]="rows"
          label="Analyses waiting for review"
          sortActive="date"
          sortDirection="asc"
          [rowAction]="rowAction"
          (opened)="open($event)"
        />
      }
    }
  `,
  styles: `
    .error {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewsPage {
  private readonly router = inject(Router);
  private readonly user = inject(AuthSession).user;
  private readonly state = toSignal(toLoadState(inject(AnalysesApi).listInReview()), { initialValue: LOADING });

  protected readonly loading = computed(() => this.state().status === 'loading');
  protected readonly failure = computed(() => failureMessage(this.state()));
  protected readonly queue = computed(() => {
    const waiting = loadedValue(this.state());
    return waiting ? reviewQueue(waiting, this.user()?.id ?? null) : null;
  });
  protected readonly rowAction = (): RowAction => 'review';

  protected open(analysis: AnalysisSummary): void {
    void this.router.navigate(['/analyses', analysis.id]);
  }
}
