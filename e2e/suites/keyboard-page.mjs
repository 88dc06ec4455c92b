// The test keyboard page as the browser suites drive it: its keys, its suggestion row and the
// wait until the row answers the text on screen.

/** Accessible names of the keys that are not letters. */
export const keyNames = {
  ' ': 'space',
  '.': 'full stop',
  ',': 'comma',
  '?': 'question mark',
  "'": 'apostrophe',
  '-': 'hyphen',
};

export const suggestionRow = (page) => page.getByRole('group', { name: 'Suggestions' });

/** The key that types `char` (a lower-case letter or one of keyNames). */
export const keyButton = (page, char) =>
  page
    .getByRole('group', { name: 'Keys' })
    .getByRole('button', { name: keyNames[char] ?? char, exact: true });

/** Waits until the suggestion row answers the text on screen. */
export async function rowSettled(page) {
  await page.waitForFunction(() => {
    const row = document.querySelector('[role="group"][aria-label="Suggestions"]');
    const output = document.querySelector('[data-output]');
    return (
      row !== null && output !== null && row.getAttribute('data-answers') === output.getAttribute('data-text')
    );
  });
}

/**
 * Turns the automatic capital off (it is on by default): the suites type lower-case phrases with the
 * lower-case keys.
 */
export async function capitalsOff(page) {
  const box = page.getByRole('checkbox', { name: 'Capital after a full stop' });
  if (await box.isChecked()) await box.uncheck();
}
