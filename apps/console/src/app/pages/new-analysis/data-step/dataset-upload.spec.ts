import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import type { DatasetRecord } from '@tallyfit/contracts';
import { DatasetUpload, type DatasetCounts } from './dataset-upload';

const dataset: DatasetRecord = {
  id: 8,
  studyId: 4,
  fileName: 'defects.csv',
  kind: 'csv',
  sizeBytes: 120,
  sha256: 'abc',
  rowCount: 3,
  columnNames: ['unit', 'defect'],
  uploadedBy: { id: 2, name: 'Ana Analyst' },
  createdAt: '2026-12-01T10:00:00.000Z',
  columns: [
    { name: 'unit', distinctValues: 3, wholeNumbers: true, emptyCells: 0 },
    { name: 'defect', distinctValues: 2, wholeNumbers: false, emptyCells: 0 },
  ],
  preview: [
    ['1', 'scratch'],
    ['2', 'dent'],
    ['3', 'scratch'],
  ],
  offeredCounts: [],
  selectedCounts: null,
};

describe('DatasetUpload', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<DatasetUpload>;
  let root: HTMLElement;
  let emitted: (DatasetCounts | null)[];

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [DatasetUpload], providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(DatasetUpload);
    fixture.componentRef.setInput('studyId', 4);
    emitted = [];
    fixture.componentInstance.countsChange.subscribe((value) => emitted.push(value));
    root = fixture.nativeElement as HTMLElement;
    await settle();
  });

  afterEach(() => http.verify());

  async function settle(): Promise<void> {
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
  }

  const file = (name: string, text: string) => new File([text], name, { type: 'text/csv' });

  it('shows the real upload progress, then the preview and a column picker', async () => {
    fixture.componentInstance.upload(file('defects.csv', 'unit,defect\n1,scratch\n2,dent\n3,scratch\n'));
    const request = http.expectOne('/api/v1/studies/4/datasets');
    expect(request.request.body).toBeInstanceOf(FormData);
    expect((request.request.body as FormData).get('file')).toBeInstanceOf(File);
    request.event({ type: HttpEventType.UploadProgress, loaded: 30, total: 120 });
    await settle();
    expect(root.textContent).toContain('Uploading defects.csv — 25%');
    expect(root.querySelector('mat-progress-bar')?.getAttribute('aria-valuenow')).toBe('25');
    request.flush(dataset);
    await settle();
    expect(root.textContent).toContain('Stored defects.csv: 3 rows, 2 columns.');
    expect(Array.from(root.querySelectorAll('.preview th')).map((th) => th.textContent?.trim())).toEqual(['unit', 'defect']);
  });

  it('counts the categories of the chosen column before anything runs', async () => {
    fixture.componentInstance.upload(file('defects.csv', 'x'));
    http.expectOne('/api/v1/studies/4/datasets').flush(dataset);
    await settle();
    const count = Array.from(root.querySelectorAll('button')).find((button) => button.textContent?.includes('Count the categories'))!;
    count.click();
    const request = http.expectOne('/api/v1/datasets/8/columns');
    // The guess: the text column beside a whole-number column holds one observation per row.
    expect(request.request.body).toEqual({ shape: 'raw', column: 'defect' });
    request.flush({ selection: { shape: 'raw', column: 'defect' }, labels: ['scratch', 'dent'], counts: [2, 1], total: 3, skippedEmpty: 0 });
    await settle();
    expect(root.textContent).toContain('3 observations in 2 categories.');
    expect(emitted.at(-1)).toEqual({
      datasetId: 8,
      datasetName: 'defects.csv',
      selection: { shape: 'raw', column: 'defect' },
      counts: { labels: ['scratch', 'dent'], counts: [2, 1] },
    });
  });

  it('shows the API’s message for a malformed file', async () => {
    fixture.componentInstance.upload(file('broken.csv', 'a,b\n1\n'));
    http
      .expectOne('/api/v1/studies/4/datasets')
      .flush({ error: { code: 'bad_request', message: 'line 2 has 1 cell but the heading has 2' } }, { status: 400, statusText: 'Bad Request' });
    await settle();
    expect(root.querySelector('[role="alert"]')?.textContent).toContain('line 2 has 1 cell but the heading has 2');
  });

  it('refuses a file it cannot read before sending anything, and stops an upload on request', async () => {
    fixture.componentInstance.upload(file('scan.pdf', 'x'));
    await settle();
    expect(root.querySelector('[role="alert"]')?.textContent).toContain('is not a CSV, TSV, text or Excel (.xlsx) file');
    http.expectNone('/api/v1/studies/4/datasets');

    fixture.componentInstance.upload(file('defects.csv', 'x'));
    const request = http.expectOne('/api/v1/studies/4/datasets');
    await settle();
    Array.from(root.querySelectorAll('button'))
      .find((button) => button.textContent?.includes('Stop the upload'))!
      .click();
    await settle();
    expect(request.cancelled).toBe(true);
    expect(root.textContent).toContain('Upload stopped; nothing was stored.');
  });
});
