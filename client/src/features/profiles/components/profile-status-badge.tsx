import { type ProfileVersionStatus, profileVersionStatusLabels } from '@keyloom/shared';
import { Badge, type BadgeTone } from '@/components/ui/badge';

const tones: Record<ProfileVersionStatus, BadgeTone> = {
  draft: 'neutral',
  training: 'warn',
  trained: 'warn',
  failed: 'bad',
  signed_off: 'warn',
  active: 'good',
  retired: 'neutral',
  sent_back: 'bad',
};

/** A profile version's status in words (the shared labels). */
export const ProfileStatusBadge = ({ status }: { status: ProfileVersionStatus }) => (
  <Badge tone={tones[status]}>{profileVersionStatusLabels[status]}</Badge>
);
