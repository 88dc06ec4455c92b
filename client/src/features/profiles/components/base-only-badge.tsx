import { Badge } from '@/components/ui/badge';

/** The label every base-only version carries, wherever it is listed. */
export const BaseOnlyBadge = () => <Badge tone="neutral">General English only</Badge>;
