import { Alert } from '@/components/ui/alert';
import { kilobytes } from './trial-figures';
import type { EngineStatus, ModelDownloadInfo } from '../engine/use-keyboard-engine';

const statusWords: Record<EngineStatus, string> = {
  idle: 'No version chosen.',
  downloading: 'Downloading the model…',
  loading: 'Loading the model into this browser…',
  ready: 'Ready. The model runs in this browser: typing keeps working if the network drops.',
  error: 'The model could not be loaded.',
};

type ModelStatusProps = { status: EngineStatus; error: string | null; info: ModelDownloadInfo | null };

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
        data-load-ms={Math.round(info.loadMs)}
      >
        <dt className="font-bold">This version</dt>
        <dd>
          {kilobytes(info.versionCompressedBytes)} downloaded ({kilobytes(info.versionBytes)} unpacked)
        </dd>
        <dt className="font-bold">General English model</dt>
        <dd>
          {info.baseBytes === 0
            ? 'Not used by this version.'
            : `${kilobytes(info.baseCompressedBytes)} downloaded (${kilobytes(info.baseBytes)} unpacked); fetched once per browser session`}
        </dd>
        <dt className="font-bold">Loaded in</dt>
        <dd>
          {Math.round(info.loadMs)} ms (context order {info.order}, {info.contexts.toLocaleString('en-GB')}{' '}
          contexts)
        </dd>
      </dl>
    )}
  </div>
);
