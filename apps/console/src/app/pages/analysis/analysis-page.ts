import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, numberAttribute } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { AnalysisRecord } from '@tallyfit/contracts';
import { catchError, map, of, startWith, switchMap } from 'rxjs';
import { AnalysesApi } from '../../core/api/analyses-api';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { formatP, formatStatistic } from '../../core/format/p-value';
import { verdictFor } from './verdict';

type LoadState = { analysis?: AnalysisRecord; error?: string; loading: boolean };

/** One saved analysis: the decision in plain words and the test behind it. */
@Component({
  selector: 'tf-analysis-page',
  imports: [DatePipe, DecimalPipe, MatCardModule, MatProgressBarModule],
  templateUrl: './analysis-page.html',
  styleUrl: './analysis-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AnalysisPage {
  private readonly api = inject(AnalysesApi);

  /** From the route (`/analyses/:id`). */
  readonly id = input.required({ transform: numberAttribute });

  private readonly state = toSignal(
    toObservable(this.id).pipe(
      switchMap((id) =>
        this.api.get(id).pipe(
          map((analysis): LoadState => ({ analysis, loading: false })),
          catchError((error: unknown) => of<LoadState>({ error: apiErrorMessage(error), loading: false })),
          startWith<LoadState>({ loading: true }),
        ),
      ),
    ),
    { initialValue: { loading: true } as LoadState },
  );

  protected readonly loading = computed(() => this.state().loading);
  protected readonly error = computed(() => this.state().error);
  protected readonly analysis = computed(() => this.state().analysis);
  protected readonly alpha = computed(() => this.analysis()?.spec.alpha ?? 0.05);
  protected readonly pearson = computed(() => this.analysis()?.result.tests.pearson);
  protected readonly verdict = computed(() => {
    const pearson = this.pearson();
    return pearson ? verdictFor(pearson.p, this.alpha()) : null;
  });
  protected readonly formatP = formatP;
  protected readonly formatStatistic = formatStatistic;
}
