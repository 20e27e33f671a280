import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import { analysisSummaryFixture, storeSession } from '../../testing/fixtures';
import { ReviewDialog } from './review-dialog';

describe('ReviewDialog', () => {
  let http: HttpTestingController;
  let close: jest.Mock;

  function render(role: 'lead' | 'analyst', status: 'in_review' | 'draft' = 'in_review') {
    sessionStorage.clear();
    storeSession(role);
    close = jest.fn();
    TestBed.configureTestingModule({
      imports: [ReviewDialog],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: MAT_DIALOG_DATA, useValue: analysisSummaryFixture({ status }) },
        { provide: MatDialogRef, useValue: { close } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ReviewDialog);
    fixture.detectChanges();
    TestBed.tick();
    http.expectOne('/api/v1/analyses/11/comments').flush([]);
    http.expectOne('/api/v1/analyses/11/reviews').flush([]);
    fixture.detectChanges();
    return fixture;
  }

  const button = (root: HTMLElement, words: string) =>
    Array.from(root.querySelectorAll('button')).find((b) => b.textContent?.includes(words)) as HTMLButtonElement | undefined;

  afterEach(() => http.verify());

  it('signs off with the optional note and shows the new state', () => {
    const fixture = render('lead');
    const root = fixture.nativeElement as HTMLElement;
    const note = root.querySelector('textarea') as HTMLTextAreaElement;
    note.value = 'Clear and complete.';
    note.dispatchEvent(new Event('input'));
    button(root, 'Sign off')!.click();
    const request = http.expectOne('/api/v1/analyses/11/sign-off');
    expect(request.request.body).toEqual({ comment: 'Clear and complete.' });
    request.flush({ ...analysisSummaryFixture(), status: 'signed_off' });
    TestBed.tick();
    http.expectOne('/api/v1/analyses/11/comments').flush([]);
    http.expectOne('/api/v1/analyses/11/reviews').flush([]);
    fixture.detectChanges();
    expect(root.textContent).toContain('Signed off');
    expect(button(root, 'Sign off')).toBeUndefined();
    button(root, 'Close')!.click();
    expect(close).toHaveBeenCalledWith('signed_off');
  });

  it('will not return an analysis without saying why', () => {
    const fixture = render('lead');
    const root = fixture.nativeElement as HTMLElement;
    button(root, 'Return for changes')!.click();
    fixture.detectChanges();
    http.expectNone('/api/v1/analyses/11/return');
    expect(root.querySelector('[role=alert]')?.textContent).toContain('Say what the author should change');
  });

  it('shows the API’s refusal, for instance when someone else decided first', () => {
    const fixture = render('lead');
    const root = fixture.nativeElement as HTMLElement;
    const note = root.querySelector('textarea') as HTMLTextAreaElement;
    note.value = 'Use the census shares of this year.';
    note.dispatchEvent(new Event('input'));
    button(root, 'Return for changes')!.click();
    http
      .expectOne('/api/v1/analyses/11/return')
      .flush({ error: { code: 'conflict', message: 'analysis 11 is signed off, so it cannot be returned' } }, { status: 409, statusText: 'Conflict' });
    fixture.detectChanges();
    expect(root.querySelector('[role=alert]')?.textContent).toContain('cannot be returned');
  });

  it('offers no decision to an analyst, nor on an analysis that is not waiting for review', () => {
    expect(button(render('analyst').nativeElement, 'Sign off')).toBeUndefined();
    TestBed.resetTestingModule();
    expect(button(render('lead', 'draft').nativeElement, 'Sign off')).toBeUndefined();
  });
});
