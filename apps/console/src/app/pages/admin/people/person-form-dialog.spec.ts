import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatDialogRef } from '@angular/material/dialog';
import { PersonFormDialog } from './person-form-dialog';

describe('PersonFormDialog', () => {
  let http: HttpTestingController;
  let close: jest.Mock;

  function render() {
    close = jest.fn();
    TestBed.configureTestingModule({
      imports: [PersonFormDialog],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MatDialogRef, useValue: { close } }],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(PersonFormDialog);
    fixture.detectChanges();
    return fixture;
  }

  function fill(root: HTMLElement, selector: string, value: string) {
    const input = root.querySelector(selector) as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  afterEach(() => http.verify());

  it('refuses a short first password before calling the API', () => {
    const fixture = render();
    const root = fixture.nativeElement as HTMLElement;
    fill(root, 'input[formcontrolname=name]', 'Rae Reviewer');
    fill(root, 'input[type=email]', 'rae@example.org');
    fill(root, 'input[type=password]', 'short');
    root.querySelector('form')!.dispatchEvent(new Event('submit'));
    fixture.detectChanges();
    http.expectNone('/api/v1/people');
    expect(root.textContent).toContain('At least 10 characters.');
  });

  it('adds the person and closes with what the API stored, or shows why not', () => {
    const fixture = render();
    const root = fixture.nativeElement as HTMLElement;
    fill(root, 'input[formcontrolname=name]', ' Rae Reviewer ');
    fill(root, 'input[type=email]', 'rae@example.org');
    fill(root, 'input[type=password]', 'a-long-first-password');
    root.querySelector('form')!.dispatchEvent(new Event('submit'));
    http
      .expectOne('/api/v1/people')
      .flush({ error: { code: 'conflict', message: 'rae@example.org is already in use' } }, { status: 409, statusText: 'Conflict' });
    fixture.detectChanges();
    expect(root.querySelector('[role=alert]')?.textContent).toContain('already in use');

    root.querySelector('form')!.dispatchEvent(new Event('submit'));
    const request = http.expectOne('/api/v1/people');
    expect(request.request.body).toEqual({ name: 'Rae Reviewer', email: 'rae@example.org', role: 'analyst', password: 'a-long-first-password' });
    const stored = { id: 8, name: 'Rae Reviewer', email: 'rae@example.org', role: 'analyst', disabled: false, createdAt: '2026-12-01T00:00:00Z' };
    request.flush(stored);
    expect(close).toHaveBeenCalledWith(stored);
  });
});
