import { LiveAnnouncer } from '@angular/cdk/a11y';
import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { Sort } from '@angular/material/sort';
import { ActivatedRoute, Router } from '@angular/router';
import { ANALYSIS_STATUSES, type AnalysisSummary, type Page } from '@tallyfit/contracts';
import { testNames } from '@tallyfit/engine';
import { catchError, debounceTime, distinctUntilChanged, map, of, switchMap } from 'rxjs';
import { HistoryApi } from '../../core/api/history-api';
import { PeopleApi } from '../../core/api/people-api';
import { StudiesApi } from '../../core/api/studies-api';
import { AuthSession } from '../../core/auth/auth-session';
import { can } from '@tallyfit/contracts';
import { failureMessage, LOADING, loadedValue, toLoadState } from '../../core/load/load-state';
import { AnalysesTable, type RowAction } from '../../shared/analyses-table/analyses-table';
import { ANALYSIS_STATUS_WORDS, TEST_WORDS } from '../../shared/analysis-status/analysis-status-words';
import {
  activeFilterCount,
  apiQueryFromView,
  dateOf,
  dayOf,
  DEFAULT_VIEW,
  PAGE_SIZES,
  SORT_CHOICES,
  urlFromView,
  viewFromUrl,
  type HistorySort,
  type HistoryView,
} from './history-query';
import { ReviewDialog, type ReviewDialogResult } from './review-dialog';

/**
 * The team's history: every analysis the person may read, one page at a time, sorted and filtered
 * by the API. The whole view lives in the URL, so a view can be bookmarked and shared.
 */
@Component({
  selector: 'tf-history-page',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatDatepickerModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    AnalysesTable,
  ],
  providers: [provideNativeDateAdapter()],
  templateUrl: './history-page.html',
  styleUrl: './history-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HistoryPage {
  private readonly api = inject(HistoryApi);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly dialog = inject(MatDialog);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly role = inject(AuthSession).role;

  // The query string, bound by the router (withComponentInputBinding).
  readonly page = input<string>();
  readonly pageSize = input<string>();
  readonly sort = input<string>();
  readonly order = input<string>();
  readonly studyId = input<string>();
  readonly author = input<string>();
  readonly test = input<string>();
  readonly status = input<string>();
  readonly significant = input<string>();
  readonly from = input<string>();
  readonly to = input<string>();
  readonly q = input<string>();

  protected readonly view = computed(() =>
    viewFromUrl({
      page: this.page(),
      pageSize: this.pageSize(),
      sort: this.sort(),
      order: this.order(),
      studyId: this.studyId(),
      author: this.author(),
      test: this.test(),
      status: this.status(),
      significant: this.significant(),
      from: this.from(),
      to: this.to(),
      q: this.q(),
    }),
    { equal: (a, b) => JSON.stringify(a) === JSON.stringify(b) },
  );
  protected readonly filterCount = computed(() => activeFilterCount(this.view()));
  protected readonly canReview = computed(() => can(this.role(), 'analyses.review'));
  protected readonly reloads = signal(0);

  private readonly state = toSignal(
    toObservable(computed(() => ({ view: this.view(), reload: this.reloads() }))).pipe(
      switchMap(({ view }) => toLoadState(this.api.list(apiQueryFromView(view)))),
    ),
    { initialValue: LOADING },
  );
  protected readonly loading = computed(() => this.state().status === 'loading');
  protected readonly failure = computed(() => failureMessage(this.state()));
  /** The last page that arrived, kept on screen while the next one loads. */
  protected readonly shown = signal<Page<AnalysisSummary> | null>(null);

  // Choices for the filters.
  protected readonly studies = toSignal(
    inject(StudiesApi)
      .list(true)
      .pipe(catchError(() => of([]))),
    { initialValue: [] },
  );
  protected readonly people = toSignal(
    inject(PeopleApi)
      .directory()
      .pipe(catchError(() => of([]))),
    { initialValue: [] },
  );
  protected readonly tests = testNames;
  protected readonly testWords = TEST_WORDS;
  protected readonly statuses = ANALYSIS_STATUSES;
  protected readonly statusWords = ANALYSIS_STATUS_WORDS;
  protected readonly pageSizes = PAGE_SIZES;
  protected readonly dateOf = dateOf;
  protected readonly sortChoices = SORT_CHOICES;
  protected readonly sortKey = computed(() => `${this.view().sort}-${this.view().order}`);
  protected readonly sortKeyListed = computed(() => SORT_CHOICES.some((choice) => choice.key === this.sortKey()));

  protected readonly search = new FormControl('', { nonNullable: true });
  /** On a phone the detailed filters fold away behind one button, so the list is in sight. */
  protected readonly narrow = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 599.98px)')
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  protected readonly filtersOpen = signal(false);
  protected readonly showDetailedFilters = computed(() => !this.narrow() || this.filtersOpen());
  protected readonly rowAction = (analysis: AnalysisSummary): RowAction =>
    this.canReview() && analysis.status === 'in_review' ? 'review' : 'discuss';

  constructor() {
    effect(() => {
      const page = loadedValue(this.state());
      if (!page) return;
      this.shown.set(page);
      const words = page.total === 1 ? '1 analysis matches' : `${page.total} analyses match`;
      void this.announcer.announce(`${words}.`, 'polite');
    });
    // The search box follows the URL (back button, shared links) ...
    effect(() => {
      const q = this.view().q ?? '';
      if (this.search.value.trim() !== q) this.search.setValue(q, { emitEvent: false });
    });
    // ... and the URL follows typing, once the person pauses.
    this.search.valueChanges
      .pipe(
        map((text) => text.trim()),
        debounceTime(350),
        distinctUntilChanged(),
        takeUntilDestroyed(),
      )
      .subscribe((text) => this.applyFilter({ q: text || null }));
  }

  protected applyFilter(change: Partial<HistoryView>): void {
    this.go({ ...this.view(), ...change, page: 1 });
  }

  protected onSort(sort: Sort): void {
    const column = sort.active as HistorySort;
    this.go({ ...this.view(), sort: column, order: sort.direction === 'asc' ? 'asc' : 'desc', page: 1 });
  }

  protected onSortChoice(key: string): void {
    const choice = SORT_CHOICES.find((candidate) => candidate.key === key);
    if (choice) this.go({ ...this.view(), sort: choice.sort, order: choice.order, page: 1 });
  }

  protected onPage(event: PageEvent): void {
    this.go({ ...this.view(), page: event.pageIndex + 1, pageSize: event.pageSize });
  }

  protected onDateRange(which: 'from' | 'to', date: Date | null): void {
    this.applyFilter({ [which]: date ? dayOf(date) : null });
  }

  protected clearFilters(): void {
    this.search.setValue('', { emitEvent: false });
    this.go({ ...DEFAULT_VIEW, sort: this.view().sort, order: this.view().order, pageSize: this.view().pageSize });
  }

  protected open(analysis: AnalysisSummary): void {
    this.dialog
      .open<ReviewDialog, AnalysisSummary, ReviewDialogResult>(ReviewDialog, {
        data: analysis,
        width: '720px',
        maxWidth: '95vw',
        autoFocus: 'dialog',
      })
      .afterClosed()
      .subscribe((status) => {
        if (status) this.reloads.update((count) => count + 1);
      });
  }

  private go(view: HistoryView): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: urlFromView(view) });
  }
}
