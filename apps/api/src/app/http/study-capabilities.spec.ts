import { can, type Capability, type Role, type StudyRole } from '@tallyfit/contracts';
import { createTestApp, type TestContext } from '../../testing/test-app';

/**
 * The study half of the capability table: for each capability that depends on the caller's study
 * role, the API's answer for a person with each study role (and for a non-member) is what the
 * console's `can(role, capability, studyRole)` says. (`route-access.spec.ts` proves the role half
 * for every route.)
 */
describe('study capabilities: the API agrees with can() for every study role', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  /** A fresh study (made by an admin) with the caller in it under `studyRole`, or not in it. */
  async function studyWith(role: Role, studyRole: StudyRole | null) {
    const study = (await ctx.as('admin').post('/studies', { name: `Shelf audit ${Math.random()}` })).body;
    if (studyRole) await ctx.as('admin').post(`/studies/${study.id}/members`, { userId: ctx.userIds[role], studyRole }).expect(201);
    const dataset = await ctx
      .as('admin')
      .post(`/studies/${study.id}/datasets`)
      .attach('file', Buffer.from('aisle\nfront\nback\nfront\n'), 'aisles.csv')
      .expect(201);
    return { studyId: study.id as number, datasetId: dataset.body.id as number };
  }

  /** One route that each study capability guards, called as `role`. */
  const attempts: Record<Capability & ('studies.manage' | 'analyses.run' | 'datasets.add'), (role: Role, ids: { studyId: number; datasetId: number }) => Promise<number>> = {
    'studies.manage': async (role, { studyId }) => (await ctx.as(role).patch(`/studies/${studyId}`, { description: 'checked weekly' })).status,
    'analyses.run': async (role, { studyId }) =>
      (
        await ctx.as(role).post('/analyses', {
          title: 'Aisle footfall',
          studyId,
          spec: { observed: { labels: ['front', 'back'], counts: [12, 9] }, hypothesis: { kind: 'equal' } },
        })
      ).status,
    'datasets.add': async (role, { datasetId }) => (await ctx.as(role).post(`/datasets/${datasetId}/columns`, { shape: 'raw', column: 'aisle' })).status,
  };

  const cases: Array<[Role, StudyRole | null]> = [
    ['analyst', 'owner'],
    ['analyst', 'contributor'],
    ['analyst', 'reader'],
    ['analyst', null],
    ['viewer', 'reader'],
    ['lead', null],
    ['admin', null],
  ];

  it.each(cases)('%s as %s', async (role, studyRole) => {
    const ids = await studyWith(role, studyRole);
    for (const [capability, attempt] of Object.entries(attempts) as Array<[keyof typeof attempts, (typeof attempts)[keyof typeof attempts]]>) {
      const status = await attempt(role, ids);
      const outcome = status >= 200 && status < 300 ? 'allowed' : status === 403 || status === 404 ? 'refused' : status;
      expect({ capability, outcome }).toEqual({ capability, outcome: can(role, capability, studyRole) ? 'allowed' : 'refused' });
    }
  });
});
