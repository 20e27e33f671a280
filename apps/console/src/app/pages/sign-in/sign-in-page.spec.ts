import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { SignInPage } from './sign-in-page';

describe('SignInPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    sessionStorage.clear();
    TestBed.configureTestingModule({
      imports: [SignInPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  function render(returnUrl?: string) {
    const fixture = TestBed.createComponent(SignInPage);
    if (returnUrl) fixture.componentRef.setInput('returnUrl', returnUrl);
    fixture.detectChanges();
    return fixture;
  }

  function fill(element: HTMLElement, selector: string, value: string) {
    const input = element.querySelector<HTMLInputElement>(selector)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  it('does not call the API while the form is invalid', () => {
    const fixture = render();
    fixture.nativeElement.querySelector('form').dispatchEvent(new Event('submit'));
    fixture.detectChanges();
    http.expectNone('/api/v1/auth/login');
    expect(fixture.nativeElement.textContent).toContain('E-mail is required.');
  });

  it('signs in and goes back to where the person was', async () => {
    const fixture = render('/analyses/7');
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    fill(fixture.nativeElement, 'input[type=email]', 'ana@example.org');
    fill(fixture.nativeElement, 'input[type=password]', 'secret');
    fixture.nativeElement.querySelector('form').dispatchEvent(new Event('submit'));

    const request = http.expectOne('/api/v1/auth/login');
    expect(request.request.body).toEqual({ email: 'ana@example.org', password: 'secret' });
    request.flush({ accessToken: 't', expiresIn: 900, user: { id: 1, email: 'ana@example.org', name: 'Ana', role: 'analyst' } });
    expect(navigate).toHaveBeenCalledWith('/analyses/7');
  });

  it('never follows a return address outside the console', () => {
    const fixture = render('//elsewhere.example/phish');
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    fill(fixture.nativeElement, 'input[type=email]', 'ana@example.org');
    fill(fixture.nativeElement, 'input[type=password]', 'secret');
    fixture.nativeElement.querySelector('form').dispatchEvent(new Event('submit'));
    http.expectOne('/api/v1/auth/login').flush({ accessToken: 't', expiresIn: 900, user: { id: 1, email: 'a@b.c', name: 'A', role: 'viewer' } });
    expect(navigate).toHaveBeenCalledWith('/analyses');
  });

  it('shows the API’s message when sign-in is refused', () => {
    const fixture = render();
    fill(fixture.nativeElement, 'input[type=email]', 'ana@example.org');
    fill(fixture.nativeElement, 'input[type=password]', 'wrong');
    fixture.nativeElement.querySelector('form').dispatchEvent(new Event('submit'));
    http
      .expectOne('/api/v1/auth/login')
      .flush({ error: { code: 'unauthorized', message: 'e-mail or password is wrong' } }, { status: 401, statusText: 'Unauthorized' });
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain('e-mail or password is wrong');
  });
});
