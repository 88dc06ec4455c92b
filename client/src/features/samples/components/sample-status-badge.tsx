import type { SampleStatus } from '@keyloom/shared';
import { Badge, type BadgeTone } from '@/components/ui/badge';

const words: Record<SampleStatus, { label: string; tone: BadgeTone }> = {
  needs_review: { label: 'Needs review', tone: 'warn' },
  ready: { label: 'Ready', tone: 'good' },
  excluded: { label: 'Left out', tone: 'neutral' },
};

/** A sample's review status in words. */
export const SampleStatusBadge = ({ status }: { status: SampleStatus }) => (
  <Badge tone={words[status].tone}>{words[status].label}</Badge>
);
