import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { DeferBlockBehavior, TestBed, type ComponentFixture } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import type { AnalysisChanges, AnalysisRecord, Role } from '@tallyfit/contracts';
import { analyze, type AnalysisSpec } from '@tallyfit/engine';
import { storeSession } from '../../testing/fixtures';
import { stubIntersectionObserver } from '../../testing/intersection-observer-stub';
import { AnalysisPage } from './analysis-page';

/** An invented defect tally whose last two categories are expected to be sparse. */
const sparseSpec: AnalysisSpec = {
  observed: { labels: ['scratch', 'dent', 'stain', 'crack', 'chip'], counts: [52, 30, 14, 2, 2] },
  hypothesis: { kind: 'proportions', values: [0.5, 0.3, 0.15, 0.03, 0.02] },
};

function record(change: Partial<AnalysisRecord> = {}, spec: AnalysisSpec = sparseSpec): AnalysisRecord {
  const result = analyze(spec);
  return {
    id: 21,
    title: 'Defects this month against the usual mix',
    notes: null,
    engineVersion: result.engineVersion,
    author: { id: 2, name: 'Ana Analyst' },
    study: { id: 4, name: 'Line 3 quality' },
    datasetId: null,
    status: 'draft',
    version: 1,
    seriesId: 21,
    previousId: null,
    isLatest: true,
    createdAt: '2026-12-01T10:00:00.000Z',
    updatedAt: '2026-12-01T10:00:00.000Z',
    spec,
    result,
    ...change,
  };
}

describe('AnalysisPage', () => {
  beforeAll(stubIntersectionObserver);

  let http: HttpTestingController;
  let fixture: ComponentFixture<AnalysisPage>;
  let root: HTMLElement;

  async function render(role: Role, analysis = record(), changes: AnalysisChanges | null = null): Promise<void> {
    sessionStorage.clear();
    storeSession(role, 2);
    TestBed.configureTestingModule({
      imports: [AnalysisPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
      deferBlockBehavior: DeferBlockBehavior.Manual,
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(AnalysisPage);
    fixture.componentRef.setInput('id', analysis.id);
    fixture.detectChanges();
    TestBed.tick();
    http.expectOne(`/api/v1/analyses/${analysis.id}`).flush(analysis);
    await settle();
    if (analysis.previousId !== null) {
      http.expectOne(`/api/v1/analyses/${analysis.id}/changes`).flush(changes);
      await settle();
    }
    root = fixture.nativeElement as HTMLElement;
  }

  async function settle(): Promise<void> {
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
  }

  // The review panel, the comment thread and the notifications bell load their own lists; these tests are about the result.
  const flushReviewThreads = () => {
    for (const request of http.match((candidate) => /\/analyses\/\d+\/(reviews|comments)$|\/notifications$/.test(candidate.url))) {
      if (!request.cancelled) request.flush([]);
    }
  };
  afterEach(() => {
    flushReviewThreads();
    http.verify();
  });

  const button = (label: string, prefix = false) =>
    Array.from(root.querySelectorAll<HTMLButtonElement>('button')).find((b) => {
      const words = b.textContent?.replace(/\s+/g, ' ').trim() ?? '';
      return prefix ? words.includes(label) : words.endsWith(label);
    });
  const text = (selector: string) => root.querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim();

  it('puts the decision in plain words and the tests side by side', async () => {
    await render('analyst');
    expect(text('.headline h2')).toBe('These data could not detect a difference from what was expected.');
    expect(text('.headline')).toContain('This does not show that the expectation holds.');
    expect(Array.from(root.querySelectorAll('.tests tbody th')).map((th) => th.textContent?.replace(/\s+/g, ' ').trim())).toEqual([
      "Pearson's chi-square",
      'G-test (likelihood ratio)',
      // With sparse expected counts the engine rests the decision on the exact test.
      'Exact multinomial test decision rests on this',
    ]);
    expect(text('[data-testid="df"]')).toBe('4');
  });

  it('shows the failed assumption check and the proposed merge', async () => {
    await render('analyst');
    expect(text('tf-assumption-check .status')).toContain('Some expected counts are too small');
    expect(text('tf-assumption-check .merge')).toContain('“crack” + “chip”');
  });

  it('merges the sparse categories as a new run and shows what changed', async () => {
    await render('analyst');
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    button('Merge these and run again')!.click();
    const rerun = http.expectOne('/api/v1/analyses/21/rerun');
    const spec = rerun.request.body.spec as AnalysisSpec;
    expect(spec.observed).toEqual({ labels: ['scratch', 'dent', 'stain', 'crack + chip'], counts: [52, 30, 14, 4] });
    expect(spec.mergedCategories).toEqual([{ label: 'crack + chip', members: ['crack', 'chip'] }]);
    const next = record({ id: 22, version: 2, previousId: 21 }, spec);
    const changes: AnalysisChanges = {
      previousId: 21,
      engineVersion: { before: next.engineVersion, after: next.engineVersion, changed: false },
      specChanged: true,
      tests: [],
      decision: { before: false, after: false, changed: false },
      summary: ['The categories changed from 5 (scratch, dent, stain, crack, chip) to 4 (scratch, dent, stain, crack + chip).'],
    };
    rerun.flush({ analysis: next, changes });
    expect(navigate).toHaveBeenCalledWith(['/analyses', 22]);
    fixture.componentRef.setInput('id', 22);
    await settle();
    // The re-run's own answer opens the new version: no second request (AnalysesApi keeps what was just stored).
    http.expectNone('/api/v1/analyses/22');
    http.expectOne('/api/v1/analyses/22/changes').flush(changes);
    await settle();
    expect(text('.changes')).toContain('What changed since version 1');
    expect(text('.changes')).toContain('“crack”, “chip” → “crack + chip”');
    expect(text('.changes')).toContain('The categories changed from 5');
  });

  it('keeps what changed after a reload, read from the stored versions', async () => {
    const changes: AnalysisChanges = {
      previousId: 20,
      engineVersion: { before: '0.1.4', after: '0.2.0', changed: true },
      specChanged: false,
      tests: [],
      decision: { before: false, after: false, changed: false },
      summary: ['Computed again with engine 0.2.0 (it was 0.1.4).'],
    };
    await render('analyst', record({ version: 2, previousId: 20 }), changes);
    expect(text('.changes')).toContain('What changed since version 1');
    expect(text('.changes')).toContain('Computed again with engine 0.2.0 (it was 0.1.4).');
  });

  it('offers a run on the current engine only when the stored result came from another engine version', async () => {
    await render('analyst');
    expect(button('Run again on the current engine', true)).toBeUndefined();
    TestBed.resetTestingModule();
    await render('analyst', record({ engineVersion: '0.1.4' }));
    expect(button('Run again on the current engine', true)).toBeDefined();
  });

  it('adds the exact test when that is the remedy', async () => {
    const spec: AnalysisSpec = { ...sparseSpec, tests: ['pearson'] };
    await render('analyst', record({}, spec));
    button('Run again with the exact test')?.click();
    const rerun = http.expectOne('/api/v1/analyses/21/rerun');
    expect(rerun.request.body.spec.tests).toEqual(['pearson', 'exact']);
    rerun.flush({}, { status: 500, statusText: 'Server Error' });
    await settle();
    expect(text('[role="alert"]')).toContain('500');
  });

  it('submits a draft for review', async () => {
    await render('analyst');
    button('Submit for review')!.click();
    http.expectOne('/api/v1/analyses/21/submit').flush(record({ status: 'in_review' }));
    await settle();
    http.expectOne('/api/v1/analyses/21').flush(record({ status: 'in_review' }));
    await settle();
    expect(button('Submit for review')).toBeUndefined();
  });

  it('downloads the write-up as a file', async () => {
    await render('viewer');
    const createObjectURL = jest.fn(() => 'blob:report');
    Object.assign(URL, { createObjectURL, revokeObjectURL: jest.fn() });
    const click = jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    button('Markdown')!.click();
    const request = http.expectOne('/api/v1/analyses/21/report.md');
    expect(request.request.responseType).toBe('blob');
    request.flush(new Blob(['# Report']));
    expect(createObjectURL).toHaveBeenCalled();
    expect(click).toHaveBeenCalled();
  });

  it('offers a viewer reading and downloads only', async () => {
    await render('viewer');
    for (const label of ['Run again on the current engine', 'Submit for review', 'Share by e-mail', 'Merge these and run again']) {
      expect(button(label)).toBeUndefined();
    }
    expect(button('PDF')).toBeDefined();
    expect(text('.cautions')).toContain('A small p-value does not mean a large or important difference');
  });

  it('says so when the analysis cannot be read', async () => {
    sessionStorage.clear();
    storeSession('viewer', 2);
    TestBed.configureTestingModule({
      imports: [AnalysisPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
      deferBlockBehavior: DeferBlockBehavior.Manual,
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(AnalysisPage);
    fixture.componentRef.setInput('id', 99);
    fixture.detectChanges();
    TestBed.tick();
    http
      .expectOne('/api/v1/analyses/99')
      .flush({ error: { code: 'not_found', message: 'analysis 99 does not exist' } }, { status: 404, statusText: 'Not Found' });
    await settle();
    root = fixture.nativeElement as HTMLElement;
    expect(text('[role="alert"]')).toContain('analysis 99 does not exist');
  });
});
