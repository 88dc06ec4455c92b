import type { ConsentStatus } from '@keyloom/shared';

// Where a client's consent stands, in words (badges and sorting use the same words).
export const consentStatusLabels: Record<ConsentStatus, string> = {
  none: 'No consent recorded',
  active: 'Consent active',
  expired: 'Consent expired',
  withdrawn: 'Consent withdrawn',
};
