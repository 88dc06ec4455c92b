import type { AccessMethod, CreateClientInput } from '@keyloom/shared';

type TimingField = 'scanIntervalMs' | 'dwellMs' | 'keyTimeMs';

// The one timing that matters for each access method, and what it means.
export const timingFor: Record<AccessMethod, { field: TimingField; label: string; hint: string }> = {
  switch: {
    field: 'scanIntervalMs',
    label: 'Scan interval (ms)',
    hint: 'How long each scan step stays highlighted before moving on. Keep the starting value until you have timed the client.',
  },
  eye_gaze: {
    field: 'dwellMs',
    label: 'Dwell time (ms)',
    hint: 'How long the gaze must rest on a key before it is chosen.',
  },
  head_pointer: {
    field: 'keyTimeMs',
    label: 'Time per key (ms)',
    hint: 'Average time to move to a key and select it, from one key to the next.',
  },
  direct: {
    field: 'keyTimeMs',
    label: 'Time per key (ms)',
    hint: 'Average time to reach a key and press it, from one key to the next.',
  },
  other: {
    field: 'keyTimeMs',
    label: 'Time per key (ms)',
    hint: 'Average time the client needs for one selection, from one to the next.',
  },
};

/** Only the timing that fits the method is kept; the others are cleared. */
export const keepMatchingTiming = (values: CreateClientInput): CreateClientInput => {
  const field = timingFor[values.accessMethod].field;
  return {
    ...values,
    scanIntervalMs: field === 'scanIntervalMs' ? values.scanIntervalMs : null,
    dwellMs: field === 'dwellMs' ? values.dwellMs : null,
    keyTimeMs: field === 'keyTimeMs' ? values.keyTimeMs : null,
  };
};
