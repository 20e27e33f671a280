import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { StudyDetail } from '@tallyfit/contracts';
import { studyFixture } from '../../testing/fixtures';
import { StudyMembers } from './study-members';

describe('StudyMembers', () => {
  let http: HttpTestingController;

  function render(manage: boolean) {
    TestBed.configureTestingModule({
      imports: [StudyMembers],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(StudyMembers);
    fixture.componentRef.setInput('study', studyFixture());
    fixture.componentRef.setInput('manage', manage);
    const changes: StudyDetail[] = [];
    fixture.componentInstance.changed.subscribe((study) => changes.push(study));
    fixture.detectChanges();
    return { fixture, changes };
  }

  afterEach(() => http.verify());

  it('lists members read-only for people who do not manage the study', () => {
    const { fixture } = render(false);
    const root = fixture.nativeElement as HTMLElement;
    expect(root.textContent).toContain('Vic Viewer');
    expect(root.textContent).toContain('Reader');
    expect(root.querySelectorAll('button, mat-select').length).toBe(0);
  });

  it('changes a member’s study role through the API', async () => {
    const { fixture, changes } = render(true);
    const selects = await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatSelectHarness);
    expect(selects.length).toBe(2);
    await selects[0].open();
    const options = await selects[0].getOptions();
    expect(await Promise.all(options.map((o) => o.getText()))).toEqual(['Owner', 'Contributor', 'Reader']);
    await selects[0].clickOptions({ text: 'Contributor' });
    const request = http.expectOne('/api/v1/studies/4/members/2');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ studyRole: 'contributor' });
    request.flush(studyFixture());
    expect(changes.length).toBe(1);
  });

  it('lets a viewer hold only the reader role', async () => {
    const { fixture } = render(true);
    const selects = await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatSelectHarness);
    await selects[1].open();
    const disabled = await Promise.all((await selects[1].getOptions()).map((o) => o.isDisabled()));
    expect(disabled).toEqual([true, true, false]);
  });

  it('removes a member and reports the smaller study', () => {
    const { fixture, changes } = render(true);
    (fixture.nativeElement.querySelector('button[aria-label="Remove Vic Viewer from the study"]') as HTMLButtonElement).click();
    const request = http.expectOne('/api/v1/studies/4/members/5');
    expect(request.request.method).toBe('DELETE');
    request.flush(null, { status: 204, statusText: 'No Content' });
    expect(changes[0].members.map((m) => m.name)).toEqual(['Ana Analyst']);
  });
});
