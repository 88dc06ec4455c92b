/**
 * Focuses the element with `id` once the current render and a closing dialog's own focus return are
 * done (a dialog gives focus back to its opener when it closes, which may be gone by then).
 */
export function focusSoon(id: string): void {
  window.setTimeout(() => document.getElementById(id)?.focus(), 0);
}

/** The id of a sample's link in the samples table (focus lands there after a change to the row). */
export const sampleLinkId = (sampleId: string) => `sample-link-${sampleId}`;
