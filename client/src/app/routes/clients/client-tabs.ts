import type { Role } from '@keyloom/shared';
import { type ClientTab, clientTabs } from '@/config/paths';

export const tabLabels: Record<ClientTab, string> = {
  overview: 'Overview',
  consent: 'Consent & family',
  samples: 'Writing samples',
  profiles: 'Profile versions',
  trials: 'Try-outs',
  summaries: 'Family updates',
};

/**
 * The tabs each role may open (the API refuses the rest): carers see no consent or samples, but
 * read the profile versions they are asked to try and sign off.
 */
export const tabsForRole = (role: Role): readonly ClientTab[] =>
  role === 'carer' ? ['overview', 'profiles', 'trials'] : clientTabs;
