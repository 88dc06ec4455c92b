import { waitFor, within } from '@testing-library/react';
import { expect } from 'vitest';

/**
 * The list of refused fields at the top of a form after a refused submit: found by its heading,
 * focused, with one link per field whose words are `entries`, in order. Returns the list.
 */
export const expectErrorSummary = async (scope: HTMLElement, heading: string, entries: readonly string[]) => {
  const summary = await within(scope).findByRole('group', { name: heading });
  await waitFor(() => expect(summary).toHaveFocus());
  expect(
    within(summary)
      .getAllByRole('link')
      .map((link) => link.textContent),
  ).toEqual(entries);
  return summary;
};
