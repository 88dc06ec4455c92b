// Downloads a version's model, the base model it was trained beside and the base vocabulary its
// suggestion row offers words from, once per browser session: the gunzipped bytes stay in
// module-level maps (by version id and by sha), so switching versions back and forth downloads
// nothing twice; the HTTP cache revalidates by ETag across sessions (the bases are immutable).
import { apiErrorSchema, readProfileFile } from '@keyloom/shared';
import { env } from '@/config/env';
import { ApiError } from '@/lib/api-client';
import { gunzipBytes, isGzip } from './gunzip';

/** One downloaded file: its bytes after gunzip and both sizes. */
export type DownloadedModel = {
  bytes: Uint8Array;
  compressedBytes: number;
  etag: string | null;
  /** The sha256 the API names in X-Keyloom-Base-Words (a version's model download only), or null. */
  baseWordsSha256: string | null;
};

/**
 * A version's model and, when it was trained beside them, the base model and the base
 * vocabulary (a version trained before the word-aware list gets the server's base vocabulary).
 */
export type VersionModels = {
  version: DownloadedModel;
  base: DownloadedModel | null;
  baseWords: DownloadedModel | null;
};

/** Header of the version's model download naming the base vocabulary (sha256 or "none"). */
export const BASE_WORDS_HEADER = 'X-Keyloom-Base-Words';
const SHA256 = /^[0-9a-f]{64}$/;

const UNREACHABLE_MESSAGE = 'Keyloom could not download the model. Check your connection and try again.';

const versionCache = new Map<string, Promise<DownloadedModel>>();
const baseCache = new Map<string, Promise<DownloadedModel>>();
const baseWordsCache = new Map<string, Promise<DownloadedModel>>();

async function errorOf(response: Response): Promise<ApiError> {
  let body: unknown;
  try {
    body = JSON.parse(await response.text());
  } catch {
    body = undefined;
  }
  const parsed = apiErrorSchema.safeParse(body);
  if (parsed.success) return new ApiError(response.status, parsed.data.message, parsed.data.issues ?? []);
  return new ApiError(
    response.status,
    `The server answered with an error (HTTP ${response.status}) while sending the model. Try again in a moment.`,
  );
}

async function downloadGzip(path: string, signal?: AbortSignal): Promise<DownloadedModel> {
  let response: Response;
  try {
    response = await fetch(`${env.API_URL}${path}`, {
      credentials: 'same-origin',
      headers: { Accept: 'application/octet-stream' },
      signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(0, UNREACHABLE_MESSAGE);
  }
  if (!response.ok) throw await errorOf(response);
  const compressed = new Uint8Array(await response.arrayBuffer());
  // A proxy that sent it with Content-Encoding: gzip has had the browser unpack it already.
  const bytes = isGzip(compressed) ? await gunzipBytes(compressed) : compressed;
  const named = response.headers.get(BASE_WORDS_HEADER)?.toLowerCase() ?? '';
  return {
    bytes,
    compressedBytes: compressed.length,
    etag: response.headers.get('ETag'),
    baseWordsSha256: SHA256.test(named) ? named : null,
  };
}

// A failed download must not stay in the cache: the next attempt tries again.
function cached(
  cache: Map<string, Promise<DownloadedModel>>,
  key: string,
  load: () => Promise<DownloadedModel>,
) {
  let entry = cache.get(key);
  if (!entry) {
    entry = load();
    cache.set(key, entry);
    entry.catch(() => {
      if (cache.get(key) === entry) cache.delete(key);
    });
  }
  return entry;
}

/** GET /api/profile-versions/:id/model, gunzipped (once per session). */
export const downloadVersionModel = (versionId: string): Promise<DownloadedModel> =>
  cached(versionCache, versionId, () =>
    downloadGzip(`/profile-versions/${encodeURIComponent(versionId)}/model`),
  );

/** GET /api/base-models/:sha256, gunzipped (once per session). */
export const downloadBaseModel = (sha256: string): Promise<DownloadedModel> =>
  cached(baseCache, sha256, () => downloadGzip(`/base-models/${encodeURIComponent(sha256)}`));

/** GET /api/base-words/:sha256, gunzipped (once per session). */
export const downloadBaseWords = (sha256: string): Promise<DownloadedModel> =>
  cached(baseWordsCache, sha256, () => downloadGzip(`/base-words/${encodeURIComponent(sha256)}`));

/**
 * The version's model, then the base model its header names (`baseModelSha256`) and the base
 * vocabulary the download names (X-Keyloom-Base-Words), if any, both at once.
 * @throws ApiError with the API's message (404, 409…) or ProfileFileError / GunzipError for damaged bytes
 */
export async function downloadVersionModels(versionId: string): Promise<VersionModels> {
  const version = await downloadVersionModel(versionId);
  const { header } = readProfileFile(version.bytes);
  const [base, baseWords] = await Promise.all([
    header.baseModelSha256 ? downloadBaseModel(header.baseModelSha256) : null,
    version.baseWordsSha256 ? downloadBaseWords(version.baseWordsSha256) : null,
  ]);
  return { version, base, baseWords };
}

/** Forgets every downloaded model (tests; a sign-out could call it too). */
export function clearModelDownloads(): void {
  versionCache.clear();
  baseCache.clear();
  baseWordsCache.clear();
}
