import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { AnalysisSummary } from '@tallyfit/contracts';
import { catchError, map, of, startWith } from 'rxjs';
import { AnalysesApi } from '../../core/api/analyses-api';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { AuthSession } from '../../core/auth/auth-session';
import { formatP } from '../../core/format/p-value';
import { AnalysisStatusChip } from '../../shared/analysis-status/analysis-status-chip';

type ListState =
  | { status: 'loading' }
  | { status: 'loaded'; analyses: AnalysisSummary[] }
  | { status: 'failed'; message: string };

/** The signed-in person's saved analyses, newest first, each with where it is in review. */
@Component({
  selector: 'tf-analyses-page',
  imports: [RouterLink, DatePipe, MatTableModule, MatButtonModule, MatProgressBarModule, AnalysisStatusChip],
  templateUrl: './analyses-page.html',
  styleUrl: './analyses-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AnalysesPage {
  private readonly user = inject(AuthSession).user;
  protected readonly columns = ['title', 'status', 'hypothesis', 'n', 'p', 'createdAt'];
  protected readonly formatP = formatP;
  protected readonly canRun = computed(() => ['analyst', 'admin'].includes(this.user()?.role ?? ''));

  private readonly state = toSignal(
    inject(AnalysesApi)
      .listOwn()
      .pipe(
        map((analyses): ListState => ({ status: 'loaded', analyses })),
        catchError((error: unknown) => of<ListState>({ status: 'failed', message: apiErrorMessage(error) })),
        startWith<ListState>({ status: 'loading' }),
      ),
    { requireSync: true },
  );
  protected readonly loading = computed(() => this.state().status === 'loading');
  protected readonly failure = computed(() => {
    const state = this.state();
    return state.status === 'failed' ? state.message : null;
  });
  protected readonly analyses = computed(() => {
    const state = this.state();
    return state.status === 'loaded' ? state.analyses : null;
  });
}
