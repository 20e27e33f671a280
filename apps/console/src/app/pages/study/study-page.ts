import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, numberAttribute, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink } from '@angular/router';
import type { StudyDetail } from '@tallyfit/contracts';
import { combineLatest, switchMap } from 'rxjs';
import { DatasetsApi } from '../../core/api/datasets-api';
import { HistoryApi } from '../../core/api/history-api';
import { StudiesApi } from '../../core/api/studies-api';
import { AuthSession } from '../../core/auth/auth-session';
import { failureMessage, LOADING, loadedValue, toLoadState } from '../../core/load/load-state';
import { AnalysesTable } from '../../shared/analyses-table/analyses-table';
import { managesStudy, runsInStudy } from '../studies/study-access';
import { StudyFormDialog, type StudyFormData } from '../studies/study-form-dialog';
import { StudyMembers } from './study-members';

const ANALYSES_PAGE_SIZE = 10;

/** One study: what it is about, its analyses, its datasets and its members. */
@Component({
  selector: 'tf-study-page',
  imports: [
    DatePipe,
    DecimalPipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatTabsModule,
    AnalysesTable,
    StudyMembers,
  ],
  templateUrl: './study-page.html',
  styleUrl: './study-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StudyPage {
  private readonly studiesApi = inject(StudiesApi);
  private readonly historyApi = inject(HistoryApi);
  private readonly datasetsApi = inject(DatasetsApi);
  private readonly dialog = inject(MatDialog);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly role = inject(AuthSession).role;

  /** From the route (`/studies/:id`). */
  readonly id = input.required({ transform: numberAttribute });

  private readonly loadState = toSignal(toObservable(this.id).pipe(switchMap((id) => toLoadState(this.studiesApi.get(id)))), {
    initialValue: LOADING,
  });
  /** The study as last loaded or changed on this page. */
  protected readonly study = linkedSignal<StudyDetail | null>(() => loadedValue(this.loadState()));
  protected readonly loading = computed(() => this.loadState().status === 'loading');
  protected readonly failure = computed(() => failureMessage(this.loadState()));

  protected readonly manages = computed(() => {
    const study = this.study();
    return study !== null && managesStudy(this.role(), study);
  });
  protected readonly runs = computed(() => {
    const study = this.study();
    return study !== null && runsInStudy(this.role(), study);
  });

  protected readonly analysesPage = signal(1);
  protected readonly analysesPageSize = ANALYSES_PAGE_SIZE;
  protected readonly analyses = toSignal(
    combineLatest([toObservable(this.id), toObservable(this.analysesPage)]).pipe(
      switchMap(([studyId, page]) =>
        toLoadState(this.historyApi.list({ studyId: String(studyId), page, pageSize: ANALYSES_PAGE_SIZE, sort: 'date', order: 'desc' })),
      ),
    ),
    { initialValue: LOADING },
  );
  protected readonly datasets = toSignal(toObservable(this.id).pipe(switchMap((id) => toLoadState(this.datasetsApi.listInStudy(id)))), {
    initialValue: LOADING,
  });

  protected readonly analysesLoaded = computed(() => loadedValue(this.analyses()));
  protected readonly analysesFailure = computed(() => failureMessage(this.analyses()));
  protected readonly datasetsLoaded = computed(() => loadedValue(this.datasets()));
  protected readonly datasetsFailure = computed(() => failureMessage(this.datasets()));

  protected pageAnalyses(event: PageEvent): void {
    this.analysesPage.set(event.pageIndex + 1);
  }

  protected edit(study: StudyDetail): void {
    this.dialog
      .open<StudyFormDialog, StudyFormData, StudyDetail>(StudyFormDialog, { data: { study } })
      .afterClosed()
      .subscribe((updated) => {
        if (!updated) return;
        this.study.set(updated);
        void this.announcer.announce('Study saved.');
      });
  }

  protected setArchived(study: StudyDetail, archived: boolean): void {
    this.studiesApi.setArchived(study.id, archived).subscribe((updated) => {
      this.study.set(updated);
      void this.announcer.announce(archived ? 'Study archived.' : 'Study restored.');
    });
  }
}
