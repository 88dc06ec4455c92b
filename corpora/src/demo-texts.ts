// The invented demo samples of the Willowmere demo clinic (corpora/demo/*.txt), prepared as the
// engine prepares any text. Node only (tests and checks).
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { prepareText } from '@keyloom/shared';
import { demoDir } from './paths';

/** The demo samples' names (*.txt, sorted) and texts. */
export function demoSamples(): { name: string; text: Uint32Array }[] {
  return readdirSync(demoDir)
    .filter((name) => name.endsWith('.txt'))
    .sort()
    .map((name) => ({ name, text: prepareText(readFileSync(join(demoDir, name), 'utf8')) }));
}
