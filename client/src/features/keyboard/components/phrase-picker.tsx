import type { PracticePhrase } from '@keyloom/shared';
import { memo, useId } from 'react';
import { fieldClasses } from '@/components/ui/field-classes';

type PhrasePickerProps = {
  phrases: readonly PracticePhrase[];
  value: string | null;
  onChange: (phraseId: string | null) => void;
  disabled: boolean;
};

/** Chooses the phrase to copy in the trial (or none, to type freely). */
export const PhrasePicker = memo(function PhrasePicker({
  phrases,
  value,
  onChange,
  disabled,
}: PhrasePickerProps) {
  const id = useId();
  const own = phrases.filter((phrase) => phrase.source === 'client');
  const builtIn = phrases.filter((phrase) => phrase.source === 'keyloom');
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-bold">
        Practice phrase
      </label>
      <select
        id={id}
        className={fieldClasses(false)}
        value={value ?? ''}
        disabled={disabled}
        onChange={(event) => onChange(event.target.value === '' ? null : event.target.value)}
      >
        <option value="">None — type freely</option>
        {own.length > 0 && (
          <optgroup label="The client’s own phrases">
            {own.map((phrase) => (
              <option key={phrase.id} value={phrase.id}>
                {phrase.text}
              </option>
            ))}
          </optgroup>
        )}
        <optgroup label="Keyloom’s practice phrases">
          {builtIn.map((phrase) => (
            <option key={phrase.id} value={phrase.id}>
              {phrase.text}
            </option>
          ))}
        </optgroup>
      </select>
    </div>
  );
});
