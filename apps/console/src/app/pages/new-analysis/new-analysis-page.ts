import { BreakpointObserver } from '@angular/cdk/layout';
import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, input, signal, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatStepperModule } from '@angular/material/stepper';
import { Router } from '@angular/router';
import type { AnalysisRecord, Study } from '@tallyfit/contracts';
import type { Hypothesis } from '@tallyfit/engine';
import { catchError, interval, map, type Observable, of, type Subscription, switchMap } from 'rxjs';
import { AnalysesApi } from '../../core/api/analyses-api';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { StudiesApi } from '../../core/api/studies-api';
import { AuthSession } from '../../core/auth/auth-session';
import { runsInStudy } from '../studies/study-access';
import { analysisRequest, rerunSpec, suggestedTitle } from './analysis-run';
import { LOADING, loadedValue, toLoadState, type LoadState } from '../../core/load/load-state';
import { toObservable } from '@angular/core/rxjs-interop';
import { totalOf, type DataChoice } from './data-step/data-choice';
import { DataStep } from './data-step/data-step';
import { HypothesisStep } from './hypothesis-step/hypothesis-step';
import type { AnalysisOptions } from './options-step/analysis-options';
import { OptionsStep } from './options-step/options-step';

type RunState = { state: 'idle' } | { state: 'running'; seconds: number } | { state: 'stopped' } | { state: 'failed'; message: string };

/** The guided flow: the counts, what was expected, the tests and options, then the run. */
@Component({
  selector: 'tf-new-analysis-page',
  imports: [
    DecimalPipe,
    FormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatStepperModule,
    DataStep,
    HypothesisStep,
    OptionsStep,
  ],
  templateUrl: './new-analysis-page.html',
  styleUrl: './new-analysis-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewAnalysisPage {
  private readonly analyses = inject(AnalysesApi);
  private readonly router = inject(Router);
  private readonly user = inject(AuthSession).user;
  private readonly destroyRef = inject(DestroyRef);

  /** `?study=12` from a study's page preselects that study. */
  readonly study = input<string | undefined>(undefined);
  /** `?from=34` ("change and re-run"): start from that analysis and store the run as its next version. */
  readonly from = input<string | undefined>(undefined);

  protected readonly source = toSignal(
    toObservable(this.from).pipe(
      switchMap((from): Observable<LoadState<AnalysisRecord> | null> => {
        const id = Number(from);
        return Number.isInteger(id) && id > 0 ? toLoadState(this.analyses.get(id)) : of(null);
      }),
    ),
    { initialValue: LOADING },
  );
  /** The analysis being changed, once loaded. */
  protected readonly original = computed(() => {
    const state = this.source();
    return state ? loadedValue(state) : null;
  });
  protected readonly sourceFailed = computed(() => {
    const state = this.source();
    return state?.status === 'failed' ? state.message : null;
  });
  protected readonly initialCounts = computed(() => this.original()?.spec.observed ?? null);
  protected readonly initialHypothesis = computed(() => this.original()?.spec.hypothesis ?? null);
  protected readonly initialOptions = computed(() => {
    const original = this.original();
    if (!original) return null;
    const { observed: _observed, hypothesis: _hypothesis, ...options } = original.spec;
    return options;
  });

  protected readonly narrow = toSignal(inject(BreakpointObserver).observe('(max-width: 720px)').pipe(map((state) => state.matches)), {
    initialValue: false,
  });

  /** Studies the person may add analyses to: those they own or contribute to (admins: every open one). */
  private readonly studyList = toSignal(
    inject(StudiesApi)
      .list()
      .pipe(
        map((studies) => ({ studies, failed: null as string | null })),
        catchError((error: unknown) => of({ studies: [] as Study[], failed: apiErrorMessage(error) })),
      ),
    { initialValue: { studies: [] as Study[], failed: null } },
  );
  protected readonly studies = computed(() =>
    this.studyList().studies.filter(
      (study) => runsInStudy(this.user()?.role, study),
    ),
  );
  protected readonly studiesFailed = computed(() => this.studyList().failed);

  protected readonly studyId = signal<number | null>(null);
  protected readonly data = signal<DataChoice | null>(null);
  protected readonly hypothesis = signal<Hypothesis | null>(null);
  protected readonly options = signal<AnalysisOptions | null>(null);
  protected readonly title = signal('');
  protected readonly notes = signal('');
  private titleTouched = false;
  protected readonly run = signal<RunState>({ state: 'idle' });
  /** the furthest step opened so far: a step counts as done only once the person has opened it */
  protected readonly reached = signal(0);
  protected readonly n = computed(() => totalOf(this.data()?.observed.counts ?? []));
  protected readonly ready = computed(() => !!this.data() && !!this.hypothesis() && !!this.options() && this.title().trim() !== '');
  private running: Subscription | null = null;

  constructor() {
    effect(() => {
      const wanted = Number(this.study());
      if (Number.isInteger(wanted) && wanted > 0) untracked(() => this.studyId.set(wanted));
    });
    effect(() => {
      const original = this.original();
      if (!original) return;
      untracked(() => {
        this.titleTouched = true;
        this.title.set(original.title);
        this.notes.set(original.notes ?? '');
        this.studyId.set(original.study?.id ?? null);
      });
    });
    // Offer a title once the data and the hypothesis are known, until the person writes their own.
    effect(() => {
      const data = this.data();
      const hypothesis = this.hypothesis();
      if (data && hypothesis && !this.titleTouched) this.title.set(suggestedTitle(data, hypothesis));
    });
    this.destroyRef.onDestroy(() => this.running?.unsubscribe());
  }

  protected readonly max = Math.max;

  protected setTitle(value: string): void {
    this.titleTouched = true;
    this.title.set(value);
  }

  protected start(): void {
    const data = this.data();
    const hypothesis = this.hypothesis();
    const options = this.options();
    if (!data || !hypothesis || !options || this.title().trim() === '') return;
    const original = this.original();
    const run$ = original
      ? this.newVersion(original, rerunSpec(data, hypothesis, options))
      : this.analyses.create(analysisRequest(this.title(), this.studyId(), data, hypothesis, options, this.notes()));
    this.run.set({ state: 'running', seconds: 0 });
    const clock = interval(1000).subscribe((seconds) => this.run.set({ state: 'running', seconds: seconds + 1 }));
    this.running = run$.subscribe({
      next: (analysis) => {
        clock.unsubscribe();
        void this.router.navigate(['/analyses', analysis.id]);
      },
      error: (error: unknown) => {
        clock.unsubscribe();
        this.run.set({ state: 'failed', message: apiErrorMessage(error) });
      },
    });
    this.running.add(clock);
  }

  /** Stores the changed run as the next version of `original`, then its title and notes if they were changed here. */
  private newVersion(original: AnalysisRecord, spec: ReturnType<typeof rerunSpec>): Observable<AnalysisRecord> {
    const title = this.title().trim();
    const notes = this.notes().trim() || null;
    return this.analyses.rerun(original.id, spec).pipe(
      switchMap(({ analysis }) =>
        title === analysis.title && notes === analysis.notes ? of(analysis) : this.analyses.update(analysis.id, { title, notes }),
      ),
    );
  }

  /** Unsubscribing aborts the request; the server still finishes the run it started and saves it. */
  protected stop(): void {
    this.running?.unsubscribe();
    this.running = null;
    this.run.set({ state: 'stopped' });
  }
}
