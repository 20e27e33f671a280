import { Clipboard } from '@angular/cdk/clipboard';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import type { ApiToken } from '@tallyfit/contracts';
import { of } from 'rxjs';
import { storeSession } from '../../testing/fixtures';
import { TokensPage } from './tokens-page';

const token = (change: Partial<ApiToken> = {}): ApiToken => ({
  id: 7,
  name: 'nightly split check',
  hint: 'tf_ab12',
  owner: { id: 1, name: 'Analyst Person' },
  createdAt: '2026-11-20T10:00:00.000Z',
  lastUsedAt: null,
  revokedAt: null,
  ...change,
});

describe('TokensPage', () => {
  let http: HttpTestingController;
  let copy: jest.Mock;
  let confirm: boolean;

  async function render(role: 'admin' | 'analyst') {
    sessionStorage.clear();
    storeSession(role);
    copy = jest.fn().mockReturnValue(true);
    confirm = true;
    TestBed.configureTestingModule({
      imports: [TokensPage],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: Clipboard, useValue: { copy } },
        { provide: MatDialog, useValue: { open: () => ({ afterClosed: () => of(confirm) }) } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(TokensPage);
    fixture.detectChanges();
    TestBed.tick();
    return fixture;
  }

  const button = (root: HTMLElement, words: string) =>
    Array.from(root.querySelectorAll('button')).find((b) => b.textContent?.includes(words)) as HTMLButtonElement;

  afterEach(() => http.verify());

  it('makes a token, shows its secret once with a copy button, and lists it', async () => {
    const fixture = await render('analyst');
    http.expectOne('/api/v1/tokens?owner=me').flush([]);
    fixture.detectChanges();
    const root = fixture.nativeElement as HTMLElement;
    expect(root.textContent).toContain('No tokens yet.');
    const input = root.querySelector('input') as HTMLInputElement;
    input.value = 'nightly split check';
    input.dispatchEvent(new Event('input'));
    root.querySelector('form')!.dispatchEvent(new Event('submit'));
    const create = http.expectOne('/api/v1/tokens');
    expect(create.request.body).toEqual({ name: 'nightly split check' });
    create.flush({ ...token(), token: 'tf_ab12-the-whole-secret' });
    TestBed.tick();
    http.expectOne('/api/v1/tokens?owner=me').flush([token()]);
    fixture.detectChanges();
    expect(root.querySelector('[data-testid=new-token]')?.textContent).toBe('tf_ab12-the-whole-secret');
    expect(root.textContent).toContain('it will not be shown again');
    // The emptied field after a successful save is not an error.
    expect(root.textContent).not.toContain('Name the token.');
    expect(root.querySelector('mat-form-field')?.classList.contains('mat-form-field-invalid')).toBe(false);
    button(root, 'Copy').click();
    expect(copy).toHaveBeenCalledWith('tf_ab12-the-whole-secret');
    fixture.detectChanges();
    expect(button(root, 'Copied')).toBeDefined();
  });

  it('revokes a token after the person confirms', async () => {
    const fixture = await render('analyst');
    http.expectOne('/api/v1/tokens?owner=me').flush([token()]);
    fixture.detectChanges();
    (fixture.nativeElement as HTMLElement).querySelector<HTMLButtonElement>('button[aria-label="Revoke nightly split check"]')!.click();
    const revoke = http.expectOne('/api/v1/tokens/7');
    expect(revoke.request.method).toBe('DELETE');
    revoke.flush(token({ revokedAt: '2026-11-24T10:00:00.000Z' }));
    TestBed.tick();
    http.expectOne('/api/v1/tokens?owner=me').flush([token({ revokedAt: '2026-11-24T10:00:00.000Z' })]);
    fixture.detectChanges();
    expect(fixture.nativeElement.textContent).toContain('revoked 24 Nov 2026');
  });

  it('does nothing when the person thinks better of revoking', async () => {
    const fixture = await render('analyst');
    http.expectOne('/api/v1/tokens?owner=me').flush([token()]);
    fixture.detectChanges();
    confirm = false;
    (fixture.nativeElement as HTMLElement).querySelector<HTMLButtonElement>('button[aria-label="Revoke nightly split check"]')!.click();
    http.expectNone('/api/v1/tokens/7');
  });

  it('lets an admin see everyone’s tokens with their owners; others get no such switch', async () => {
    const fixture = await render('admin');
    http.expectOne('/api/v1/tokens?owner=me').flush([]);
    fixture.detectChanges();
    (fixture.nativeElement as HTMLElement).querySelector<HTMLButtonElement>('[role=switch]')!.click();
    TestBed.tick();
    http.expectOne('/api/v1/tokens?owner=all').flush([token({ owner: { id: 9, name: 'Someone Else' } })]);
    fixture.detectChanges();
    expect(fixture.nativeElement.textContent).toContain('Someone Else');
    expect(fixture.nativeElement.textContent).toContain('Everyone’s tokens');

    TestBed.resetTestingModule();
    const analystView = await render('analyst');
    http.expectOne('/api/v1/tokens?owner=me').flush([]);
    analystView.detectChanges();
    expect((analystView.nativeElement as HTMLElement).querySelector('[role=switch]')).toBeNull();
  });
});
