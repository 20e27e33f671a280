import { DatePipe, DecimalPipe } from '@angular/common';
import { LiveAnnouncer } from '@angular/cdk/a11y';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, numberAttribute, type OnInit, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import type { AnalysisChanges, AnalysisRecord } from '@tallyfit/contracts';
import { ENGINE_VERSION, type AnalysisSpec } from '@tallyfit/engine';
import { catchError, combineLatest, of, switchMap } from 'rxjs';
import { AnalysesApi } from '../../core/api/analyses-api';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { ReportsApi, type ReportFormat } from '../../core/api/reports-api';
import { AuthSession } from '../../core/auth/auth-session';
import { can } from '@tallyfit/contracts';
import { saveFile } from '../../core/files/save-file';
import { LOADING, toLoadState } from '../../core/load/load-state';
import { NotificationsCenter } from '../../core/notifications/notifications-center';
import { CountPipe } from '../../shared/words/count-words';
import { AnalysisStatusChip } from '../../shared/analysis-status/analysis-status-chip';
import { AssumptionCheckPanel, type Remedy } from './assumption-check';
import { CategoriesTable } from './categories-table';
import { mergedRun, withExactTest } from './category-merge';
import { headlineFor } from './headline';
import { ResultCharts } from './result-charts';
import { SegmentsPanel } from './segments-panel';
import { ShareDialog, type ShareDialogData } from './share-dialog';
import { testRows } from './test-rows';
import { ReviewPanel } from './review-panel';
import { WriteUp } from './write-up';
import { CommentsThread } from '../../shared/comments-thread/comments-thread';

/** Why the person re-ran, kept for the version it produced (the changes themselves come from the API). */
interface RerunNote {
  id: number;
  what: string;
}

/**
 * One saved analysis: the headline in plain words, the tests side by side, the assumption check
 * with its remedies, the categories, charts and write-up, and what can be done with it next.
 */
@Component({
  selector: 'tf-analysis-page',
  imports: [
    CountPipe,
    DatePipe,
    DecimalPipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    AnalysisStatusChip,
    AssumptionCheckPanel,
    CategoriesTable,
    ResultCharts,
    SegmentsPanel,
    ReviewPanel,
    CommentsThread,
    WriteUp,
  ],
  templateUrl: './analysis-page.html',
  styleUrl: './analysis-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AnalysisPage implements OnInit {
  private readonly api = inject(AnalysesApi);
  private readonly reports = inject(ReportsApi);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly user = inject(AuthSession).user;

  /** From the route (`/analyses/:id`). */
  readonly id = input.required({ transform: numberAttribute });
  private readonly reload = signal(0);

  protected readonly state = toSignal(
    combineLatest([toObservable(this.id), toObservable(this.reload)]).pipe(switchMap(([id]) => toLoadState(this.api.get(id)))),
    { initialValue: LOADING },
  );
  protected readonly analysis = computed(() => {
    const state = this.state();
    return state.status === 'loaded' ? state.value : null;
  });
  protected readonly headline = computed(() => {
    const analysis = this.analysis();
    return analysis ? headlineFor(analysis.result) : null;
  });
  protected readonly tests = computed(() => {
    const analysis = this.analysis();
    return analysis ? testRows(analysis.result, analysis.spec.williams ?? false) : [];
  });
  protected readonly canRun = computed(() => can(this.user()?.role, 'analyses.run'));
  /** The API lets everyone but viewers e-mail an analysis they can read. */
  protected readonly canShare = computed(() => can(this.user()?.role, 'analyses.share'));
  /** Counts review decisions made on this page, so the panel and the thread read the history again. */
  protected readonly reviewKey = signal(0);
  protected readonly fileStem = computed(() => `analysis-${this.id()}`);

  protected readonly busy = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);
  private readonly rerunNote = signal<RerunNote | null>(null);
  /** What this version changed against the one it re-ran, read from the stored versions so a reload keeps it. */
  private readonly storedChanges = toSignal(
    toObservable(this.analysis).pipe(
      switchMap((analysis) => (analysis?.previousId ? this.api.changes(analysis.id).pipe(catchError(() => of(null))) : of(null))),
    ),
    { initialValue: null },
  );
  protected readonly changes = computed((): { what: string; changes: AnalysisChanges } | null => {
    const changes = this.storedChanges();
    if (!changes) return null;
    const note = this.rerunNote();
    return { what: note && note.id === this.id() ? note.what : '', changes };
  });
  /** Re-running on today's engine only makes sense when the stored result came from another engine version. */
  protected readonly engineChanged = computed(() => {
    const analysis = this.analysis();
    return !!analysis && analysis.engineVersion !== ENGINE_VERSION;
  });
  protected readonly currentEngine = ENGINE_VERSION;

  protected remedy(analysis: AnalysisRecord, remedy: Remedy): void {
    if (remedy.kind === 'exact') {
      this.runAgain(analysis, withExactTest(analysis.spec), 'Run again with the exact test added.');
      return;
    }
    try {
      const merged = mergedRun(analysis.spec, remedy.plan);
      this.runAgain(analysis, merged.spec, `Run again with categories merged: ${merged.lines.join('; ')}.`);
    } catch (error) {
      this.problem.set(apiErrorMessage(error));
    }
  }

  protected rerunOnCurrentEngine(analysis: AnalysisRecord): void {
    this.runAgain(analysis, undefined, 'Run again with the current engine.');
  }

  private runAgain(analysis: AnalysisRecord, spec: AnalysisSpec | undefined, what: string): void {
    this.busy.set('Running again…');
    this.problem.set(null);
    this.api.rerun(analysis.id, spec).subscribe({
      next: ({ analysis: next }) => {
        this.busy.set(null);
        this.rerunNote.set({ id: next.id, what });
        void this.announcer.announce(`${what} Version ${next.version} is shown.`);
        void this.router.navigate(['/analyses', next.id]);
      },
      error: (error: unknown) => {
        this.busy.set(null);
        this.problem.set(apiErrorMessage(error));
      },
    });
  }

  private readonly notifications = inject(NotificationsCenter);
  private readonly destroyRef = inject(DestroyRef);

  /**
   * A decision someone else makes on this analysis arrives as a notification: when a newer one for
   * it comes in, the page reads the analysis and its history again, so the person sitting on it sees it.
   */
  ngOnInit(): void {
    let newestSeen: { analysisId: number; notificationId: number } | null = null;
    this.notifications.latest.pipe(takeUntilDestroyed(this.destroyRef)).subscribe((page) => {
      const analysisId = this.id();
      const newest = page.items.find((item) => item.analysis.id === analysisId)?.id ?? 0;
      if (newestSeen?.analysisId === analysisId && newest > newestSeen.notificationId) this.reviewChanged();
      newestSeen = { analysisId, notificationId: newest };
    });
  }

  /** A review decision or an edit in the review panel: read the analysis and its history again. */
  protected reviewChanged(): void {
    this.reviewKey.update((count) => count + 1);
    this.reload.update((count) => count + 1);
  }

  protected share(analysis: AnalysisRecord): void {
    const data: ShareDialogData = { analysisId: analysis.id, title: analysis.title };
    this.dialog
      .open<ShareDialog, ShareDialogData, string[]>(ShareDialog, { data, width: '560px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((sentTo) => {
        if (sentTo?.length) void this.announcer.announce(`Sent to ${sentTo.join(', ')}.`);
        if (sentTo?.length) this.sentTo.set(sentTo);
      });
  }
  protected readonly sentTo = signal<string[] | null>(null);

  protected download(format: ReportFormat): void {
    const id = this.id();
    this.problem.set(null);
    this.busy.set('Preparing the file…');
    this.reports.download(id, format).subscribe({
      next: (blob) => {
        this.busy.set(null);
        saveFile(blob, this.reports.fileName(id, format));
      },
      error: (error: unknown) => {
        this.busy.set(null);
        this.problem.set(apiErrorMessage(error));
      },
    });
  }
}
