/**
 * Read `--name value` / `--name=value` flags into numbers, rejecting unknown flags, repeats,
 * missing values and anything that is not a finite number, each with a message naming the flag.
 */
export class CliUsageError extends Error {
  override readonly name = 'CliUsageError';
}

export function parseNumericFlags(args: readonly string[], allowed: readonly string[]): Map<string, number> {
  const values = new Map<string, number>();
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (!arg.startsWith('--')) throw new CliUsageError(`unexpected argument "${arg}"`);
    const equals = arg.indexOf('=');
    const name = equals >= 0 ? arg.slice(2, equals) : arg.slice(2);
    if (!allowed.includes(name)) {
      throw new CliUsageError(`unknown option --${name} (expected ${allowed.map((flag) => `--${flag}`).join(', ')})`);
    }
    let text: string | undefined;
    if (equals >= 0) text = arg.slice(equals + 1);
    else {
      text = args[i + 1];
      i++;
    }
    if (text === undefined || text === '') throw new CliUsageError(`--${name} needs a value`);
    const value = Number(text);
    if (!Number.isFinite(value) || text.trim() === '') throw new CliUsageError(`--${name} must be a number, got "${text}"`);
    if (values.has(name)) throw new CliUsageError(`--${name} is given twice`);
    values.set(name, value);
  }
  return values;
}

export function requireFlag(values: Map<string, number>, name: string): number {
  const value = values.get(name);
  if (value === undefined) throw new CliUsageError(`--${name} is required`);
  return value;
}
