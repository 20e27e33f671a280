import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { AuditEvent } from '@tallyfit/contracts';
import { AuditPage } from './audit-page';

const event: AuditEvent = {
  id: 31,
  at: '2026-11-24T09:15:00.000Z',
  actor: { id: 3, name: 'Lee Lead' },
  action: 'review',
  entityType: 'analysis',
  entityId: '11',
  studyId: 4,
  summary: 'signed off analysis "Sign-up form: equal traffic?"',
  before: { status: 'in_review' },
  after: { status: 'signed_off', comment: null },
};

describe('AuditPage', () => {
  let http: HttpTestingController;

  async function render() {
    TestBed.configureTestingModule({ imports: [AuditPage], providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(AuditPage);
    fixture.detectChanges();
    TestBed.tick();
    http.expectOne('/api/v1/people/directory').flush([{ id: 3, name: 'Lee Lead', email: 'lee@example.org', role: 'lead' }]);
    return fixture;
  }

  afterEach(() => http.verify());

  it('shows events with their before and after on request', async () => {
    const fixture = await render();
    http.expectOne('/api/v1/audit?page=1&pageSize=50').flush({ items: [event], total: 1, page: 1, pageSize: 50 });
    fixture.detectChanges();
    const root = fixture.nativeElement as HTMLElement;
    expect(root.textContent).toContain('Review decision');
    expect(root.textContent).toContain('signed off analysis');
    expect(root.querySelector('pre')).toBeNull();
    const toggle = Array.from(root.querySelectorAll('button')).find((b) => b.textContent?.includes('Show before and after'))!;
    toggle.click();
    fixture.detectChanges();
    expect(toggle.getAttribute('aria-expanded')).toBe('true');
    expect(Array.from(root.querySelectorAll('pre')).map((pre) => pre.textContent)).toEqual([
      expect.stringContaining('"in_review"'),
      expect.stringContaining('"signed_off"'),
    ]);
  });

  it('asks the API again, from the first page, when a filter changes', async () => {
    const fixture = await render();
    http.expectOne('/api/v1/audit?page=1&pageSize=50').flush({ items: [], total: 0, page: 1, pageSize: 50 });
    fixture.detectChanges();
    expect(fixture.nativeElement.textContent).toContain('Nothing recorded matches these filters.');
    const field = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatFormFieldHarness.with({ floatingLabelText: 'What happened' }));
    const select = (await field.getControl(MatSelectHarness))!;
    await select.open();
    await select.clickOptions({ text: 'Failed sign-in' });
    TestBed.tick();
    http.expectOne('/api/v1/audit?page=1&pageSize=50&action=sign-in-failed').flush({ items: [], total: 0, page: 1, pageSize: 50 });
  });

  it('shows the API’s refusal', async () => {
    const fixture = await render();
    http.expectOne('/api/v1/audit?page=1&pageSize=50').flush({ error: { code: 'forbidden', message: 'not allowed' } }, { status: 403, statusText: 'Forbidden' });
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain('not allowed');
  });
});
