import { Alert } from '@/components/ui/alert';
import { kilobytes } from '../logic/trial-figures';
import type { EngineStatus, ModelDownloadInfo } from '../engine/use-keyboard-engine';

const statusWords: Record<EngineStatus, string> = {
  idle: 'No version chosen.',
  downloading: 'Downloading the model…',
  loading: 'Loading the model into this browser…',
  ready: 'Ready. The model runs in this browser: typing keeps working if the network drops.',
  error: 'The model could not be loaded.',
};

type ModelStatusProps = { status: EngineStatus; error: string | null; info: ModelDownloadInfo | null };

/** A base file's line: its sizes, or that the version does without it. */
const baseLine = (bytes: number, compressedBytes: number): string =>
  bytes === 0
    ? 'Not used by this version.'
    : `${kilobytes(compressedBytes)} downloaded (${kilobytes(bytes)} unpacked); fetched once per browser session`;

/** Where the model download stands, what it weighed, and any error in words. */
export const ModelStatus = ({ status, error, info }: ModelStatusProps) => (
  <div className="flex flex-col gap-2">
    <div role="status" aria-live="polite">
      {status === 'error' ? (
        <Alert tone="error" title={statusWords.error}>
          <p>{error ?? 'No reason was given.'}</p>
        </Alert>
      ) : (
        <p className="font-bold" data-engine-status={status}>
          {statusWords[status]}
        </p>
      )}
    </div>
    {info && (
      <dl
        aria-label="Model download"
        className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-ink-soft"
        data-version-bytes={info.versionBytes}
        data-version-compressed-bytes={info.versionCompressedBytes}
        data-base-bytes={info.baseBytes}
        data-base-compressed-bytes={info.baseCompressedBytes}
        data-base-words-bytes={info.baseWordsBytes}
        data-base-words-compressed-bytes={info.baseWordsCompressedBytes}
        data-load-ms={Math.round(info.loadMs)}
      >
        <dt className="font-bold">This version</dt>
        <dd>
          {kilobytes(info.versionCompressedBytes)} downloaded ({kilobytes(info.versionBytes)} unpacked)
        </dd>
        <dt className="font-bold">General English model</dt>
        <dd>{baseLine(info.baseBytes, info.baseCompressedBytes)}</dd>
        <dt className="font-bold">General English words</dt>
        <dd>{baseLine(info.baseWordsBytes, info.baseWordsCompressedBytes)}</dd>
        <dt className="font-bold">Loaded in</dt>
        <dd>
          {Math.round(info.loadMs)} ms (context order {info.order}, {info.contexts.toLocaleString('en-GB')}{' '}
          contexts)
        </dd>
      </dl>
    )}
  </div>
);
