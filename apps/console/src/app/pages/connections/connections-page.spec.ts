import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { Connection } from '@tallyfit/contracts';
import { storeSession } from '../../testing/fixtures';
import { ConnectionsPage } from './connections-page';

const connection = (change: Partial<Connection>): Connection => ({
  id: 1,
  name: 'Shop events',
  kind: 'postgres',
  host: 'events.internal',
  port: 5432,
  database: 'shop',
  user: 'tallyfit_reader',
  ssl: true,
  hasPassword: true,
  createdBy: { id: 1, name: 'Analyst Person' },
  createdAt: '2026-12-01T00:00:00Z',
  updatedAt: '2026-12-01T00:00:00Z',
  ...change,
});

describe('ConnectionsPage', () => {
  let http: HttpTestingController;

  afterEach(() => http.verify());

  it('lists the databases without any password, lets their creator change them, and says how a try went', async () => {
    sessionStorage.clear();
    storeSession('analyst', 1);
    TestBed.configureTestingModule({ imports: [ConnectionsPage], providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ConnectionsPage);
    fixture.detectChanges();
    TestBed.tick();
    http.expectOne('/api/v1/connections').flush([connection({}), connection({ id: 2, name: 'Plant sensors', createdBy: { id: 9, name: 'Someone Else' } })]);
    await fixture.whenStable();
    fixture.detectChanges();
    const root = fixture.nativeElement as HTMLElement;
    expect(root.textContent).toContain('tallyfit_reader@events.internal:5432/shop');
    expect(root.querySelector('[aria-label="Change Shop events"]')).not.toBeNull();
    expect(root.querySelector('[aria-label="Change Plant sensors"]')).toBeNull();

    root.querySelector<HTMLButtonElement>('[aria-label="Try Shop events"]')!.click();
    http.expectOne('/api/v1/connections/1/test').flush({ ok: false, message: 'password authentication failed for user "tallyfit_reader"', elapsedMs: 12 });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(root.querySelector('.try.failed')?.textContent).toContain('password authentication failed');
  });
});
