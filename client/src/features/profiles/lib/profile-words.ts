import { escapeMethods, type ProfileVersion, type Role } from '@keyloom/shared';

// What each escape method does, in one plain line (the methods keep their published letters).
export const escapeExplanations: Record<(typeof escapeMethods)[number], string> = {
  A: 'A new letter gets one fixed share in every context — cautious, suits very little text.',
  B: 'A letter counts only once it has followed a context twice — slow to trust what it has seen once.',
  C: 'New letters are likelier where many different letters have followed — the usual default.',
  D: 'Like C, but each first sighting counts half — often a little better on everyday text.',
};

// Each stage of a training job in words (profileStages in the shared schema).
export const stageWords: Record<string, string> = {
  queued: 'Waiting for a free worker',
  interrupted: 'Interrupted, retrying',
  preparing: 'Preparing the text',
  training: 'Training the model',
  'cross-validating': 'Testing on text the model has not seen',
  simulating: 'Simulating typing with suggestions',
  saving: 'Saving the results',
};

/** The stage of a running job in words. */
export const describeStage = (stage: string | null): string => (stage && stageWords[stage]) ?? 'Starting';

// Versions that hold a model (trained, and every later state but "sent back") can be exported.
const withModel = new Set<ProfileVersion['status']>(['trained', 'signed_off', 'active', 'retired']);

export const visibleActions = (role: Role, status: ProfileVersion['status']) => ({
  train: role === 'clinician' && status === 'draft',
  retry: role === 'clinician' && status === 'failed',
  cancel: role === 'clinician' && status === 'training',
  // Export: the owning clinician or a supervisor (the API refuses carers).
  exportFile: (role === 'clinician' || role === 'supervisor') && withModel.has(status),
  signOff: role === 'carer' && status === 'trained',
  decide: role === 'supervisor' && status === 'signed_off',
  // The supervisor, who approves, also takes the active version out of use.
  retire: role === 'supervisor' && status === 'active',
  // A draft (never trained) can be deleted by its clinician.
  deleteDraft: role === 'clinician' && status === 'draft',
});

/**
 * The version that becomes active when `active` is retired, by the API's rule: the most recently
 * approved version before it that was retired by a later approval (not by hand); null for none.
 */
export const activeAfterRetire = (
  versions: readonly ProfileVersion[],
  active: Pick<ProfileVersion, 'id' | 'approvedAt'>,
): ProfileVersion | null => {
  const until = active.approvedAt ?? '9999';
  const candidates = versions.filter(
    (v) =>
      v.id !== active.id &&
      v.status === 'retired' &&
      v.retiredAt === null &&
      v.approvedAt !== null &&
      v.approvedAt <= until,
  );
  candidates.sort((a, b) => (b.approvedAt ?? '').localeCompare(a.approvedAt ?? '') || b.number - a.number);
  return candidates[0] ?? null;
};

/** What retiring does, naming the version that becomes active (or saying none will be). */
export const retireDescription = (
  version: Pick<ProfileVersion, 'number'>,
  next: Pick<ProfileVersion, 'number'> | null,
) =>
  next
    ? `Version ${version.number} stops being the active profile and version ${next.number} becomes active again.`
    : `Version ${version.number} stops being the active profile; no version will be active until a new one is approved.`;

/** What deleting a draft removes, and what it leaves alone. */
export const deleteDraftDescription = (version: Pick<ProfileVersion, 'number' | 'samples'>) => {
  const n = version.samples.length;
  return (
    `Draft version ${version.number} is deleted: its settings, its note and its choice of ` +
    `${n} ${n === 1 ? 'sample' : 'samples'}. The samples themselves are kept.`
  );
};
