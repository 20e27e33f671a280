import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { analysisSummaryFixture, storeSession, studyFixture } from '../../testing/fixtures';
import { StudyPage } from './study-page';

describe('StudyPage', () => {
  let http: HttpTestingController;

  async function render(role: 'admin' | 'lead' | 'analyst' | 'viewer', study = studyFixture()) {
    sessionStorage.clear();
    storeSession(role);
    TestBed.configureTestingModule({
      imports: [StudyPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(StudyPage);
    fixture.componentRef.setInput('id', study.id);
    fixture.detectChanges();
    TestBed.tick();
    http.expectOne(`/api/v1/studies/${study.id}`).flush(study);
    http.expectOne((r) => r.url === '/api/v1/analyses' && r.params.get('studyId') === String(study.id)).flush({
      items: [analysisSummaryFixture()],
      total: 1,
      page: 1,
      pageSize: 10,
    });
    http.expectOne(`/api/v1/studies/${study.id}/datasets`).flush([]);
    await fixture.whenStable();
    fixture.detectChanges();
    return fixture;
  }

  afterEach(() => http.verify());

  const labels = (root: HTMLElement) =>
    Array.from(root.querySelectorAll('a, button')).map((el) => el.textContent?.replace(/\s+/g, ' ').trim());

  it('shows the study, its analyses and the owner’s actions', async () => {
    const fixture = await render('analyst');
    const root = fixture.nativeElement as HTMLElement;
    expect(root.querySelector('h1')?.textContent).toContain('Checkout traffic split');
    expect(root.textContent).toContain('Sign-up form: equal traffic?');
    const newAnalysis = root.querySelector<HTMLAnchorElement>('a[href^="/analyses/new"]');
    expect(newAnalysis?.getAttribute('href')).toBe('/analyses/new?study=4');
    expect(labels(root)).toEqual(expect.arrayContaining(['edit Rename', 'archive Archive']));
  });

  it('offers a reader no way to change the study or run in it', async () => {
    const fixture = await render('viewer', studyFixture({ myStudyRole: 'reader' }));
    const root = fixture.nativeElement as HTMLElement;
    expect(root.querySelector('a[href^="/analyses/new"]')).toBeNull();
    expect(labels(root).filter((label) => /Rename|Archive|Restore|Add a member/.test(label ?? ''))).toEqual([]);
  });

  it('does not offer a new analysis in an archived study', async () => {
    const fixture = await render('admin', studyFixture({ archived: true, myStudyRole: null }));
    const root = fixture.nativeElement as HTMLElement;
    expect(root.querySelector('a[href^="/analyses/new"]')).toBeNull();
    expect(root.textContent).toContain('This study is archived');
    expect(labels(root)).toContain('unarchive Restore');
  });

  it('archives through the API and shows the stored state', async () => {
    const fixture = await render('analyst');
    const archive = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('button')).find((b) =>
      b.textContent?.includes('Archive'),
    )!;
    archive.click();
    const request = http.expectOne('/api/v1/studies/4');
    expect(request.request.body).toEqual({ archived: true });
    request.flush(studyFixture({ archived: true, archivedAt: '2026-11-23T10:00:00.000Z' }));
    fixture.detectChanges();
    expect(fixture.nativeElement.textContent).toContain('This study is archived');
  });

  it('shows the API’s message when the study cannot be read', async () => {
    sessionStorage.clear();
    storeSession('viewer');
    TestBed.configureTestingModule({
      imports: [StudyPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(StudyPage);
    fixture.componentRef.setInput('id', 9);
    fixture.detectChanges();
    TestBed.tick();
    http.expectOne('/api/v1/studies/9').flush({ error: { code: 'not_found', message: 'study 9 does not exist' } }, { status: 404, statusText: 'Not Found' });
    http.expectOne((r) => r.url === '/api/v1/analyses').flush({ items: [], total: 0, page: 1, pageSize: 10 });
    http.expectOne('/api/v1/studies/9/datasets').flush([]);
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain('study 9 does not exist');
  });
});
