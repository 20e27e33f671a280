import { DatePipe, JsonPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { AUDIT_ACTIONS, type AuditAction, type AuditEvent, type ListAuditQuery, type Page } from '@tallyfit/contracts';
import { catchError, of, switchMap } from 'rxjs';
import { AuditApi } from '../../../core/api/audit-api';
import { PeopleApi } from '../../../core/api/people-api';
import { failureMessage, LOADING, loadedValue, toLoadState } from '../../../core/load/load-state';
import { AUDIT_ACTION_WORDS, AUDIT_RECORD_KINDS, auditRecordWords } from './audit-words';

interface AuditFilters {
  actorId: number | null;
  action: AuditAction | null;
  entityType: string | null;
  from: Date | null;
  to: Date | null;
  page: number;
  pageSize: number;
}

const FIRST_PAGE: Pick<AuditFilters, 'page'> = { page: 1 };

/** Who changed what, and when: the audit trail, newest first, filtered by person, action, record kind and day. */
@Component({
  selector: 'tf-audit-page',
  imports: [
    DatePipe,
    JsonPipe,
    MatButtonModule,
    MatDatepickerModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
  ],
  providers: [provideNativeDateAdapter()],
  templateUrl: './audit-page.html',
  styleUrl: './audit-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditPage {
  private readonly api = inject(AuditApi);

  protected readonly filters = signal<AuditFilters>({
    actorId: null,
    action: null,
    entityType: null,
    from: null,
    to: null,
    page: 1,
    pageSize: 50,
  });
  private readonly state = toSignal(
    toObservable(this.filters).pipe(switchMap((filters) => toLoadState(this.api.list(auditQuery(filters))))),
    { initialValue: LOADING },
  );
  protected readonly loading = computed(() => this.state().status === 'loading');
  protected readonly failure = computed(() => failureMessage(this.state()));
  protected readonly shown = computed<Page<AuditEvent> | null>(() => loadedValue(this.state()));

  /** Admins may list people; a lead's list stays empty and the person filter is not offered. */
  protected readonly people = toSignal(
    inject(PeopleApi)
      .directory()
      .pipe(catchError(() => of([]))),
    { initialValue: [] },
  );
  protected readonly actions = AUDIT_ACTIONS;
  protected readonly actionWords = AUDIT_ACTION_WORDS;
  protected readonly recordWords = auditRecordWords;
  protected readonly recordKinds = AUDIT_RECORD_KINDS;
  protected readonly expanded = signal<number | null>(null);

  protected change(change: Partial<AuditFilters>): void {
    this.filters.update((filters) => ({ ...filters, ...change, ...FIRST_PAGE }));
  }

  protected onPage(event: PageEvent): void {
    this.filters.update((filters) => ({ ...filters, page: event.pageIndex + 1, pageSize: event.pageSize }));
  }

  protected toggle(event: AuditEvent): void {
    this.expanded.update((id) => (id === event.id ? null : event.id));
  }

  protected hasDetail(event: AuditEvent): boolean {
    return event.before !== null || event.after !== null;
  }
}

function auditQuery(filters: AuditFilters): Partial<ListAuditQuery> {
  const query: Partial<ListAuditQuery> = { page: filters.page, pageSize: filters.pageSize };
  if (filters.actorId !== null) query.actorId = filters.actorId;
  if (filters.action !== null) query.action = filters.action;
  if (filters.entityType !== null) query.entityType = filters.entityType;
  if (filters.from !== null) query.from = filters.from.toISOString();
  // The picked last day counts whole.
  if (filters.to !== null) query.to = new Date(filters.to.getTime() + 86_400_000 - 1).toISOString();
  return query;
}
