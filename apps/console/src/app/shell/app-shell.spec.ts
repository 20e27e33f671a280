import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { provideRouter, Router } from '@angular/router';
import { storeSession } from '../testing/fixtures';
import { AppShell } from './app-shell';

describe('AppShell', () => {
  function render(role: 'admin' | 'lead' | 'viewer') {
    sessionStorage.clear();
    storeSession(role);
    TestBed.configureTestingModule({
      imports: [AppShell],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    const fixture = TestBed.createComponent(AppShell);
    fixture.detectChanges();
    return fixture;
  }

  const links = (root: HTMLElement) => Array.from(root.querySelectorAll('nav a, nav button')).map((el) => el.textContent?.trim());

  it('shows a viewer the places to read and the planner, nothing that changes data', () => {
    expect(links(render('viewer').nativeElement)).toEqual(['Studies', 'History', 'Watches', 'My analyses', 'Planner']);
  });

  it('gives a lead the audit trail directly and an admin the admin menu', () => {
    expect(links(render('lead').nativeElement)).toContain('Audit trail expand_more');
    TestBed.resetTestingModule();
    expect(links(render('admin').nativeElement)).toEqual(['Studies', 'History', 'To review', 'Watches', 'My analyses', 'New analysis', 'Planner', 'Admin expand_more']);
  });

  it('signs out from the account menu, revoking the session', async () => {
    const fixture = render('viewer');
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const menu = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatMenuHarness.with({ triggerText: /Viewer Person/ }));
    await menu.clickItem({ text: /Sign out/ });
    TestBed.inject(HttpTestingController).expectOne('/api/v1/auth/logout').flush(null, { status: 204, statusText: 'No Content' });
    expect(navigate).toHaveBeenCalledWith(['/sign-in']);
    expect(sessionStorage.getItem('tallyfit.session')).toBeNull();
  });
});
