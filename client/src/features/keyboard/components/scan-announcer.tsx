import type { ScanConfig, ScanState } from '../logic/scanner';
import { describeScanHighlight } from '../logic/scan-announcement';

type ScanAnnouncerProps = {
  /** The "Announce the scan highlight" setting: off, the region stays empty. */
  enabled: boolean;
  state: ScanState | null;
  words: readonly string[];
  keyRows: readonly (readonly { spokenLabel: string }[])[];
  config: ScanConfig;
};

/**
 * A visually hidden polite live region that says what the scanner highlights, for switch users who
 * listen. Off by default, so screen-reader users who do not want it are not read every scan step.
 */
export const ScanAnnouncer = ({ enabled, state, words, keyRows, config }: ScanAnnouncerProps) => (
  <p role="status" aria-live="polite" aria-atomic="true" className="sr-only" data-scan-announcement="">
    {enabled ? describeScanHighlight(state, words, keyRows, config) : ''}
  </p>
);
