import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { ShareDialog } from './share-dialog';

describe('ShareDialog', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<ShareDialog>;
  let root: HTMLElement;
  const close = jest.fn();

  beforeEach(async () => {
    close.mockReset();
    TestBed.configureTestingModule({
      imports: [ShareDialog],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MAT_DIALOG_DATA, useValue: { analysisId: 21, title: 'Defects this month' } },
        { provide: MatDialogRef, useValue: { close } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ShareDialog);
    root = fixture.nativeElement as HTMLElement;
    await settle();
  });

  afterEach(() => http.verify());

  async function settle(): Promise<void> {
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
  }

  async function fill(name: string, value: string): Promise<void> {
    const field = root.querySelector<HTMLTextAreaElement>(`textarea[name="${name}"]`)!;
    field.value = value;
    field.dispatchEvent(new Event('input'));
    await settle();
  }

  const send = () => root.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();

  it('names a wrong address and sends nothing', async () => {
    await fill('to', 'lead@example.org, not-an-address');
    send();
    await settle();
    expect(root.querySelector('[role="alert"]')?.textContent).toContain('“not-an-address” is not an e-mail address.');
    http.expectNone('/api/v1/analyses/21/shares');
  });

  it('sends to the addresses with the message and closes with them', async () => {
    await fill('to', 'lead@example.org; Qa@Example.org');
    await fill('message', 'For Monday’s review.');
    send();
    const request = http.expectOne('/api/v1/analyses/21/shares');
    expect(request.request.body).toEqual({ to: ['lead@example.org', 'qa@example.org'], message: 'For Monday’s review.' });
    request.flush({ id: 1, analysisId: 21, to: ['lead@example.org', 'qa@example.org'], status: 'sent' });
    expect(close).toHaveBeenCalledWith(['lead@example.org', 'qa@example.org']);
  });

  it('shows why the mail did not go out and stays open', async () => {
    await fill('to', 'lead@example.org');
    send();
    http
      .expectOne('/api/v1/analyses/21/shares')
      .flush({ error: { code: 'bad_gateway', message: 'the mail server did not accept the message' } }, { status: 502, statusText: 'Bad Gateway' });
    await settle();
    expect(root.querySelector('[role="alert"]')?.textContent).toContain('the mail server did not accept the message');
    expect(close).not.toHaveBeenCalled();
  });
});
