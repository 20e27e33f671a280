import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, viewChild } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { ROLES, type Person, type Role } from '@tallyfit/contracts';
import { switchMap } from 'rxjs';
import { PeopleApi } from '../../../core/api/people-api';
import { AuthSession } from '../../../core/auth/auth-session';
import { failureMessage, LOADING, loadedValue, toLoadState } from '../../../core/load/load-state';
import { PersonFormDialog } from './person-form-dialog';
import { ROLE_WORDS } from './role-words';

/** Everyone who can sign in: add people, change their role, disable or enable their account. */
@Component({
  selector: 'tf-people-page',
  imports: [
    DatePipe,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
  ],
  templateUrl: './people-page.html',
  styleUrl: './people-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeoplePage {
  private readonly api = inject(PeopleApi);
  private readonly dialog = inject(MatDialog);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly me = inject(AuthSession).user;

  private readonly reloads = signal(0);
  private readonly state = toSignal(toObservable(this.reloads).pipe(switchMap(() => toLoadState(this.api.list()))), {
    initialValue: LOADING,
  });
  protected readonly loading = computed(() => this.state().status === 'loading');
  protected readonly failure = computed(() => failureMessage(this.state()));
  protected readonly people = computed(() => loadedValue(this.state()));

  protected readonly roles = ROLES;
  protected readonly roleWords = ROLE_WORDS;
  protected readonly columns = ['name', 'role', 'state', 'createdAt'];
  protected readonly dataSource = new MatTableDataSource<Person>([]);
  private readonly sort = viewChild(MatSort);
  protected readonly filterText = signal('');

  constructor() {
    this.dataSource.filterPredicate = (person, filter) => `${person.name} ${person.email} ${person.role}`.toLowerCase().includes(filter);
    this.dataSource.sortingDataAccessor = (person, column) =>
      column === 'createdAt' ? person.createdAt : column === 'role' ? ROLES.indexOf(person.role) : person.name.toLowerCase();
    effect(() => (this.dataSource.data = this.people() ?? []));
    effect(() => {
      const sort = this.sort();
      if (sort) this.dataSource.sort = sort;
    });
  }

  protected roleName(role: Role): string {
    return ROLE_WORDS[role].name;
  }

  protected isMe(person: Person): boolean {
    return person.id === this.me()?.id;
  }

  protected applyFilter(text: string): void {
    this.filterText.set(text);
    this.dataSource.filter = text.trim().toLowerCase();
  }

  protected add(): void {
    this.dialog
      .open<PersonFormDialog, undefined, Person>(PersonFormDialog)
      .afterClosed()
      .subscribe((person) => {
        if (!person) return;
        this.reloads.update((count) => count + 1);
        void this.announcer.announce(`${person.name} added as ${ROLE_WORDS[person.role].name.toLowerCase()}.`);
      });
  }

  protected changeRole(person: Person, role: Role): void {
    if (role === person.role) return;
    this.api.update(person.id, { role }).subscribe({
      next: (stored) => {
        this.replace(stored);
        void this.announcer.announce(`${stored.name} is now ${ROLE_WORDS[stored.role].name.toLowerCase()}.`);
      },
      // The notifier said why; put back the role the API still holds.
      error: () => this.replace({ ...person }),
    });
  }

  protected setDisabled(person: Person, disabled: boolean): void {
    this.api.update(person.id, { disabled }).subscribe((stored) => {
      this.replace(stored);
      void this.announcer.announce(disabled ? `${stored.name} can no longer sign in.` : `${stored.name} can sign in again.`);
    });
  }

  private replace(person: Person): void {
    this.dataSource.data = this.dataSource.data.map((row) => (row.id === person.id ? person : row));
  }
}
