import { isListableEarlyWord } from '@keyloom/shared';
import type { ProfileReportView } from '../lib/profile-report';

/** Early words a carer is pointed at: enough to build a few sentences, not a list to study. */
const WORDS_TO_TRY = 8;

/**
 * A carer's view of a trained version: not its measures but what to try in a trial, in plain words —
 * how many words the list offers, the client's own words it should now offer early, and what to
 * watch for and report at sign-off.
 */
export const WhatToTry = ({
  report,
  versionNumber,
}: {
  report: ProfileReportView;
  versionNumber: number;
}) => {
  const slots = report.rates.assumptions.slots;
  // Reports made before numbers and short words were left out still hold them: filtered here too.
  const words = (report.earlyWords ?? [])
    .map((item) => item.word)
    .filter(isListableEarlyWord)
    .slice(0, WORDS_TO_TRY);
  return (
    <section aria-labelledby="what-to-try-heading" className="flex max-w-3xl flex-col gap-4 text-lg">
      <h2 id="what-to-try-heading" className="text-3xl font-bold">
        What to try with version {versionNumber}
      </h2>
      <p>
        The list above the keys offers up to {slots} words at a time; a word goes in only when it is picked.
      </p>
      {words.length > 0 && (
        <>
          <p id="words-to-try-hint">
            Words from the client’s own writing this version should offer after the first letter or sooner.
            Try sentences that use some of them:
          </p>
          <ul aria-describedby="words-to-try-hint" aria-label="Words to try" className="flex flex-wrap gap-2">
            {words.map((word) => (
              <li key={word} className="rounded-full border-2 border-thread bg-surface px-3 py-1">
                {word}
              </li>
            ))}
          </ul>
        </>
      )}
      <ul className="list-disc pl-6">
        <li>Type two or three of the client’s usual sentences with them, at their own pace.</li>
        <li>Watch whether the wanted word appears after one or two letters.</li>
        <li>Note words that never appear, and odd words that do.</li>
        <li>Say what you saw when you sign the version off: that is what the clinician reads.</li>
      </ul>
    </section>
  );
};
