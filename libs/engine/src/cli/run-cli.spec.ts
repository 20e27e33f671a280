import { ENGINE_VERSION } from '../lib/engine-version';
import { expectClose } from '../testing/expect-close';
import { readFixture, rowWhere } from '../testing/reference-fixtures';
import { runCli, type CliIo } from './run-cli';

interface Run {
  code: number;
  out: string;
  err: string;
}

async function run(argv: string[], files: Record<string, string> = {}, stdin = ''): Promise<Run> {
  let out = '';
  let err = '';
  const io: CliIo = {
    readText: async (path) => {
      if (!(path in files)) throw new Error(`ENOENT: no such file '${path}'`);
      return files[path];
    },
    readStdin: async () => stdin,
    writeOut: (text) => (out += text),
    writeErr: (text) => (err += text),
  };
  const code = await runCli(argv, io);
  return { code, out, err };
}

const spec = JSON.stringify({ observed: { labels: ['left', 'right'], counts: [1752, 1895] }, hypothesis: { kind: 'equal' } });

describe('tallyfit CLI', () => {
  it('analyze reads a file or standard input and prints the result JSON', async () => {
    const fromFile = await run(['analyze', 'spec.json'], { 'spec.json': spec });
    expect(fromFile.code).toBe(0);
    const result = JSON.parse(fromFile.out);
    // McDonald, Handbook of Biological Statistics, 3rd ed. (2014), "Chi-square test of goodness-of-fit" (from memory): P = 0.0179.
    expect(result.tests.pearson.p).toBeCloseTo(0.0179, 4);
    expect(result.engineVersion).toBe(ENGINE_VERSION);
    const fromStdin = await run(['analyze', '-'], {}, spec);
    expect(JSON.parse(fromStdin.out)).toEqual(result);
  });

  it('sequential reads batches from a file or standard input and prints each look with n, p and alarm', async () => {
    // The hand-computed stream of sequential.spec.ts: BF = 4/5, 32/63, 2048/1001 under a uniform prior.
    const stream = JSON.stringify({
      observed: { labels: ['left', 'right'] },
      hypothesis: { kind: 'equal' },
      batches: [[3, 1], [2, 2], [5, 0]],
      alpha: 0.5,
      concentration: 2,
    });
    const fromStdin = await run(['sequential', '-'], {}, stream);
    expect(fromStdin.code).toBe(0);
    const printed = JSON.parse(fromStdin.out);
    expect(printed.looks.map((look: { n: number; alarm: boolean }) => [look.n, look.alarm])).toEqual([
      [4, false],
      [8, false],
      [13, true],
    ]);
    expect(printed.looks.map((look: { p: number }) => look.p).slice(0, 2)).toEqual([1, 1]);
    expect(printed.looks[2].p).toBeCloseTo(1001 / 2048, 13);
    expect(printed).toMatchObject({ firstAlarm: 3, alpha: 0.5, concentration: 2, engineVersion: ENGINE_VERSION });
    const fromFile = await run(['sequential', 'stream.json'], { 'stream.json': stream });
    expect(JSON.parse(fromFile.out)).toEqual(printed);
  });

  it('power prints { power, criticalValue, ncp }', async () => {
    const { code, out } = await run(['power', '--w', '0.3', '--df', '1', '--n=100']);
    expect(code).toBe(0);
    const printed = JSON.parse(out);
    expect(Object.keys(printed)).toEqual(['power', 'criticalValue', 'ncp']);
    expectClose(printed.power, rowWhere(readFixture('power').power, { w: 0.3, df: 1, n: 100, alpha: 0.05 }).power, { relative: 1e-13 });
  });

  it('sample-size prints { n, nContinuous, power }', async () => {
    const { code, out } = await run(['sample-size', '--w', '0.1', '--df', '1', '--power', '0.8', '--alpha', '0.05']);
    expect(code).toBe(0);
    expect(JSON.parse(out)).toMatchObject({ n: rowWhere(readFixture('power').sampleSize, { w: 0.1, df: 1, power: 0.8, alpha: 0.05 }).n });
  });

  it('chisq prints the tails at x, or the critical value for alpha', async () => {
    const tails = JSON.parse((await run(['chisq', '--x', '1500', '--df', '1'])).out);
    expect(tails.upper).toBe(0);
    const chiSquare = readFixture('chi-square');
    expectClose(tails.logUpper, rowWhere(chiSquare.tails, { x: 1500, df: 1 }).logUpper, { relative: 4 * Number.EPSILON });
    expect(tails.lower).toBe(1);
    const quantile = JSON.parse((await run(['chisq', '--alpha', '0.05', '--df', '3'])).out);
    expectClose(quantile.quantile, rowWhere(chiSquare.quantiles, { df: 3, alpha: 0.05 }).criticalValue, { relative: 1e-14 });
  });

  it.each([
    [[], 'tallyfit: no command given (try tallyfit --help)'],
    [['fit'], 'tallyfit: unknown command "fit" (expected analyze, sequential, power, sample-size or chisq)'],
    [['sequential'], 'tallyfit: sequential needs exactly one argument: a spec file, or - for standard input'],
    [['power', '--w', 'abc', '--df', '1', '--n', '5'], 'tallyfit: --w must be a number, got "abc"'],
    [['power', '--w', '0.3', '--df', '1'], 'tallyfit: --n is required'],
    [['power', '--w', '0.3', '--df', '1', '--n', '5', '--bogus', '1'], 'tallyfit: unknown option --bogus (expected --w, --df, --n, --alpha)'],
    [['power', '--w', '0.3', '--df', '1.5', '--n', '5'], 'tallyfit: invalid input: df: df must be a whole number >= 1, got 1.5'],
    [['chisq', '--x', '1', '--alpha', '0.05', '--df', '2'], 'tallyfit: chisq needs either --x or --alpha (not both)'],
    [['chisq', '--alpha', '0', '--df', '2'], 'tallyfit: --alpha must be between 0 and 1, got 0'],
    [['analyze'], 'tallyfit: analyze needs exactly one argument: a spec file, or - for standard input'],
    [['analyze', 'missing.json'], "tallyfit: cannot read missing.json: ENOENT: no such file 'missing.json'"],
  ])('rejects %j with one line on stderr and exit code 2', async (argv, message) => {
    const { code, out, err } = await run(argv as string[]);
    expect(code).toBe(2);
    expect(out).toBe('');
    expect(err).toBe(`${message}\n`);
  });

  it('reports bad JSON and an invalid spec on one line with exit code 2', async () => {
    const badJson = await run(['analyze', 'x.json'], { 'x.json': '{ nope' });
    expect(badJson.code).toBe(2);
    expect(badJson.err).toMatch(/^tallyfit: x\.json is not valid JSON: .*\n$/);
    const invalid = await run(['analyze', '-'], {}, JSON.stringify({ observed: { labels: ['a'], counts: [1] }, hypothesis: { kind: 'equal' } }));
    expect(invalid.code).toBe(2);
    expect(invalid.err).toBe('tallyfit: invalid input: observed.labels: at least 2 categories are needed, got 1\n');
    const counts = await run(
      ['sequential', '-'],
      {},
      JSON.stringify({ observed: { labels: ['a', 'b'] }, hypothesis: { kind: 'counts', values: [5, 5] }, batches: [[5, 5]] }),
    );
    expect(counts.code).toBe(2);
    expect(counts.err).toBe(
      'tallyfit: invalid input: hypothesis.kind: a sequential test needs shares fixed in advance: use equal, proportions or ratio (counts depends on the data)\n',
    );
  });

  it('prints help and the version', async () => {
    const help = (await run(['--help'])).out;
    expect(help).toMatch(/tallyfit analyze FILE\|-/);
    expect(help).toMatch(/tallyfit sequential FILE\|-/);
    expect((await run(['--version'])).out).toBe(`${ENGINE_VERSION}\n`);
  });
});
