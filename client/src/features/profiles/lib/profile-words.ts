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
});
