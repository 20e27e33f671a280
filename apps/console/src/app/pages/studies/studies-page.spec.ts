import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { storeSession, studyFixture } from '../../testing/fixtures';
import { StudiesPage } from './studies-page';

describe('StudiesPage', () => {
  let http: HttpTestingController;

  function render(role: 'admin' | 'lead' | 'analyst' | 'viewer') {
    sessionStorage.clear();
    storeSession(role);
    TestBed.configureTestingModule({
      imports: [StudiesPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(StudiesPage);
    fixture.detectChanges();
    return fixture;
  }

  afterEach(() => http.verify());

  const text = (fixture: { nativeElement: HTMLElement }) => fixture.nativeElement.textContent ?? '';
  const buttons = (fixture: { nativeElement: HTMLElement }) =>
    Array.from(fixture.nativeElement.querySelectorAll('button')).map((b) => b.textContent?.trim());

  it('lists the studies with their counts and offers a new study to analysts', async () => {
    const fixture = render('analyst');
    http.expectOne('/api/v1/studies').flush([studyFixture(), studyFixture({ id: 5, name: 'Survey panel make-up', myStudyRole: 'reader' })]);
    await fixture.whenStable();
    fixture.detectChanges();
    expect(text(fixture)).toContain('Checkout traffic split');
    expect(text(fixture)).toContain('Survey panel make-up');
    expect(buttons(fixture)).toContain('add New study');
    // Only the study the analyst owns can be archived by them.
    expect(fixture.nativeElement.querySelectorAll('button[aria-label^="Archive"]').length).toBe(1);
  });

  it('filters the rows by the typed text', async () => {
    const fixture = render('lead');
    http.expectOne('/api/v1/studies').flush([studyFixture(), studyFixture({ id: 5, name: 'Survey panel make-up', description: null })]);
    await fixture.whenStable();
    fixture.detectChanges();
    const input = fixture.nativeElement.querySelector('input[type=search]') as HTMLInputElement;
    input.value = 'survey';
    input.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    const rows = fixture.nativeElement.querySelectorAll('tr.mat-mdc-row');
    expect(rows.length).toBe(1);
    expect(rows[0].textContent).toContain('Survey panel make-up');
  });

  it('offers a viewer nothing that changes studies', async () => {
    const fixture = render('viewer');
    http.expectOne('/api/v1/studies').flush([studyFixture({ myStudyRole: 'reader' })]);
    await fixture.whenStable();
    fixture.detectChanges();
    expect(buttons(fixture).filter((label) => /New study|Archive|Restore/.test(label ?? ''))).toEqual([]);
  });

  it('says so when there are no studies, in words that fit the role', async () => {
    const fixture = render('viewer');
    http.expectOne('/api/v1/studies').flush([]);
    await fixture.whenStable();
    fixture.detectChanges();
    expect(text(fixture)).toContain('You are not a member of any study yet.');
  });

  it('shows the API’s message when the list cannot be loaded', async () => {
    const fixture = render('lead');
    http.expectOne('/api/v1/studies').flush({ error: { code: 'internal', message: 'database is busy' } }, { status: 503, statusText: 'Unavailable' });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain('database is busy');
  });

  it('asks for archived studies too when the switch is on, and archives through the API', async () => {
    const fixture = render('admin');
    http.expectOne('/api/v1/studies').flush([studyFixture({ myStudyRole: null })]);
    await fixture.whenStable();
    fixture.detectChanges();
    (fixture.nativeElement.querySelector('button[aria-label="Archive Checkout traffic split"]') as HTMLButtonElement).click();
    const archive = http.expectOne('/api/v1/studies/4');
    expect(archive.request.method).toBe('PATCH');
    expect(archive.request.body).toEqual({ archived: true });
    archive.flush(studyFixture({ archived: true }));
    TestBed.tick();
    http.expectOne('/api/v1/studies').flush([]);

    (fixture.nativeElement.querySelector('[role=switch]') as HTMLButtonElement).click();
    TestBed.tick();
    http.expectOne('/api/v1/studies?includeArchived=true').flush([studyFixture({ archived: true })]);
  });
});
