import { HttpClient, HttpEventType, type HttpEvent } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { CategoryCounts, CountSelection, DatasetRecord, DatasetSummary } from '@tallyfit/contracts';
import { filter, map, type Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** One step of an upload: how far it is, or the dataset the API stored. */
export type UploadProgress = { state: 'sending'; fraction: number | null } | { state: 'stored'; dataset: DatasetRecord };

/**
 * Datasets over the API: upload a file into a study (with progress), read one, count its
 * categories by a chosen column or columns, run an analysis on it. The pages show these failures themselves.
 */
@Injectable({ providedIn: 'root' })
export class DatasetsApi {
  private readonly http = inject(HttpClient);

  upload(studyId: number, file: File): Observable<UploadProgress> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http
      .post<DatasetRecord>(`/api/v1/studies/${studyId}/datasets`, body, {
        reportProgress: true,
        observe: 'events',
        context: pageHandlesErrors(),
      })
      .pipe(
        map((event: HttpEvent<DatasetRecord>): UploadProgress | null => {
          if (event.type === HttpEventType.UploadProgress) {
            return { state: 'sending', fraction: event.total ? event.loaded / event.total : null };
          }
          if (event.type === HttpEventType.Response && event.body) return { state: 'stored', dataset: event.body };
          return null;
        }),
        filter((progress): progress is UploadProgress => progress !== null),
      );
  }

  get(id: number): Observable<DatasetRecord> {
    return this.http.get<DatasetRecord>(`/api/v1/datasets/${id}`, { context: pageHandlesErrors() });
  }

  listInStudy(studyId: number): Observable<DatasetSummary[]> {
    return this.http.get<DatasetSummary[]>(`/api/v1/studies/${studyId}/datasets`, { context: pageHandlesErrors() });
  }

  /** Chooses the column(s) that hold the categories; the API keeps the choice and answers with the counts. */
  countCategories(id: number, selection: CountSelection): Observable<CategoryCounts> {
    return this.http.post<CategoryCounts>(`/api/v1/datasets/${id}/columns`, selection, { context: pageHandlesErrors() });
  }
}
