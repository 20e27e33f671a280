import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { errorNotifierInterceptor } from './error-notifier.interceptor';
import { pageHandlesErrors } from './page-handles-errors';

describe('errorNotifierInterceptor', () => {
  let http: HttpTestingController;
  let client: HttpClient;
  let open: jest.Mock;

  beforeEach(() => {
    open = jest.fn();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([errorNotifierInterceptor])),
        provideHttpClientTesting(),
        { provide: MatSnackBar, useValue: { open } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    client = TestBed.inject(HttpClient);
  });

  afterEach(() => http.verify());

  it('shows the API’s own message for a failed call', () => {
    client.post('/api/v1/studies', {}).subscribe({ error: () => undefined });
    http
      .expectOne('/api/v1/studies')
      .flush({ error: { code: 'validation', message: 'name must not be empty' } }, { status: 400, statusText: 'Bad Request' });
    expect(open).toHaveBeenCalledWith('name must not be empty', 'Dismiss', expect.objectContaining({ politeness: 'assertive' }));
  });

  it('stays quiet when the page shows the error itself', () => {
    client.get('/api/v1/studies', { context: pageHandlesErrors() }).subscribe({ error: () => undefined });
    http.expectOne('/api/v1/studies').flush(null, { status: 500, statusText: 'Server Error' });
    expect(open).not.toHaveBeenCalled();
  });

  it('leaves 401s to the session handling', () => {
    client.get('/api/v1/studies').subscribe({ error: () => undefined });
    http.expectOne('/api/v1/studies').flush(null, { status: 401, statusText: 'Unauthorized' });
    expect(open).not.toHaveBeenCalled();
  });
});
