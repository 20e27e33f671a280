import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHeaderHarness } from '@angular/material/sort/testing';
import { provideRouter, Router, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { AnalysisSummary } from '@tallyfit/contracts';
import { analysisSummaryFixture, storeSession, studyFixture } from '../../testing/fixtures';
import { HistoryPage } from './history-page';

describe('HistoryPage', () => {
  let http: HttpTestingController;
  let harness: RouterTestingHarness;

  async function open(role: 'lead' | 'analyst' | 'viewer', url = '/history') {
    sessionStorage.clear();
    storeSession(role);
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'history', component: HistoryPage }], withComponentInputBinding()),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url, HistoryPage);
    http.expectOne('/api/v1/studies?includeArchived=true').flush([studyFixture()]);
    http.expectOne('/api/v1/people/directory').flush([{ id: 2, name: 'Ana Analyst', email: 'ana@example.org', role: 'analyst' }]);
  }

  function expectList(): TestRequest {
    TestBed.tick();
    return http.expectOne((request) => request.url === '/api/v1/analyses');
  }

  async function answer(request: TestRequest, items: AnalysisSummary[], total = items.length) {
    request.flush({ items, total, page: 1, pageSize: 25 });
    await harness.fixture.whenStable();
    harness.detectChanges();
  }

  const url = () => TestBed.inject(Router).url;
  const text = () => (harness.routeNativeElement as HTMLElement).textContent ?? '';

  afterEach(() => http.verify());

  it('asks for the view in the URL and shows the page it gets', async () => {
    await open('lead', '/history?status=in_review&q=weekday&sort=p&order=asc&page=2');
    const request = expectList();
    expect(request.request.params.get('status')).toBe('in_review');
    expect(request.request.params.get('q')).toBe('weekday');
    expect(request.request.params.get('sort')).toBe('p');
    expect(request.request.params.get('order')).toBe('asc');
    expect(request.request.params.get('page')).toBe('2');
    await answer(request, [analysisSummaryFixture()], 30);
    expect(text()).toContain('30 analyses');
    expect(text()).toContain('Sign-up form: equal traffic?');
    expect(text()).toContain('Waiting for review');
  });

  it('puts a chosen filter in the URL and starts again at page one', async () => {
    await open('lead', '/history?page=3');
    await answer(expectList(), [analysisSummaryFixture()]);
    const loader = TestbedHarnessEnvironment.loader(harness.fixture);
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Review' }));
    const review = (await field.getControl(MatSelectHarness))!;
    await review.open();
    await review.clickOptions({ text: 'Signed off' });
    await harness.fixture.whenStable();
    expect(url()).toBe('/history?status=signed_off');
    const request = expectList();
    expect(request.request.params.get('status')).toBe('signed_off');
    expect(request.request.params.get('page')).toBe('1');
    await answer(request, []);
    expect(text()).toContain('No analysis matches these filters.');
  });

  it('sorts on the server when a column header is chosen', async () => {
    await open('lead');
    await answer(expectList(), [analysisSummaryFixture()]);
    const header = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatSortHeaderHarness.with({ label: 'Run by' }));
    await header.click();
    await harness.fixture.whenStable();
    expect(url()).toBe('/history?sort=author&order=asc');
    const request = expectList();
    expect(request.request.params.get('sort')).toBe('author');
    await answer(request, [analysisSummaryFixture()]);
  });

  it('searches once typing pauses', async () => {
    await open('lead');
    await answer(expectList(), []);
    const input = (harness.routeNativeElement as HTMLElement).querySelector('input[type=search]') as HTMLInputElement;
    input.value = 'pan';
    input.dispatchEvent(new Event('input'));
    input.value = 'panel';
    input.dispatchEvent(new Event('input'));
    expect(url()).toBe('/history');
    await new Promise((resolve) => setTimeout(resolve, 450));
    await harness.fixture.whenStable();
    expect(url()).toBe('/history?q=panel');
    await answer(expectList(), []);
  });

  it('offers leads the review action on analyses waiting for it, and analysts only comments', async () => {
    await open('lead');
    await answer(expectList(), [analysisSummaryFixture(), analysisSummaryFixture({ id: 12, title: 'Defects by shift', status: 'draft' })]);
    const buttons = () => Array.from((harness.routeNativeElement as HTMLElement).querySelectorAll('td button')).map((b) => b.getAttribute('aria-label'));
    expect(buttons()).toEqual(['Review Sign-up form: equal traffic?', 'Comments on Defects by shift']);
    expect(text()).toContain('Only those waiting for review');
  });

  it('gives a viewer no review controls', async () => {
    await open('viewer');
    await answer(expectList(), [analysisSummaryFixture()]);
    expect(text()).not.toContain('Only those waiting for review');
    const labels = Array.from((harness.routeNativeElement as HTMLElement).querySelectorAll('td button')).map((b) => b.textContent);
    expect(labels.join(' ')).not.toContain('Review');
  });

  it('shows the API’s message when the history cannot be loaded', async () => {
    await open('lead');
    expectList().flush({ error: { code: 'validation', message: 'to must be a date' } }, { status: 400, statusText: 'Bad Request' });
    await harness.fixture.whenStable();
    harness.detectChanges();
    expect((harness.routeNativeElement as HTMLElement).querySelector('[role=alert]')?.textContent).toContain('to must be a date');
  });
});
