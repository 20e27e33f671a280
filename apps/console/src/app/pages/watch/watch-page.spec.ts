import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { DeferBlockBehavior, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Role, WatchDetail } from '@tallyfit/contracts';
import { storeSession, watchAlertFixture, watchBatchFixture, watchFixture } from '../../testing/fixtures';
import { WatchPage } from './watch-page';

describe('WatchPage', () => {
  let http: HttpTestingController;

  async function render(role: Role, watch: WatchDetail = watchFixture()) {
    sessionStorage.clear();
    storeSession(role);
    TestBed.configureTestingModule({
      imports: [WatchPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
      deferBlockBehavior: DeferBlockBehavior.Manual,
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(WatchPage);
    fixture.componentRef.setInput('id', watch.id);
    fixture.detectChanges();
    // The page asks at once and then every few seconds; the first ask leaves on the next turn.
    await new Promise((resolve) => setTimeout(resolve, 0));
    http.expectOne(`/api/v1/watches/${watch.id}`).flush(watch);
    http.expectOne((r) => r.url === `/api/v1/watches/${watch.id}/batches`).flush({ items: [watchBatchFixture(2), watchBatchFixture(1, { alarm: false, sequentialP: 0.4 })], total: 2, page: 1, pageSize: 100 });
    http.expectOne((r) => r.url === `/api/v1/watches/${watch.id}/alerts`).flush({ items: [watchAlertFixture()], total: 1, page: 1, pageSize: 25 });
    await fixture.whenStable();
    fixture.detectChanges();
    return fixture;
  }

  afterEach(() => http.verify());

  const buttons = (root: HTMLElement) =>
    Array.from(root.querySelectorAll('a[mat-stroked-button], button')).map((el) => el.textContent?.replace(/\s+/g, ' ').trim());

  it('shows the alarm in words, each batch linked to its own analysis, and the deliveries', async () => {
    const fixture = await render('lead');
    const root = fixture.nativeElement as HTMLElement;
    expect(root.querySelector('[data-testid="watch-state"]')?.textContent).toContain('Alarm raised');
    expect(root.querySelector('[data-testid="watch-headline"]')?.textContent).toContain('the sequential p is .012, below alpha 0.05');
    expect(root.querySelector('[data-testid="alert-state"]')?.textContent).toBe('Waiting for a lead');
    const batchLink = root.querySelector<HTMLAnchorElement>('a[aria-label="Batch 2 tested on its own"]');
    expect(batchLink?.getAttribute('href')).toBe('/analyses/202');
    expect(root.textContent).toContain('Webhook to https://hooks.example.org/t: gave up after 5 attempts — status 503');
  });

  it('lets a lead acknowledge and pause, but not change the settings', async () => {
    const fixture = await render('lead');
    const labels = buttons(fixture.nativeElement);
    expect(labels).toEqual(expect.arrayContaining(['task_alt Acknowledge the alarm', 'pause Pause']));
    expect(labels.some((label) => label?.includes('Change settings'))).toBe(false);
  });

  it('lets an analyst change the settings but not acknowledge, and shows the pipeline example with the watch’s address', async () => {
    const fixture = await render('analyst');
    const root = fixture.nativeElement as HTMLElement;
    const labels = buttons(root);
    expect(labels).toContain('edit Change settings');
    expect(labels.some((label) => label?.includes('Acknowledge'))).toBe(false);
    expect(root.querySelector('[data-testid="push-example"]')?.textContent).toContain('/api/v1/watches/3/batches');
    expect(root.querySelector<HTMLAnchorElement>('a[href="/tokens"]')).not.toBeNull();
    expect(root.querySelector<HTMLAnchorElement>('a[href="/api/docs"]')).not.toBeNull();
  });

  it('offers a paused watch in alarm both a plain resume and a fresh start', async () => {
    const fixture = await render('admin', watchFixture({ state: 'paused' }));
    const labels = buttons(fixture.nativeElement);
    expect(labels).toEqual(expect.arrayContaining(['play_arrow Resume', 'restart_alt Resume with a fresh test']));
    Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('button'))
      .find((b) => b.textContent?.includes('fresh test'))!
      .click();
    http.expectOne('/api/v1/watches/3/resume').flush(watchFixture({ state: 'holding', alarm: false }));
    // The page asks again for the whole watch after the change.
    await new Promise((resolve) => setTimeout(resolve, 0));
    http.expectOne('/api/v1/watches/3').flush(watchFixture({ state: 'holding', alarm: false, alertState: 'none' }));
    http.expectOne((r) => r.url === '/api/v1/watches/3/batches').flush({ items: [], total: 0, page: 1, pageSize: 100 });
    http.expectOne((r) => r.url === '/api/v1/watches/3/alerts').flush({ items: [], total: 0, page: 1, pageSize: 25 });
  });
});
