import type { Ref } from 'react';
import { Button } from '@/components/ui/button';
import { cn } from '@/lib/cn';
import { canSpeak } from '../logic/trial-figures';

type TrialOutputProps = {
  /** The output box (scanning moves focus here so the switch presses no button). */
  ref?: Ref<HTMLDivElement>;
  text: string;
  /** The phrase to copy, shown above the text. */
  target: string | null;
  textScale: number;
  highContrast: boolean;
  onClear: () => void;
  /** Clear is not offered while a trial runs (the log would not match the text). */
  clearDisabled: boolean;
};

/** The target phrase, the large text typed so far, and Speak / Clear. */
export const TrialOutput = ({
  ref,
  text,
  target,
  textScale,
  highContrast,
  onClear,
  clearDisabled,
}: TrialOutputProps) => {
  const speech = canSpeak();
  const speak = () => {
    if (!speech || text.trim() === '') return;
    window.speechSynthesis.cancel();
    window.speechSynthesis.speak(new SpeechSynthesisUtterance(text));
  };
  return (
    <div className="flex flex-col gap-3">
      {target && (
        <p className="text-lg">
          <span className="font-bold">Type this: </span>
          <span data-target-phrase style={{ fontSize: `${textScale}em` }}>
            {target}
          </span>
        </p>
      )}
      <div
        ref={ref}
        role="textbox"
        aria-readonly="true"
        aria-multiline="true"
        aria-label="Text typed so far"
        tabIndex={0}
        data-output
        data-text={text}
        className={cn(
          'min-h-24 rounded-xl border-4 p-4 leading-snug break-words whitespace-pre-wrap',
          highContrast ? 'border-white bg-black text-white' : 'border-ink bg-surface text-ink',
        )}
        style={{ fontSize: `${2 * textScale}rem` }}
      >
        {text}
        {/* A caret so the end of the text (and a trailing space) can be seen. */}
        <span
          aria-hidden="true"
          className={cn('ml-0.5 inline-block w-1 align-middle', highContrast ? 'bg-[#ffff00]' : 'bg-rust')}
          style={{ height: '1em' }}
        />
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button
          onClick={speak}
          disabled={!speech || text.trim() === ''}
          aria-describedby={speech ? undefined : 'speak-unavailable'}
        >
          Speak
        </Button>
        <Button onClick={onClear} disabled={clearDisabled || text === ''}>
          Clear
        </Button>
        {!speech && (
          <p id="speak-unavailable" className="text-ink-soft">
            This browser cannot speak text aloud.
          </p>
        )}
      </div>
    </div>
  );
};
