import { Clipboard } from '@angular/cdk/clipboard';
import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe, DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, numberAttribute, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { can, type Page, type WatchAlert, type WatchDetail } from '@tallyfit/contracts';
import { combineLatest, forkJoin, switchMap, timer, type Observable } from 'rxjs';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { WatchesApi, type LatestBatches } from '../../core/api/watches-api';
import { AuthSession } from '../../core/auth/auth-session';
import { formatP } from '../../core/format/p-value';
import { failureMessage, LOADING, loadedValue, toLoadState } from '../../core/load/load-state';
import { WatchStateChip } from '../../shared/watch-state/watch-state-chip';
import { ALERT_STATE_WORDS, BATCH_SOURCE_WORDS, FEED_WORDS, WATCH_STATE_MEANINGS, WATCH_STATE_WORDS } from '../../shared/watch-state/watch-words';
import { AcknowledgeDialog, type AcknowledgeDialogData } from './acknowledge-dialog';
import { UploadBatchPanel } from './upload-batch-panel';
import { WatchTimeline } from './watch-timeline';
import { alarmToAcknowledge, deliveryText, pFigure, pushExample, watchHeadline } from './watch-view';

/** How often the page asks again, so a new batch or an alarm shows without reloading. */
export const WATCH_REFRESH_MS = 15_000;
/** The charts and the table show at most this many of the latest batches. */
const BATCHES_SHOWN = 100;
const TABLE_PAGE = 10;

interface WatchView {
  watch: WatchDetail;
  /** the latest batches, oldest first */
  batches: LatestBatches;
  alerts: Page<WatchAlert>;
}

/**
 * One watch: its state and what the sequential test says, what can be done about it, the timeline,
 * the batches (each linked to its own analysis), the alerts with their deliveries, and how a
 * pipeline sends batches.
 */
@Component({
  selector: 'tf-watch-page',
  imports: [DatePipe, DecimalPipe, PercentPipe, RouterLink, MatButtonModule, MatIconModule, MatPaginatorModule, MatProgressBarModule, UploadBatchPanel, WatchStateChip, WatchTimeline],
  templateUrl: './watch-page.html',
  styleUrl: './watch-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WatchPage {
  private readonly api = inject(WatchesApi);
  private readonly dialog = inject(MatDialog);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly clipboard = inject(Clipboard);
  private readonly role = inject(AuthSession).role;

  /** From the route (`/watches/:id`). */
  readonly id = input.required({ transform: numberAttribute });
  private readonly reloads = signal(0);

  private readonly state = toSignal(
    combineLatest([toObservable(this.id), toObservable(this.reloads), timer(0, WATCH_REFRESH_MS)]).pipe(
      switchMap(([id]) => toLoadState(this.fetch(id))),
    ),
    { initialValue: LOADING },
  );
  /** What arrived last, kept on screen while the page asks again. */
  protected readonly view = signal<WatchView | null>(null);
  protected readonly loading = computed(() => this.state().status === 'loading');
  protected readonly failure = computed(() => (this.view() ? null : failureMessage(this.state())));

  protected readonly watch = computed(() => this.view()?.watch ?? null);
  protected readonly headline = computed(() => {
    const watch = this.watch();
    return watch ? watchHeadline(watch) : '';
  });
  /** Batches oldest first, for the charts. */
  protected readonly timeline = computed(() => this.view()?.batches.items ?? []);
  /** Newest first, for the table. */
  private readonly newestFirst = computed(() => [...this.timeline()].reverse());
  protected readonly tablePage = signal(0);
  protected readonly tableRows = computed(() => this.newestFirst().slice(this.tablePage() * TABLE_PAGE, (this.tablePage() + 1) * TABLE_PAGE));
  protected readonly tablePageSize = TABLE_PAGE;
  protected readonly alarmWaiting = computed(() => {
    const view = this.view();
    return view ? alarmToAcknowledge(view.watch, view.alerts.items) : null;
  });

  // By role alone: the API applies the study part of each rule and says so if it refuses.
  protected readonly canEdit = computed(() => can(this.role(), 'watches.manage'));
  protected readonly canPause = computed(() => can(this.role(), 'watches.pause'));
  protected readonly canAcknowledge = computed(() => can(this.role(), 'alerts.acknowledge'));

  protected readonly example = computed(() => {
    const watch = this.watch();
    return watch ? pushExample(location.origin, watch, new Date()) : '';
  });
  protected readonly copied = signal(false);
  protected readonly busy = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected readonly stateMeanings = WATCH_STATE_MEANINGS;
  protected readonly alertWords = ALERT_STATE_WORDS;
  protected readonly feedWords = FEED_WORDS;
  protected readonly sourceWords = BATCH_SOURCE_WORDS;
  protected readonly formatP = formatP;
  protected readonly pFigure = pFigure;
  protected readonly deliveryText = deliveryText;

  constructor() {
    effect(() => {
      const next = loadedValue(this.state());
      if (!next) return;
      const before = this.view()?.watch;
      this.view.set(next);
      // Announce a change of state that arrives by itself, not the first load.
      if (before && before.id === next.watch.id && before.state !== next.watch.state) {
        void this.announcer.announce(`The watch is now: ${WATCH_STATE_WORDS[next.watch.state]}.`, 'assertive');
      }
    });
  }

  private fetch(id: number): Observable<WatchView> {
    return forkJoin({ watch: this.api.get(id), batches: this.api.latestBatches(id, BATCHES_SHOWN), alerts: this.api.alerts(id) });
  }

  protected reload(): void {
    this.reloads.update((count) => count + 1);
  }

  protected onTablePage(event: PageEvent): void {
    this.tablePage.set(event.pageIndex);
  }

  protected pause(watch: WatchDetail): void {
    this.act('Pausing…', this.api.pause(watch.id), 'The watch is paused.');
  }

  protected resume(watch: WatchDetail, restart: boolean): void {
    this.act(
      'Resuming…',
      this.api.resume(watch.id, restart),
      restart ? 'The watch is taking batches again, with a fresh sequential test.' : 'The watch is taking batches again.',
    );
  }

  protected acknowledge(watch: WatchDetail, alert: WatchAlert): void {
    this.dialog
      .open<AcknowledgeDialog, AcknowledgeDialogData, WatchAlert>(AcknowledgeDialog, {
        data: { watchId: watch.id, watchName: watch.name, alert },
        width: '560px',
        maxWidth: '95vw',
      })
      .afterClosed()
      .subscribe((acknowledged) => {
        if (!acknowledged) return;
        void this.announcer.announce('The alarm is acknowledged.');
        this.reloads.update((count) => count + 1);
      });
  }

  protected copyExample(): void {
    this.copied.set(this.clipboard.copy(this.example()));
    void this.announcer.announce(this.copied() ? 'Example copied.' : 'The example could not be copied; select it and copy it by hand.');
  }

  private act(doing: string, request: Observable<unknown>, done: string): void {
    this.busy.set(doing);
    this.problem.set(null);
    request.subscribe({
      next: () => {
        this.busy.set(null);
        void this.announcer.announce(done);
        this.reloads.update((count) => count + 1);
      },
      error: (error: unknown) => {
        this.busy.set(null);
        this.problem.set(apiErrorMessage(error));
      },
    });
  }
}
