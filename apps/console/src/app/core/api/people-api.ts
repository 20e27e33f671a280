import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { CreatePersonRequest, Person, UpdatePersonRequest } from '@tallyfit/contracts';
import type { Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

export type DirectoryEntry = Pick<Person, 'id' | 'name' | 'email' | 'role'>;

/** People over the API: the admin's list, creating a person, changing a name, role or access. */
@Injectable({ providedIn: 'root' })
export class PeopleApi {
  private readonly http = inject(HttpClient);

  list(): Observable<Person[]> {
    return this.http.get<Person[]>('/api/v1/people', { context: pageHandlesErrors() });
  }

  /** Active people's names, e-mails and roles, for choosing study members (any role may ask). */
  directory(): Observable<DirectoryEntry[]> {
    return this.http.get<DirectoryEntry[]>('/api/v1/people/directory', { context: pageHandlesErrors() });
  }

  create(request: CreatePersonRequest): Observable<Person> {
    return this.http.post<Person>('/api/v1/people', request, { context: pageHandlesErrors() });
  }

  update(id: number, change: UpdatePersonRequest): Observable<Person> {
    return this.http.patch<Person>(`/api/v1/people/${id}`, change);
  }
}
