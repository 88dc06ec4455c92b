// The base English model: order-5 PPM (method C, full and update exclusion)
// trained on all 500 Brown documents, cached serialised in
// corpora/.cache/base-model.bin. Node only (command line, bench, tests).
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { deserializeModel, FormatError, PpmModel, prepareText, serializeModel } from '@keyloom/shared';
import type { PpmSettings } from '@keyloom/shared';
import { joinDocuments, loadBrown } from './brown';
import { cacheDir } from './paths';

/** Settings of the base model (order 5, method C, exclusion: the engine's defaults). */
export const baseModelSettings: Partial<PpmSettings> = {
  order: 5,
  escape: 'C',
  exclusion: true,
  updateExclusion: true,
  alphabetSize: 256,
  literals: true,
};

const cacheFile = join(cacheDir, 'base-model.bin');

/** Trains the base model from the Brown text (about 6 M characters). */
export function trainBaseModel(): PpmModel {
  return PpmModel.train(prepareText(joinDocuments(loadBrown().documents)), baseModelSettings);
}

/**
 * A base model trained on other texts than Brown (`model --base-corpus`): the same settings, each
 * text learned as its own text (no context across files). Frozen.
 */
export function trainBaseModelOn(texts: readonly Uint32Array[]): PpmModel {
  const model = new PpmModel({ ...baseModelSettings, adaptive: true });
  for (const t of texts) model.learnText(t);
  return model.freeze();
}

function matchesSettings(model: PpmModel): boolean {
  const s = model.settings;
  return (Object.keys(baseModelSettings) as (keyof PpmSettings)[]).every(
    (k) => s[k] === baseModelSettings[k],
  );
}

function readCached(): PpmModel | undefined {
  if (!existsSync(cacheFile)) return undefined;
  try {
    const model = deserializeModel(new Uint8Array(readFileSync(cacheFile)));
    return matchesSettings(model) ? model : undefined;
  } catch (error) {
    if (error instanceof FormatError) return undefined; // damaged or older layout: rebuild
    throw error;
  }
}

/** True when the cached base model exists, loads and has the expected settings. */
export function baseModelCacheIsFresh(): boolean {
  return readCached() !== undefined;
}

/**
 * The base model, frozen (it never learns the client's text). Reads the
 * cache, or trains and writes it when missing or stale.
 */
export function loadBaseModel(): PpmModel {
  let model = readCached();
  if (!model) {
    model = trainBaseModel();
    mkdirSync(cacheDir, { recursive: true });
    const tmp = `${cacheFile}.${process.pid}.tmp`;
    writeFileSync(tmp, serializeModel(model));
    renameSync(tmp, cacheFile);
  }
  return model.freeze();
}
