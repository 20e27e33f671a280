import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { AnalysisRecord, Comment, Review } from '@tallyfit/contracts';
import type { Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** Review decisions and comments on one analysis. */
@Injectable({ providedIn: 'root' })
export class ReviewsApi {
  private readonly http = inject(HttpClient);

  /** The author hands the analysis to a lead. */
  submit(analysisId: number, comment?: string): Observable<AnalysisRecord> {
    return this.http.post<AnalysisRecord>(`/api/v1/analyses/${analysisId}/submit`, withComment(comment));
  }

  /** The author takes a submission back to draft while it waits. */
  withdraw(analysisId: number): Observable<AnalysisRecord> {
    return this.http.post<AnalysisRecord>(`/api/v1/analyses/${analysisId}/withdraw`, {}, { context: pageHandlesErrors() });
  }

  signOff(analysisId: number, comment?: string): Observable<AnalysisRecord> {
    return this.http.post<AnalysisRecord>(`/api/v1/analyses/${analysisId}/sign-off`, withComment(comment), {
      context: pageHandlesErrors(),
    });
  }

  /** Back to the author; the comment says why and is required. */
  returnToAuthor(analysisId: number, comment: string): Observable<AnalysisRecord> {
    return this.http.post<AnalysisRecord>(`/api/v1/analyses/${analysisId}/return`, { comment }, { context: pageHandlesErrors() });
  }

  reviews(analysisId: number): Observable<Review[]> {
    return this.http.get<Review[]>(`/api/v1/analyses/${analysisId}/reviews`, { context: pageHandlesErrors() });
  }

  comments(analysisId: number): Observable<Comment[]> {
    return this.http.get<Comment[]>(`/api/v1/analyses/${analysisId}/comments`, { context: pageHandlesErrors() });
  }

  addComment(analysisId: number, body: string): Observable<Comment> {
    return this.http.post<Comment>(`/api/v1/analyses/${analysisId}/comments`, { body }, { context: pageHandlesErrors() });
  }
}

function withComment(comment: string | undefined): { comment?: string } {
  const trimmed = comment?.trim();
  return trimmed ? { comment: trimmed } : {};
}
