import type { ProfileVersion } from '@keyloom/shared';
import { describeStage } from '../lib/profile-words';

/** The progress bar of a version in training: the value, the stage in words, and how far. */
export const TrainingProgress = ({ version }: { version: Pick<ProfileVersion, 'progress' | 'stage'> }) => {
  const value = Math.round(Math.min(1, Math.max(0, version.progress)) * 100);
  const stage = describeStage(version.stage);
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap justify-between gap-2 font-bold">
        <span id="training-stage">{stage}…</span>
        <span aria-hidden="true">{value}%</span>
      </div>
      <div
        role="progressbar"
        aria-labelledby="training-stage"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={value}
        aria-valuetext={`${value}%: ${stage}`}
        className="h-6 w-full overflow-hidden rounded-full border-2 border-ink bg-surface"
      >
        <div className="h-full bg-saffron" style={{ width: `${value}%` }} />
      </div>
      {version.stage === 'interrupted' && (
        <p>The job worker stopped during training. Keyloom is training this version again from the start.</p>
      )}
      <p className="text-ink-soft">
        You can leave this page: training goes on in the background, and the results appear here when it ends.
      </p>
    </div>
  );
};
