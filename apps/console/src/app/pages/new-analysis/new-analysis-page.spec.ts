import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { analyze } from '@tallyfit/engine';
import { storeSession, studyFixture } from '../../testing/fixtures';
import { NewAnalysisPage } from './new-analysis-page';

describe('NewAnalysisPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<NewAnalysisPage>;
  let root: HTMLElement;

  beforeEach(async () => {
    sessionStorage.clear();
    storeSession('analyst', 2);
    TestBed.configureTestingModule({
      imports: [NewAnalysisPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(NewAnalysisPage);
    fixture.componentRef.setInput('study', '4');
    fixture.detectChanges();
    http.expectOne('/api/v1/studies').flush([studyFixture({ id: 4, name: 'Seed colours' }), studyFixture({ id: 5, name: 'Read only', myStudyRole: 'reader' })]);
    await settle();
    root = fixture.nativeElement as HTMLElement;
  });

  afterEach(() => http.verify());

  async function settle(): Promise<void> {
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
  }

  function type(input: HTMLInputElement | HTMLTextAreaElement, value: string): void {
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  const buttons = (label: string) =>
    Array.from(root.querySelectorAll<HTMLButtonElement>('button')).filter((button) => button.textContent?.replace(/\s+/g, ' ').trim() === label);
  const visibleStep = () => root.querySelector<HTMLElement>('.mat-horizontal-stepper-content-current')!;

  async function typeCounts(counts: [string, number][]): Promise<void> {
    for (let i = 2; i < counts.length; i++) buttons('add Add a category')[0].click();
    await settle();
    const labels = root.querySelectorAll<HTMLInputElement>('tf-typed-counts input[formcontrolname="label"]');
    const values = root.querySelectorAll<HTMLInputElement>('tf-typed-counts input[formcontrolname="count"]');
    counts.forEach(([label, count], index) => {
      type(labels[index], label);
      type(values[index], String(count));
    });
    await settle();
  }

  it('keeps Next closed until the counts are complete', async () => {
    const next = buttons('Next')[0];
    expect(next.disabled).toBe(true);
    await typeCounts([
      ['green', 1752],
      ['yellow', 1895],
    ]);
    expect(next.disabled).toBe(false);
  });

  it('shows the expected counts of a ratio live and refuses one with the wrong number of terms', async () => {
    await typeCounts([
      ['round yellow', 315],
      ['round green', 108],
      ['wrinkled yellow', 101],
      ['wrinkled green', 32],
    ]);
    buttons('Next')[0].click();
    await settle();
    const radio = Array.from(visibleStep().querySelectorAll<HTMLInputElement>('input[type="radio"]')).find((input) => input.value === 'ratio')!;
    radio.click();
    await settle();
    const ratio = visibleStep().querySelector<HTMLInputElement>('input[formcontrolname="ratio"]')!;
    type(ratio, '9:3:3');
    await settle();
    expect(visibleStep().textContent).toContain('hypothesis.values has 3 entries but there are 4 categories');
    type(ratio, '9:3:3:1');
    await settle();
    // 556 observations under 9:3:3:1: 556·9/16 = 312.75, 556·3/16 = 104.25, 556/16 = 34.75 (arithmetic).
    const expected = Array.from(visibleStep().querySelectorAll('[data-testid="expected-preview"] tbody tr td:last-child')).map((cell) =>
      cell.textContent?.trim(),
    );
    expect(expected).toEqual(['312.75', '104.25', '104.25', '34.75']);
  });

  it('says the shares’ sum while they are typed', async () => {
    await typeCounts([
      ['a', 10],
      ['b', 20],
      ['c', 30],
    ]);
    buttons('Next')[0].click();
    await settle();
    Array.from(visibleStep().querySelectorAll<HTMLInputElement>('input[type="radio"]'))
      .find((input) => input.value === 'proportions')!
      .click();
    await settle();
    const shares = visibleStep().querySelectorAll<HTMLInputElement>('fieldset.values input');
    type(shares[0], '0.5');
    type(shares[1], '0.3');
    type(shares[2], '0.3');
    await settle();
    expect(visibleStep().querySelector('.sum')?.textContent).toContain('The shares add up to 1.1 — they must add up to 1.');
    type(shares[2], '0.2');
    await settle();
    expect(visibleStep().querySelector('.sum')?.textContent).toContain('The shares add up to 1.');
    expect(visibleStep().textContent).toContain('Expected counts under this hypothesis');
  });

  it('runs the analysis in the chosen study and opens the result', async () => {
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await typeCounts([
      ['green', 1752],
      ['yellow', 1895],
    ]);
    for (let step = 0; step < 3; step++) {
      buttons('Next')[step].click();
      await settle();
    }
    const title = visibleStep().querySelector<HTMLInputElement>('input[name="title"]')!;
    expect(title.value).toBe('green, yellow against equal shares');
    type(title, 'Seedling colour against a 1:1 split');
    await settle();
    buttons('Run the test')[0].click();
    const request = http.expectOne('/api/v1/analyses');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({
      title: 'Seedling colour against a 1:1 split',
      studyId: 4,
      spec: {
        observed: { labels: ['green', 'yellow'], counts: [1752, 1895] },
        hypothesis: { kind: 'equal' },
        exact: { ordering: 'probability', method: 'auto' },
        posthoc: { adjust: 'holm' },
        intervals: { method: 'wilson', level: 0.95 },
        alpha: 0.05,
      },
    });
    await settle();
    expect(visibleStep().textContent).toContain('Running the tests');
    request.flush({ id: 31, result: analyze(request.request.body.spec) });
    expect(navigate).toHaveBeenCalledWith(['/analyses', 31]);
  });

  it('stops waiting for a long run by cancelling the request, and says the server may still save it', async () => {
    await typeCounts([
      ['a', 3],
      ['b', 5],
    ]);
    for (let step = 0; step < 3; step++) {
      buttons('Next')[step].click();
      await settle();
    }
    buttons('Run the test')[0].click();
    const request = http.expectOne('/api/v1/analyses');
    await settle();
    buttons('Stop waiting')[0].click();
    await settle();
    expect(request.cancelled).toBe(true);
    expect(visibleStep().textContent).toContain('The server finishes the run it had started and saves it');
  });

  it('offers uploads only into studies the person may add to', async () => {
    buttons('Upload a file')[0].click();
    await settle();
    const select = root.querySelector<HTMLElement>('tf-data-step mat-select')!;
    select.click();
    await settle();
    const options = Array.from(document.querySelectorAll('mat-option')).map((option) => option.textContent?.trim());
    expect(options).toEqual(['Seed colours']);
  });
});
