import type { ProfileVersion } from '@keyloom/shared';
import { vocabularyDifferences } from '../lib/vocabulary-lists';

const Items = ({ label, items }: { label: string; items: readonly string[] }) =>
  items.length > 0 ? (
    <li>
      {label}: {items.join(', ')}
    </li>
  ) : null;

/** The added and blocked words each compared version changed against the one before it in the comparison. */
export const VocabularyDifferences = ({ versions }: { versions: readonly ProfileVersion[] }) => {
  const pairs = versions.slice(1).map((version, index) => ({ before: versions[index]!, after: version }));
  if (pairs.length === 0) return null;
  return (
    <section aria-labelledby="vocabulary-differences-heading" className="flex flex-col gap-3">
      <h2 id="vocabulary-differences-heading" className="text-2xl font-bold">
        Added and blocked words
      </h2>
      {pairs.map(({ before, after }) => {
        const diff = vocabularyDifferences(before.settings.vocabulary, after.settings.vocabulary);
        const none = [
          diff.additions.added,
          diff.additions.removed,
          diff.blocks.added,
          diff.blocks.removed,
        ].every((items) => items.length === 0);
        return (
          <div key={after.id} className="flex flex-col gap-1">
            <h3 className="text-xl font-bold">
              Version {after.number} against version {before.number}
            </h3>
            {none ? (
              <p>The same added and blocked words.</p>
            ) : (
              <ul className="list-disc pl-6">
                <Items label="Words added" items={diff.additions.added} />
                <Items label="Additions taken out" items={diff.additions.removed} />
                <Items label="Words blocked" items={diff.blocks.added} />
                <Items label="Blocks lifted" items={diff.blocks.removed} />
              </ul>
            )}
          </div>
        );
      })}
    </section>
  );
};
