import { type ProfileVersion, trainedOnMessage } from '@keyloom/shared';

export type VersionUse = Pick<ProfileVersion, 'number' | 'status' | 'samples' | 'history'>;

/**
 * The numbers of the versions trained on a sample, lowest first: the API's rule for refusing to
 * delete it (a version past draft, or a draft that once started training, holds the sample).
 */
export const versionsTrainedOn = (sampleId: string, versions: readonly VersionUse[]): number[] =>
  versions
    .filter(
      (version) =>
        version.samples.some((sample) => sample.id === sampleId) &&
        (version.status !== 'draft' || version.history.some((step) => step.status === 'training')),
    )
    .map((version) => version.number)
    .sort((a, b) => a - b);

/** Why the sample cannot be deleted (versions were trained on it), or null while it can be. */
export const deleteBlockedReason = (sampleId: string, versions: readonly VersionUse[]): string | null => {
  const trained = versionsTrainedOn(sampleId, versions);
  return trained.length > 0 ? `Cannot be deleted. ${trainedOnMessage(trained)}` : null;
};
