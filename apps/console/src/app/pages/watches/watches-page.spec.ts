import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Role } from '@tallyfit/contracts';
import { storeSession, watchFixture } from '../../testing/fixtures';
import { WatchesPage } from './watches-page';

describe('WatchesPage', () => {
  let http: HttpTestingController;

  async function render(role: Role, query: Record<string, string> = {}) {
    sessionStorage.clear();
    storeSession(role);
    TestBed.configureTestingModule({ imports: [WatchesPage], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(WatchesPage);
    for (const [key, value] of Object.entries(query)) fixture.componentRef.setInput(key, value);
    fixture.detectChanges();
    TestBed.tick();
    http.expectOne((r) => r.url === '/api/v1/studies').flush([]);
    return fixture;
  }

  afterEach(() => http.verify());

  it('lists each watch with its state, intake, sequential p and alarm', async () => {
    const fixture = await render('analyst');
    http.expectOne((r) => r.url === '/api/v1/watches').flush({
      items: [watchFixture(), watchFixture({ id: 4, name: 'Survey quotas', state: 'holding', alarm: false, alertState: 'none', batchCount: 0, n: 0, lastBatchAt: null })],
      total: 2,
      page: 1,
      pageSize: 25,
    });
    await fixture.whenStable();
    fixture.detectChanges();
    const rows = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('tbody tr')).map((row) => row.textContent?.replace(/\s+/g, ' ').trim());
    expect(rows[0]).toContain('Checkout redesign: traffic split');
    expect(rows[0]).toContain('Alarm raised');
    expect(rows[0]).toContain('2 batches · 40,000 observations');
    expect(rows[0]).toContain('p = .012 (alpha 0.05)');
    expect(rows[0]).toContain('Waiting for a lead');
    expect(rows[1]).toContain('No batches yet');
    expect((fixture.nativeElement as HTMLElement).querySelector('a[href="/watches/new"]')).not.toBeNull();
  });

  it('asks the API for the filters in the address, and offers a viewer no new watch', async () => {
    const fixture = await render('viewer', { state: 'alarm', waiting: 'true' });
    const request = http.expectOne((r) => r.url === '/api/v1/watches');
    expect(request.request.params.get('state')).toBe('alarm');
    expect(request.request.params.get('waiting')).toBe('true');
    request.flush({ items: [], total: 0, page: 1, pageSize: 25 });
    await fixture.whenStable();
    fixture.detectChanges();
    const root = fixture.nativeElement as HTMLElement;
    expect(root.textContent).toContain('No watch matches these filters.');
    expect(root.querySelector('a[href="/watches/new"]')).toBeNull();
  });
});
