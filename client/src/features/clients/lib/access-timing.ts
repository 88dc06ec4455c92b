import {
  type AccessMethod,
  accessMethods,
  type AccessTimingField,
  accessTimingFields,
  accessTimingLabels,
  type CreateClientInput,
} from '@keyloom/shared';

// What the one timing the client record keeps (the first of accessTimingFields) means for each method.
const timingHints: Record<AccessMethod, string> = {
  switch:
    'How long each scan step stays highlighted before moving on. Keep the starting value until you have timed the client.',
  eye_gaze: 'How long the gaze must rest on a key before it is chosen.',
  head_pointer: 'Average time to move to a key and select it, from one key to the next.',
  direct: 'Average time to reach a key and press it, from one key to the next.',
  other: 'Average time the client needs for one selection, from one to the next.',
};

/** The timing field the client record keeps for each access method, its label and hint. */
export const timingFor = Object.fromEntries(
  accessMethods.map((method) => {
    const field = accessTimingFields[method][0];
    return [method, { field, label: accessTimingLabels[field], hint: timingHints[method] }];
  }),
) as Record<AccessMethod, { field: AccessTimingField; label: string; hint: string }>;

/**
 * Only the timing that fits the method is kept; the others are cleared. Used on the form's values
 * before they are checked (a hidden field cannot block a submit) and on the parsed values sent.
 */
export const keepMatchingTiming = <
  T extends Pick<CreateClientInput, 'accessMethod'> & Partial<Record<AccessTimingField, unknown>>,
>(
  values: T,
): T => {
  const field = timingFor[values.accessMethod].field;
  return {
    ...values,
    scanIntervalMs: field === 'scanIntervalMs' ? values.scanIntervalMs : null,
    dwellMs: field === 'dwellMs' ? values.dwellMs : null,
    keyTimeMs: field === 'keyTimeMs' ? values.keyTimeMs : null,
  };
};
