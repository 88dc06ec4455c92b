// `model compress [--order 5] [--escape C] <in> <out>` and
// `model decompress <in> <out>`: the container of engine/container.ts,
// coding the file exactly as it is (adaptive from an empty model). Bad
// arguments, unreadable files, input that is not UTF-8 and damaged
// compressed files all end with one line naming the problem and exit code 2.
import { readFile, writeFile } from 'node:fs/promises';
import { UsageError } from './cli-errors';
import { compressBytes, decompressBytes } from '@keyloom/shared/src/engine/container';
import { FormatError } from '@keyloom/shared/src/engine/byte-io';
import { type EscapeMethod } from '@keyloom/shared/src/engine/ppm-settings';

type Parsed = { options: Map<string, string>; positional: string[] };

function parse(args: string[], allowed: string[]): Parsed {
  const options = new Map<string, string>();
  const positional: string[] = [];
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a.startsWith('--')) {
      const [name, inline] = a.slice(2).split('=', 2);
      if (!allowed.includes(name))
        throw new UsageError(
          `unknown option --${name}; expected ${allowed.map((o) => `--${o}`).join(', ') || 'none'}`,
        );
      const value = inline ?? args[++i];
      if (value === undefined) throw new UsageError(`option --${name} needs a value`);
      options.set(name, value);
    } else positional.push(a);
  }
  return { options, positional };
}

async function readInput(path: string): Promise<Uint8Array> {
  try {
    return new Uint8Array(await readFile(path));
  } catch (error) {
    throw new UsageError(`cannot read ${path}: ${error instanceof Error ? error.message : String(error)}`);
  }
}

async function writeOutput(path: string, bytes: Uint8Array): Promise<void> {
  try {
    await writeFile(path, bytes);
  } catch (error) {
    throw new UsageError(`cannot write ${path}: ${error instanceof Error ? error.message : String(error)}`);
  }
}

/** `compress [--order 0..12] [--escape A|B|C|D] <in> <out>` */
export async function runCompress(args: string[]): Promise<void> {
  const { options, positional } = parse(args, ['order', 'escape']);
  if (positional.length !== 2) throw new UsageError('usage: compress [--order 5] [--escape C] <in> <out>');
  const orderText = options.get('order') ?? '5';
  const order = Number(orderText);
  if (!/^\d+$/.test(orderText) || order > 12)
    throw new UsageError(`--order must be an integer 0..12, got ${JSON.stringify(orderText)}`);
  const escape = (options.get('escape') ?? 'C').toUpperCase();
  if (!['A', 'B', 'C', 'D'].includes(escape))
    throw new UsageError(`--escape must be A, B, C or D, got ${JSON.stringify(options.get('escape'))}`);
  const [input, output] = positional;
  const bytes = await readInput(input);
  let packed: Uint8Array;
  try {
    packed = compressBytes(bytes, { order, escape: escape as EscapeMethod });
  } catch (error) {
    if (error instanceof FormatError) throw new UsageError(`${input}: ${error.message}`);
    throw error;
  }
  await writeOutput(output, packed);
  process.stdout.write(`${input}: ${bytes.length} bytes -> ${packed.length} bytes\n`);
}

/** `decompress <in> <out>` */
export async function runDecompress(args: string[]): Promise<void> {
  const { positional } = parse(args, []);
  if (positional.length !== 2) throw new UsageError('usage: decompress <in> <out>');
  const [input, output] = positional;
  const packed = await readInput(input);
  let bytes: Uint8Array;
  try {
    bytes = decompressBytes(packed);
  } catch (error) {
    if (error instanceof FormatError) throw new UsageError(`${input}: ${error.message}`);
    throw error;
  }
  await writeOutput(output, bytes);
  process.stdout.write(`${input}: ${packed.length} bytes -> ${bytes.length} bytes\n`);
}
