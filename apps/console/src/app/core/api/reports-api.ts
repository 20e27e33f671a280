import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** The files a saved analysis can be downloaded as. */
export type ReportFormat = 'markdown' | 'pdf' | 'csv' | 'segments';

const REPORT_FILES: Record<ReportFormat, string> = {
  markdown: 'report.md',
  pdf: 'report.pdf',
  csv: 'categories.csv',
  segments: 'segments.csv',
};

/** Reports over the API: the write-up as Markdown or PDF, the per-category table and the ranked segments as CSV. */
@Injectable({ providedIn: 'root' })
export class ReportsApi {
  private readonly http = inject(HttpClient);

  fileName(analysisId: number, format: ReportFormat): string {
    return `analysis-${analysisId}-${REPORT_FILES[format]}`;
  }

  download(analysisId: number, format: ReportFormat): Observable<Blob> {
    return this.http.get(`/api/v1/analyses/${analysisId}/${REPORT_FILES[format]}`, { responseType: 'blob', context: pageHandlesErrors() });
  }
}
