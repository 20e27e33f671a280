import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatRadioButtonHarness } from '@angular/material/radio/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter, Router } from '@angular/router';
import { storeSession, studyFixture, watchFixture } from '../../testing/fixtures';
import { WatchFormPage } from './watch-form-page';

describe('WatchFormPage', () => {
  let http: HttpTestingController;

  async function render(id?: number) {
    sessionStorage.clear();
    storeSession('analyst');
    TestBed.configureTestingModule({ imports: [WatchFormPage], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(WatchFormPage);
    if (id !== undefined) fixture.componentRef.setInput('id', id);
    fixture.detectChanges();
    TestBed.tick();
    http.expectOne((r) => r.url === '/api/v1/studies').flush([studyFixture()]);
    http.expectOne('/api/v1/connections').flush([]);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  const input = async (loader: ReturnType<typeof TestbedHarnessEnvironment.loader>, label: string) =>
    (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatInputHarness))!;

  afterEach(() => http.verify());

  it('sets up a pipeline-fed watch with a signed webhook and opens it', async () => {
    const { fixture, loader } = await render();
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const study = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Study' }))).getControl(MatSelectHarness))!;
    await study.open();
    await study.clickOptions({ text: 'Checkout traffic split' });
    await (await input(loader, 'Name')).setValue('Checkout split');
    await (await input(loader, 'Categories')).setValue('control\nredesign');
    await fixture.whenStable();
    await (await loader.getHarness(MatRadioButtonHarness.with({ label: 'A ratio, such as 9:3:3:1' }))).check();
    await (await input(loader, 'Expected ratio')).setValue('2:1');
    await (await input(loader, 'Webhook address (optional)')).setValue('https://hooks.example.org/t');
    await (await input(loader, 'Webhook secret')).setValue('sixteen-characters!');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Start watching/ }))).click();

    const request = http.expectOne('/api/v1/watches');
    expect(request.request.body).toEqual({
      studyId: 4,
      name: 'Checkout split',
      labels: ['control', 'redesign'],
      hypothesis: { kind: 'ratio', values: [2, 1] },
      alpha: 0.05,
      feed: { kind: 'push' },
      webhook: { url: 'https://hooks.example.org/t', secret: 'sixteen-characters!' },
    });
    request.flush(watchFixture({ id: 9 }));
    expect(navigate).toHaveBeenCalledWith(['/watches', 9]);
  });

  it('names what is missing instead of sending a half-made watch', async () => {
    const { fixture, loader } = await render();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Start watching/ }))).click();
    const problems = (fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent ?? '';
    expect(problems).toContain('Choose the study the watch belongs to.');
    expect(problems).toContain('name must not be empty');
    expect(problems).toContain('a watch needs at least 2 categories');
  });

  it('shows the categories and hypothesis of a watch with batches as fixed', async () => {
    const { fixture } = await render(3);
    http.expectOne('/api/v1/watches/3').flush(watchFixture());
    await fixture.whenStable();
    fixture.detectChanges();
    const root = fixture.nativeElement as HTMLElement;
    expect(root.querySelector('h1')?.textContent).toContain('Change “Checkout redesign: traffic split”');
    expect(root.textContent).toContain('Every category equally likely. Fixed once batches have arrived.');
    expect(root.querySelector<HTMLTextAreaElement>('textarea[formcontrolname="labels"]')?.disabled).toBe(true);
  });
});
