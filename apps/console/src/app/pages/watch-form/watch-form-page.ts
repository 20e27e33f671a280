import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, numberAttribute, signal, untracked } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import type { WatchDetail } from '@tallyfit/contracts';
import type { Hypothesis } from '@tallyfit/engine';
import { catchError, map, of, switchMap, type Observable } from 'rxjs';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { ConnectionsApi } from '../../core/api/connections-api';
import { StudiesApi } from '../../core/api/studies-api';
import { WatchesApi } from '../../core/api/watches-api';
import { LOADING, toLoadState, type LoadState } from '../../core/load/load-state';
import { FEED_WORDS } from '../../shared/watch-state/watch-words';
import { HypothesisStep } from '../new-analysis/hypothesis-step/hypothesis-step';
import { createRequestFrom, draftFromWatch, hypothesisWords, labelsFrom, nextRuns, updateRequestFrom, type FeedKind, type WatchDraft } from './watch-draft';

const EMPTY_DRAFT: WatchDraft = {
  studyId: null,
  name: '',
  description: '',
  labels: '',
  alpha: 0.05,
  feedKind: 'push',
  connectionId: null,
  query: '',
  schedule: '0 * * * *',
  timezone: Intl.DateTimeFormat().resolvedOptions().timeZone ?? '',
  webhookUrl: '',
  webhookSecret: '',
};

/** Sets up a new watch (`/watches/new`) or changes one (`/watches/:id/edit`): what is counted, what is expected, where the counts come from, where alerts go. */
@Component({
  selector: 'tf-watch-form-page',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    MatSelectModule,
    HypothesisStep,
  ],
  templateUrl: './watch-form-page.html',
  styleUrl: './watch-form-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WatchFormPage {
  private readonly api = inject(WatchesApi);
  private readonly router = inject(Router);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly fb = inject(NonNullableFormBuilder);

  /** From the route when changing a watch (`/watches/:id/edit`); absent for a new one. */
  readonly id = input(undefined, { transform: (value: unknown) => (value === undefined ? undefined : numberAttribute(value)) });

  protected readonly existing = toSignal(
    toObservable(this.id).pipe(
      switchMap((id): Observable<LoadState<WatchDetail | null>> => (id === undefined ? of({ status: 'loaded', value: null }) : toLoadState(this.api.get(id)))),
    ),
    { initialValue: LOADING },
  );
  protected readonly watch = computed(() => {
    const state = this.existing();
    return state.status === 'loaded' ? state.value : null;
  });
  /** Categories and hypothesis are fixed once a batch has arrived. */
  protected readonly fixed = computed(() => (this.watch()?.batchCount ?? 0) > 0);

  protected readonly studies = toSignal(
    inject(StudiesApi)
      .list(false)
      .pipe(catchError(() => of([]))),
    { initialValue: [] },
  );
  protected readonly connections = toSignal(
    inject(ConnectionsApi)
      .list()
      .pipe(
        map((list) => ({ list, problem: null as string | null })),
        catchError((error: unknown) => of({ list: [], problem: apiErrorMessage(error) })),
      ),
    { initialValue: { list: [], problem: null } },
  );

  protected readonly form = this.fb.group({
    studyId: this.fb.control<number | null>(EMPTY_DRAFT.studyId),
    name: this.fb.control(EMPTY_DRAFT.name),
    description: this.fb.control(EMPTY_DRAFT.description),
    labels: this.fb.control(EMPTY_DRAFT.labels),
    alpha: this.fb.control<number | null>(EMPTY_DRAFT.alpha),
    feedKind: this.fb.control<FeedKind>(EMPTY_DRAFT.feedKind),
    connectionId: this.fb.control<number | null>(EMPTY_DRAFT.connectionId),
    query: this.fb.control(EMPTY_DRAFT.query),
    schedule: this.fb.control(EMPTY_DRAFT.schedule),
    timezone: this.fb.control(EMPTY_DRAFT.timezone),
    webhookUrl: this.fb.control(EMPTY_DRAFT.webhookUrl),
    webhookSecret: this.fb.control(EMPTY_DRAFT.webhookSecret),
  });
  private readonly values = toSignal(this.form.valueChanges.pipe(map(() => this.form.getRawValue())), { initialValue: this.form.getRawValue() });

  protected readonly labels = computed(() => labelsFrom(this.values().labels));
  /** The categories for the hypothesis step: no counts yet, they arrive batch by batch. */
  protected readonly categories = computed(() => {
    const labels = this.labels();
    return labels.length >= 2 ? { labels, counts: labels.map(() => 0) } : null;
  });
  protected readonly hypothesis = signal<Hypothesis | null>(null);
  protected readonly feedKind = computed(() => this.values().feedKind);
  protected readonly runs = computed(() => nextRuns(this.values().schedule, this.values().timezone));
  protected readonly feedKinds: FeedKind[] = ['push', 'pull', 'upload'];
  protected readonly feedWords = FEED_WORDS;
  protected readonly hypothesisWords = hypothesisWords;
  protected readonly feedHints: Record<FeedKind, string> = {
    push: 'A pipeline posts each period’s counts with an API token.',
    pull: 'Tallyfit runs a read-only query against your own database on a schedule.',
    upload: 'Files added on the watch’s page, one batch each.',
  };

  protected readonly errors = signal<string[]>([]);
  protected readonly saving = signal(false);

  constructor() {
    // A watch being changed fills the form once it has arrived.
    effect(() => {
      const watch = this.watch();
      if (!watch) return;
      untracked(() => {
        this.form.setValue(draftFromWatch(watch));
        this.form.controls.studyId.disable();
        if (watch.batchCount > 0) this.form.controls.labels.disable();
      });
    });
  }

  protected save(): void {
    const draft = this.form.getRawValue();
    const watch = this.watch();
    let request: Observable<WatchDetail>;
    if (watch) {
      const outcome = updateRequestFrom(watch, draft, this.hypothesis());
      if (!outcome.ok) return this.refuse(outcome.errors);
      request = this.api.update(watch.id, outcome.request);
    } else {
      const outcome = createRequestFrom(draft, this.hypothesis());
      if (!outcome.ok) return this.refuse(outcome.errors);
      request = this.api.create(outcome.request);
    }
    this.errors.set([]);
    this.saving.set(true);
    request.subscribe({
      next: (saved) => {
        this.saving.set(false);
        void this.announcer.announce(watch ? 'The watch is saved.' : `The watch “${saved.name}” is set up.`);
        void this.router.navigate(['/watches', saved.id]);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        this.errors.set([apiErrorMessage(error)]);
      },
    });
  }

  private refuse(errors: string[]): void {
    this.errors.set(errors);
    void this.announcer.announce(`The watch cannot be saved yet: ${errors.join(' ')}`, 'assertive');
  }
}
