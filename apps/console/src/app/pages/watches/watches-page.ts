import { DatePipe } from '@angular/common';
import { LiveAnnouncer } from '@angular/cdk/a11y';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { can, WATCH_STATES, type Page, type Watch } from '@tallyfit/contracts';
import { catchError, debounceTime, distinctUntilChanged, map, of, switchMap } from 'rxjs';
import { StudiesApi } from '../../core/api/studies-api';
import { WatchesApi } from '../../core/api/watches-api';
import { AuthSession } from '../../core/auth/auth-session';
import { failureMessage, LOADING, loadedValue, toLoadState } from '../../core/load/load-state';
import { WatchStateChip } from '../../shared/watch-state/watch-state-chip';
import { ALERT_STATE_WORDS, FEED_WORDS, WATCH_STATE_WORDS } from '../../shared/watch-state/watch-words';
import {
  apiQueryFromWatchesView,
  intakeText,
  sequentialPText,
  urlFromWatchesView,
  WATCHES_PAGE_SIZE,
  watchesFilterCount,
  watchesViewFromUrl,
  type WatchesView,
} from './watches-view';

/**
 * Every watch the person may read, with its state, latest batch, sequential p and whether an alarm
 * waits for a lead. The filters live in the address.
 */
@Component({
  selector: 'tf-watches-page',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    WatchStateChip,
  ],
  templateUrl: './watches-page.html',
  styleUrl: './watches-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WatchesPage {
  private readonly api = inject(WatchesApi);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly role = inject(AuthSession).role;

  // The query string, bound by the router (withComponentInputBinding).
  readonly page = input<string>();
  readonly studyId = input<string>();
  readonly state = input<string>();
  readonly waiting = input<string>();
  readonly q = input<string>();

  protected readonly view = computed(
    () => watchesViewFromUrl({ page: this.page(), studyId: this.studyId(), state: this.state(), waiting: this.waiting(), q: this.q() }),
    { equal: (a, b) => JSON.stringify(a) === JSON.stringify(b) },
  );
  protected readonly filterCount = computed(() => watchesFilterCount(this.view()));
  protected readonly canCreate = computed(() => can(this.role(), 'watches.manage'));
  protected readonly canConnect = computed(() => can(this.role(), 'connections.manage'));

  private readonly loadState = toSignal(
    toObservable(this.view).pipe(switchMap((view) => toLoadState(this.api.list(apiQueryFromWatchesView(view))))),
    { initialValue: LOADING },
  );
  protected readonly loading = computed(() => this.loadState().status === 'loading');
  protected readonly failure = computed(() => failureMessage(this.loadState()));
  /** The last page that arrived, kept on screen while the next one loads. */
  protected readonly shown = signal<Page<Watch> | null>(null);

  protected readonly studies = toSignal(
    inject(StudiesApi)
      .list(true)
      .pipe(catchError(() => of([]))),
    { initialValue: [] },
  );
  protected readonly states = WATCH_STATES;
  protected readonly stateWords = WATCH_STATE_WORDS;
  protected readonly alertWords = ALERT_STATE_WORDS;
  protected readonly feedWords = FEED_WORDS;
  protected readonly pageSize = WATCHES_PAGE_SIZE;
  protected readonly sequentialPText = sequentialPText;
  protected readonly intakeText = intakeText;

  protected readonly search = new FormControl('', { nonNullable: true });

  constructor() {
    effect(() => {
      const page = loadedValue(this.loadState());
      if (!page) return;
      this.shown.set(page);
      const alarms = page.items.filter((watch) => watch.state === 'alarm').length;
      const words = page.total === 1 ? '1 watch' : `${page.total} watches`;
      void this.announcer.announce(`${words}${alarms > 0 ? `, ${alarms} raising an alarm on this page` : ''}.`, 'polite');
    });
    effect(() => {
      const q = this.view().q ?? '';
      if (this.search.value.trim() !== q) this.search.setValue(q, { emitEvent: false });
    });
    this.search.valueChanges
      .pipe(
        map((text) => text.trim()),
        debounceTime(350),
        distinctUntilChanged(),
        takeUntilDestroyed(),
      )
      .subscribe((text) => this.applyFilter({ q: text || null }));
  }

  protected applyFilter(change: Partial<WatchesView>): void {
    this.go({ ...this.view(), ...change, page: 1 });
  }

  protected onPage(event: PageEvent): void {
    this.go({ ...this.view(), page: event.pageIndex + 1 });
  }

  protected clearFilters(): void {
    this.search.setValue('', { emitEvent: false });
    this.go(watchesViewFromUrl({}));
  }

  private go(view: WatchesView): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: urlFromWatchesView(view) });
  }
}
