import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { createTestApp, type TestContext } from '../../testing/test-app';

/** Multipart bodies written by hand, as a careless or hostile client would send them. */
describe('malformed dataset uploads', () => {
  let ctx: TestContext;
  let studyId: number;
  beforeAll(async () => {
    ctx = await createTestApp();
    studyId = (await ctx.as('analyst').post('/studies', { name: 'Broken forms' })).body.id;
  });
  afterAll(() => ctx.close());

  const send = (contentType: string, body: Buffer | string) =>
    ctx.as('analyst').post(`/studies/${studyId}/datasets`).set('content-type', contentType).send(Buffer.from(body));
  const part = (boundary: string, fileName: string, eol = '\r\n') =>
    [
      `--${boundary}`,
      `Content-Disposition: form-data; name="file"; filename="${fileName}"`,
      'Content-Type: text/csv',
      '',
      'variant',
      'control',
      'treatment',
      `--${boundary}--`,
      '',
    ].join(eol);

  it.each([
    ['no boundary', 'multipart/form-data', part('edge', 'a.csv')],
    ['a boundary that is not in the body', 'multipart/form-data; boundary=elsewhere', part('edge', 'a.csv')],
    ['a body cut off in the middle', 'multipart/form-data; boundary=edge', part('edge', 'a.csv').slice(0, 90)],
    ['lines ended by LF only', 'multipart/form-data; boundary=edge', part('edge', 'a.csv', '\n')],
    ['a NUL in the file name', 'multipart/form-data; boundary=edge', part('edge', 'a\u0000b.csv')],
  ])('answers 400 with a clear message for %s', async (_case, contentType, body) => {
    const response = await send(contentType, body);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toMatch(/^(malformed_upload|invalid_input)$/);
    expect(response.body.error.message).toMatch(/multipart|file name|file/i);
    expect(readdirSync(join(ctx.config.dataDir, 'uploads-in-progress'))).toEqual([]);
  });
});
