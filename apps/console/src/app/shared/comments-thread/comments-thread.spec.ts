import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { storeSession } from '../../testing/fixtures';
import { CommentsThread } from './comments-thread';

describe('CommentsThread', () => {
  let http: HttpTestingController;

  function render() {
    sessionStorage.clear();
    storeSession('viewer');
    TestBed.configureTestingModule({ imports: [CommentsThread], providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(CommentsThread);
    fixture.componentRef.setInput('analysisId', 9);
    fixture.detectChanges();
    TestBed.tick();
    return fixture;
  }

  afterEach(() => http.verify());

  it('shows comments and decisions in order and posts a new comment', () => {
    const fixture = render();
    http.expectOne('/api/v1/analyses/9/comments').flush([
      { id: 1, analysisId: 9, body: 'Which week is this?', author: { id: 3, name: 'Lee Lead' }, createdAt: '2026-11-22T10:05:00Z' },
    ]);
    http.expectOne('/api/v1/analyses/9/reviews').flush([
      { id: 1, analysisId: 9, decision: 'submitted', comment: null, by: { id: 2, name: 'Ana Analyst' }, createdAt: '2026-11-22T10:00:00Z' },
    ]);
    fixture.detectChanges();
    const root = fixture.nativeElement as HTMLElement;
    const items = Array.from(root.querySelectorAll('li')).map((li) => li.textContent?.replace(/\s+/g, ' '));
    expect(items[0]).toContain('Ana Analyst submitted it for review');
    expect(items[1]).toContain('Which week is this?');

    const box = root.querySelector('textarea') as HTMLTextAreaElement;
    box.value = '  The week of 16 November.  ';
    box.dispatchEvent(new Event('input'));
    root.querySelector('form')!.dispatchEvent(new Event('submit'));
    const post = http.expectOne('/api/v1/analyses/9/comments');
    expect(post.request.method).toBe('POST');
    expect(post.request.body).toEqual({ body: 'The week of 16 November.' });
    post.flush({ id: 2, analysisId: 9, body: 'The week of 16 November.', author: { id: 1, name: 'Viewer Person' }, createdAt: '2026-11-22T11:00:00Z' });
    fixture.detectChanges();
    expect(root.querySelectorAll('li').length).toBe(3);
    expect(box.value).toBe('');
  });

  it('does not post an empty comment', () => {
    const fixture = render();
    http.expectOne('/api/v1/analyses/9/comments').flush([]);
    http.expectOne('/api/v1/analyses/9/reviews').flush([]);
    fixture.detectChanges();
    (fixture.nativeElement as HTMLElement).querySelector('form')!.dispatchEvent(new Event('submit'));
    http.expectNone('/api/v1/analyses/9/comments');
    expect(fixture.nativeElement.textContent).toContain('No comments yet.');
  });

  it('shows why the thread could not be loaded', () => {
    const fixture = render();
    http.expectOne('/api/v1/analyses/9/comments').flush({ error: { code: 'not_found', message: 'analysis 9 does not exist' } }, { status: 404, statusText: 'Not Found' });
    // The reviews call was sent beside it; the thread gave up on it when the first call failed.
    expect(http.expectOne('/api/v1/analyses/9/reviews').cancelled).toBe(true);
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain('analysis 9 does not exist');
  });
});
