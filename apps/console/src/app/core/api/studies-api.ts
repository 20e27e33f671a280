import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type {
  AddStudyMemberRequest,
  CreateStudyRequest,
  Study,
  StudyDetail,
  StudyRole,
  UpdateStudyRequest,
} from '@tallyfit/contracts';
import type { Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** Studies and their members over the API. Reads are shown by the page; changes fail through the notifier. */
@Injectable({ providedIn: 'root' })
export class StudiesApi {
  private readonly http = inject(HttpClient);

  list(includeArchived = false): Observable<Study[]> {
    const params = includeArchived ? new HttpParams().set('includeArchived', 'true') : undefined;
    return this.http.get<Study[]>('/api/v1/studies', { params, context: pageHandlesErrors() });
  }

  get(id: number): Observable<StudyDetail> {
    return this.http.get<StudyDetail>(`/api/v1/studies/${id}`, { context: pageHandlesErrors() });
  }

  create(request: CreateStudyRequest): Observable<StudyDetail> {
    return this.http.post<StudyDetail>('/api/v1/studies', request, { context: pageHandlesErrors() });
  }

  update(id: number, change: UpdateStudyRequest): Observable<StudyDetail> {
    return this.http.patch<StudyDetail>(`/api/v1/studies/${id}`, change);
  }

  setArchived(id: number, archived: boolean): Observable<StudyDetail> {
    return this.update(id, { archived });
  }

  addMember(id: number, request: AddStudyMemberRequest): Observable<StudyDetail> {
    return this.http.post<StudyDetail>(`/api/v1/studies/${id}/members`, request);
  }

  changeMemberRole(id: number, userId: number, studyRole: StudyRole): Observable<StudyDetail> {
    return this.http.patch<StudyDetail>(`/api/v1/studies/${id}/members/${userId}`, { studyRole });
  }

  removeMember(id: number, userId: number): Observable<void> {
    return this.http.delete<void>(`/api/v1/studies/${id}/members/${userId}`);
  }
}
