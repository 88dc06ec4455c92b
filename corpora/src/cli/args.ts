// Small argument parser shared by the engine's commands. Every problem is a
// UsageError (one line, exit code 2), naming the option or file at fault.
import { readFileSync } from 'node:fs';
import { UsageError } from './cli-errors';

/** What a command accepts: options taking one value, options taking one or more values, bare flags. */
export type ArgSpec = { single?: readonly string[]; multi?: readonly string[]; flags?: readonly string[] };

export type ParsedArgs = {
  /** Values of --name options (last one wins for single-valued options). */
  values: Map<string, string[]>;
  flags: Set<string>;
  positional: string[];
};

/** Parses `--name value`, `--name=value`, `--list a b c` and `--flag`. */
export function parseArgs(args: readonly string[], spec: ArgSpec): ParsedArgs {
  const single = new Set(spec.single ?? []);
  const multi = new Set(spec.multi ?? []);
  const flags = new Set(spec.flags ?? []);
  const out: ParsedArgs = { values: new Map(), flags: new Set(), positional: [] };
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (!arg.startsWith('--') || arg === '--') {
      out.positional.push(arg);
      continue;
    }
    const eq = arg.indexOf('=');
    const name = eq > 0 ? arg.slice(2, eq) : arg.slice(2);
    const inline = eq > 0 ? arg.slice(eq + 1) : undefined;
    if (flags.has(name)) {
      if (inline !== undefined) throw new UsageError(`option --${name} takes no value`);
      out.flags.add(name);
    } else if (single.has(name)) {
      const value = inline ?? args[++i];
      if (value === undefined || (inline === undefined && value.startsWith('--')))
        throw new UsageError(`option --${name} needs a value`);
      out.values.set(name, [value]);
    } else if (multi.has(name)) {
      const list = out.values.get(name) ?? [];
      if (inline !== undefined) list.push(inline);
      while (i + 1 < args.length && !args[i + 1].startsWith('--')) list.push(args[++i]);
      if (list.length === 0) throw new UsageError(`option --${name} needs at least one value`);
      out.values.set(name, list);
    } else {
      throw new UsageError(`unknown option --${name}`);
    }
  }
  return out;
}

/** The value of a single-valued option, or `fallback`. */
export function optionValue(parsed: ParsedArgs, name: string, fallback: string): string;
export function optionValue(parsed: ParsedArgs, name: string): string | undefined;
export function optionValue(parsed: ParsedArgs, name: string, fallback?: string): string | undefined {
  return parsed.values.get(name)?.[0] ?? fallback;
}

/** Checks that `value` is one of `allowed`. */
export function oneOf<T extends string>(name: string, value: string, allowed: readonly T[]): T {
  if (!(allowed as readonly string[]).includes(value))
    throw new UsageError(`--${name} must be one of ${allowed.join(', ')}, got ${JSON.stringify(value)}`);
  return value as T;
}

/** Parses an integer in [min, max]. */
export function integerIn(name: string, value: string, min: number, max: number): number {
  const n = Number(value);
  if (!/^-?\d+$/.test(value) || !Number.isInteger(n) || n < min || n > max)
    throw new UsageError(`--${name} must be an integer ${min}..${max}, got ${JSON.stringify(value)}`);
  return n;
}

/** Parses a number in [min, max]. */
export function numberIn(name: string, value: string, min: number, max: number): number {
  const n = Number(value);
  if (value.trim() === '' || !Number.isFinite(n) || n < min || n > max)
    throw new UsageError(`--${name} must be a number ${min}..${max}, got ${JSON.stringify(value)}`);
  return n;
}

/** on|off → boolean. */
export function onOff(name: string, value: string): boolean {
  return oneOf(name, value, ['on', 'off'] as const) === 'on';
}

/**
 * Reads a file that must be text: readable, valid UTF-8, no NUL bytes.
 * A leading byte-order mark is dropped.
 */
export function readTextFile(path: string): string {
  let bytes: Buffer;
  try {
    bytes = readFileSync(path);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code ?? 'error';
    throw new UsageError(
      `cannot read ${path}: ${code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'is a directory' : code}`,
    );
  }
  if (bytes.includes(0)) throw new UsageError(`${path} is not a text file (it contains NUL bytes)`);
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new UsageError(`${path} is not a text file (invalid UTF-8)`);
  }
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}
