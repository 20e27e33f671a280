import { CountPipe } from '../../shared/words/count-words';
import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, viewChild } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink } from '@angular/router';
import type { Study, StudyDetail } from '@tallyfit/contracts';
import { combineLatest, switchMap } from 'rxjs';
import { StudiesApi } from '../../core/api/studies-api';
import { AuthSession } from '../../core/auth/auth-session';
import { can } from '@tallyfit/contracts';
import { LOADING, toLoadState } from '../../core/load/load-state';
import { managesStudy } from './study-access';
import { StudyFormDialog } from './study-form-dialog';

/** Every study the person may read: find one, open it, start a new one, archive an old one. */
@Component({
  selector: 'tf-studies-page',
  imports: [
    CountPipe,
    DatePipe,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSlideToggleModule,
    MatSortModule,
    MatTableModule,
    MatTooltipModule,
  ],
  templateUrl: './studies-page.html',
  styleUrl: './studies-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StudiesPage {
  private readonly api = inject(StudiesApi);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly announcer = inject(LiveAnnouncer);
  protected readonly role = inject(AuthSession).role;

  protected readonly canCreate = computed(() => can(this.role(), 'studies.create'));
  protected readonly includeArchived = signal(false);
  private readonly reloads = signal(0);
  protected readonly filterText = signal('');

  private readonly state = toSignal(
    combineLatest([toObservable(this.includeArchived), toObservable(this.reloads)]).pipe(
      switchMap(([includeArchived]) => toLoadState(this.api.list(includeArchived))),
    ),
    { initialValue: LOADING },
  );
  protected readonly loading = computed(() => this.state().status === 'loading');
  protected readonly failure = computed(() => {
    const state = this.state();
    return state.status === 'failed' ? state.message : null;
  });
  protected readonly studies = computed(() => {
    const state = this.state();
    return state.status === 'loaded' ? state.value : null;
  });

  protected readonly columns = ['name', 'members', 'analyses', 'createdAt', 'actions'];
  protected readonly dataSource = new MatTableDataSource<Study>([]);
  private readonly sort = viewChild(MatSort);
  private readonly paginator = viewChild(MatPaginator);
  protected readonly shownCount = signal(0);

  constructor() {
    this.dataSource.filterPredicate = (study, filter) =>
      `${study.name} ${study.description ?? ''} ${study.createdBy.name}`.toLowerCase().includes(filter);
    this.dataSource.sortingDataAccessor = (study, column) => {
      switch (column) {
        case 'members':
          return study.memberCount;
        case 'analyses':
          return study.analysisCount;
        case 'createdAt':
          return study.createdAt;
        default:
          return study.name.toLowerCase();
      }
    };
    effect(() => {
      this.dataSource.data = this.studies() ?? [];
      this.shownCount.set(this.dataSource.filteredData.length);
    });
    effect(() => {
      const sort = this.sort();
      if (sort) this.dataSource.sort = sort;
    });
    effect(() => {
      const paginator = this.paginator();
      if (paginator) this.dataSource.paginator = paginator;
    });
  }

  protected manages(study: Study): boolean {
    return managesStudy(this.role(), study);
  }

  protected applyFilter(text: string): void {
    this.filterText.set(text);
    this.dataSource.filter = text.trim().toLowerCase();
    this.shownCount.set(this.dataSource.filteredData.length);
    this.dataSource.paginator?.firstPage();
  }

  protected create(): void {
    this.dialog
      .open<StudyFormDialog, undefined, StudyDetail>(StudyFormDialog, { autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((study) => {
        if (!study) return;
        void this.announcer.announce(`Study ${study.name} created.`);
        void this.router.navigate(['/studies', study.id]);
      });
  }

  protected setArchived(study: Study, archived: boolean): void {
    this.api.setArchived(study.id, archived).subscribe(() => {
      this.reloads.update((count) => count + 1);
      const message = archived ? `Study ${study.name} archived.` : `Study ${study.name} restored.`;
      const notice = this.snackBar.open(message, archived ? 'Undo' : undefined, { duration: 6000 });
      notice.onAction().subscribe(() => this.setArchived(study, false));
    });
  }
}
