import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { Person } from '@tallyfit/contracts';
import { storeSession } from '../../../testing/fixtures';
import { PeoplePage } from './people-page';

const person = (change: Partial<Person>): Person => ({
  id: 2,
  email: 'ana@example.org',
  name: 'Ana Analyst',
  role: 'analyst',
  disabled: false,
  createdAt: '2026-11-01T10:00:00.000Z',
  ...change,
});

describe('PeoplePage', () => {
  let http: HttpTestingController;

  async function render() {
    sessionStorage.clear();
    storeSession('admin', 1);
    TestBed.configureTestingModule({ imports: [PeoplePage], providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(PeoplePage);
    fixture.detectChanges();
    TestBed.tick();
    http.expectOne('/api/v1/people').flush([
      person({ id: 1, name: 'Admin Person', email: 'admin@example.org', role: 'admin' }),
      person({}),
      person({ id: 3, name: 'Vic Viewer', email: 'vic@example.org', role: 'viewer', disabled: true }),
    ]);
    await fixture.whenStable();
    fixture.detectChanges();
    return fixture;
  }

  afterEach(() => http.verify());

  it('lists people and never offers an admin a way to lock themselves out', async () => {
    const fixture = await render();
    const root = fixture.nativeElement as HTMLElement;
    expect(root.textContent).toContain('Admin Person(you)');
    expect(root.querySelector('button[aria-label="Disable Admin Person"]')).toBeNull();
    expect(root.querySelector('button[aria-label="Disable Ana Analyst"]')).not.toBeNull();
    expect(root.querySelector('button[aria-label="Enable Vic Viewer"]')).not.toBeNull();
    expect((await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatSelectHarness)).length).toBe(2);
  });

  it('changes a role through the API', async () => {
    const fixture = await render();
    const [anaRole] = await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatSelectHarness);
    await anaRole.open();
    await anaRole.clickOptions({ text: 'Lead' });
    const request = http.expectOne('/api/v1/people/2');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ role: 'lead' });
    request.flush(person({ role: 'lead' }));
    expect(await anaRole.getValueText()).toBe('Lead');
  });

  it('disables an account and shows it at once', async () => {
    const fixture = await render();
    const root = fixture.nativeElement as HTMLElement;
    root.querySelector<HTMLButtonElement>('button[aria-label="Disable Ana Analyst"]')!.click();
    const request = http.expectOne('/api/v1/people/2');
    expect(request.request.body).toEqual({ disabled: true });
    request.flush(person({ disabled: true }));
    fixture.detectChanges();
    expect(root.querySelector('button[aria-label="Enable Ana Analyst"]')).not.toBeNull();
  });

  it('filters people by the typed text', async () => {
    const fixture = await render();
    const input = (fixture.nativeElement as HTMLElement).querySelector('input[type=search]') as HTMLInputElement;
    input.value = 'vic';
    input.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    const rows = (fixture.nativeElement as HTMLElement).querySelectorAll('tr.mat-mdc-row');
    expect(rows.length).toBe(1);
    expect(rows[0].textContent).toContain('Vic Viewer');
  });
});
