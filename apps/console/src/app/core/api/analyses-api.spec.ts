import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { AnalysisRecord } from '@tallyfit/contracts';
import { firstValueFrom } from 'rxjs';
import { AnalysesApi } from './analyses-api';

describe('AnalysesApi', () => {
  let api: AnalysesApi;
  let http: HttpTestingController;
  const stored = { id: 7, title: 'Door colours' } as AnalysisRecord;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(AnalysesApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('opens the analysis a run just stored without asking the API again, once', async () => {
    const created = firstValueFrom(api.create({ title: 'Door colours', spec: { observed: { labels: ['a', 'b'], counts: [1, 2] }, hypothesis: { kind: 'equal' } } }));
    http.expectOne({ method: 'POST', url: '/api/v1/analyses' }).flush(stored);
    expect(await created).toEqual(stored);

    expect(await firstValueFrom(api.get(7))).toEqual(stored);
    http.expectNone('/api/v1/analyses/7');

    const reloaded = firstValueFrom(api.get(7));
    http.expectOne({ method: 'GET', url: '/api/v1/analyses/7' }).flush(stored);
    expect(await reloaded).toEqual(stored);
  });
});
