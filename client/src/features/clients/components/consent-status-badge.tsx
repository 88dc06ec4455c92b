import type { ConsentStatus } from '@keyloom/shared';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import { consentStatusLabels } from '../lib/consent-status';

const tones: Record<ConsentStatus, BadgeTone> = {
  none: 'neutral',
  active: 'good',
  expired: 'warn',
  withdrawn: 'bad',
};

/** Where a client's consent stands, in words. */
export const ConsentStatusBadge = ({ status }: { status: ConsentStatus }) => (
  <Badge tone={tones[status]}>{consentStatusLabels[status]}</Badge>
);
