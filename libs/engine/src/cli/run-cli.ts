/**
 * The `tallyfit` command line. Kept free of process globals so tests can run it in-process:
 * the caller supplies the arguments, the input streams and the output functions, and gets the
 * exit code back (0 success, 2 bad arguments or input, 1 unexpected failure).
 */
// Only the public entry point: the published cli.js imports it from index.js, sharing one copy.
import {
  analyze,
  analyzeSequential,
  chiSquareCriticalValue,
  chiSquareTails,
  ENGINE_VERSION,
  EngineInputError,
  power,
  sampleSize,
} from '../index';
import { CliUsageError, parseNumericFlags, requireFlag } from './parse-flags';

export interface CliIo {
  readText(path: string): Promise<string>;
  readStdin(): Promise<string>;
  writeOut(text: string): void;
  writeErr(text: string): void;
}

export const USAGE = `tallyfit ${ENGINE_VERSION} — goodness-of-fit tests for category counts

Usage:
  tallyfit analyze FILE|-                        run the analysis spec in FILE (or stdin) and print the result JSON
  tallyfit sequential FILE|-                     anytime-valid sequential test of the batches in FILE (or stdin):
                                                 { looks: [{ batch, n, p, alarm, … }], firstAlarm, … }
  tallyfit power --w W --df D --n N [--alpha A]  power of a chi-square test: { power, criticalValue, ncp }
  tallyfit sample-size --w W --df D --power P [--alpha A]
                                                 smallest n reaching the power: { n, nContinuous, power }
  tallyfit chisq --x X --df D                    chi-square tails at X: { upper, logUpper, lower, logLower }
  tallyfit chisq --alpha A --df D                upper-tail critical value: { quantile }
  tallyfit --help | --version
`;

function print(io: CliIo, value: unknown): void {
  io.writeOut(`${JSON.stringify(value, null, 2)}\n`);
}

/** Read the one JSON argument of `command`: a file path, or - for standard input. */
async function readJsonArgument(command: string, args: readonly string[], io: CliIo): Promise<unknown> {
  if (args.length !== 1) throw new CliUsageError(`${command} needs exactly one argument: a spec file, or - for standard input`);
  const source = args[0];
  let text: string;
  try {
    text = source === '-' ? await io.readStdin() : await io.readText(source);
  } catch (error) {
    throw new CliUsageError(`cannot read ${source}: ${(error as Error).message}`);
  }
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new CliUsageError(`${source === '-' ? 'standard input' : source} is not valid JSON: ${(error as Error).message}`);
  }
}

async function runAnalyze(args: readonly string[], io: CliIo): Promise<void> {
  const spec = await readJsonArgument('analyze', args, io);
  print(io, analyze(spec as Parameters<typeof analyze>[0]));
}

async function runSequential(args: readonly string[], io: CliIo): Promise<void> {
  const spec = await readJsonArgument('sequential', args, io);
  print(io, analyzeSequential(spec as Parameters<typeof analyzeSequential>[0]));
}

function runPower(args: readonly string[], io: CliIo): void {
  const flags = parseNumericFlags(args, ['w', 'df', 'n', 'alpha']);
  print(io, power({ w: requireFlag(flags, 'w'), df: requireFlag(flags, 'df'), n: requireFlag(flags, 'n'), alpha: flags.get('alpha') }));
}

function runSampleSize(args: readonly string[], io: CliIo): void {
  const flags = parseNumericFlags(args, ['w', 'df', 'power', 'alpha']);
  print(
    io,
    sampleSize({ w: requireFlag(flags, 'w'), df: requireFlag(flags, 'df'), power: requireFlag(flags, 'power'), alpha: flags.get('alpha') }),
  );
}

function runChiSquare(args: readonly string[], io: CliIo): void {
  const flags = parseNumericFlags(args, ['x', 'df', 'alpha']);
  const df = requireFlag(flags, 'df');
  if (!(df > 0)) throw new CliUsageError(`--df must be positive, got ${df}`);
  const x = flags.get('x');
  const alpha = flags.get('alpha');
  if ((x === undefined) === (alpha === undefined)) throw new CliUsageError('chisq needs either --x or --alpha (not both)');
  if (x !== undefined) {
    const tails = chiSquareTails(x, df);
    // JSON has no -Infinity: ln 0 (x <= 0 for the lower tail) is printed as null.
    const finiteOrNull = (value: number) => (Number.isFinite(value) ? value : null);
    print(io, { upper: tails.upper, logUpper: finiteOrNull(tails.logUpper), lower: tails.lower, logLower: finiteOrNull(tails.logLower) });
    return;
  }
  if (!(alpha! > 0 && alpha! < 1)) throw new CliUsageError(`--alpha must be between 0 and 1, got ${alpha}`);
  print(io, { quantile: chiSquareCriticalValue(alpha!, df) });
}

export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  const [command, ...rest] = argv;
  try {
    switch (command) {
      case 'analyze':
        await runAnalyze(rest, io);
        return 0;
      case 'sequential':
        await runSequential(rest, io);
        return 0;
      case 'power':
        runPower(rest, io);
        return 0;
      case 'sample-size':
        runSampleSize(rest, io);
        return 0;
      case 'chisq':
        runChiSquare(rest, io);
        return 0;
      case '--help':
      case '-h':
      case 'help':
        io.writeOut(USAGE);
        return 0;
      case '--version':
        io.writeOut(`${ENGINE_VERSION}\n`);
        return 0;
      case undefined:
        throw new CliUsageError('no command given (try tallyfit --help)');
      default:
        throw new CliUsageError(`unknown command "${command}" (expected analyze, sequential, power, sample-size or chisq)`);
    }
  } catch (error) {
    if (error instanceof CliUsageError) {
      io.writeErr(`tallyfit: ${error.message}\n`);
      return 2;
    }
    if (error instanceof EngineInputError) {
      io.writeErr(`tallyfit: invalid input: ${error.message}\n`);
      return 2;
    }
    io.writeErr(`tallyfit: unexpected failure: ${(error as Error).message ?? String(error)}\n`);
    return 1;
  }
}
