// `npm run corpora`: builds the base-model cache in corpora/.cache/ (Brown
// running text, SUBTLEX lexicon, serialised base PPM model, base vocabulary). Idempotent:
// each part is skipped when its cache is up to date.
import { baseModelCacheIsFresh, loadBaseModel } from './base-model';
import { baseWordsCacheIsFresh, loadBaseWords } from './base-words';
import { brownCacheIsFresh, loadBrown } from './brown';
import { lexiconCacheIsFresh, loadLexicon } from './lexicon';

function step(name: string, fresh: () => boolean, build: () => string): void {
  if (fresh()) {
    process.stdout.write(`corpora: ${name} is up to date\n`);
    return;
  }
  const start = performance.now();
  const summary = build();
  process.stdout.write(
    `corpora: built ${name} (${summary}) in ${((performance.now() - start) / 1000).toFixed(1)} s\n`,
  );
}

step('Brown running text', brownCacheIsFresh, () => {
  const { documents } = loadBrown();
  const chars = documents.reduce((n, d) => n + d.text.length, 0);
  return `${documents.length} documents, ${chars} characters`;
});
step('SUBTLEX lexicon', lexiconCacheIsFresh, () => `${loadLexicon().size} words`);
step('base model', baseModelCacheIsFresh, () => {
  const model = loadBaseModel();
  return `order ${model.order}, ${model.contextCount} contexts`;
});
step('base vocabulary', baseWordsCacheIsFresh, () => {
  const words = loadBaseWords();
  return `${words.ngram.vocabularySize} corpus words, ${words.lexicon?.size ?? 0} list words`;
});
