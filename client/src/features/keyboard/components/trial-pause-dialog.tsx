import { useEffect, useId, useRef } from 'react';
import { fieldClasses } from '@/components/ui/field-classes';
import { cn } from '@/lib/cn';
import { targetClasses, tintStyle } from '../logic/keyboard-styles';
import { type PauseChoiceId, pauseChoices } from '../logic/pause-choices';
import { DwellFill } from './dwell-fill';
import type { DwellView } from './key-grid';

type TrialPauseDialogProps = {
  selections: number;
  /** Finish needs at least one selection. */
  canFinish: boolean;
  onChoose: (id: PauseChoiceId) => void;
  note: string;
  onNoteChange: (note: string) => void;
  /** The choice the scanner highlights (index in pauseChoices), or null. */
  scanned: number | null;
  dwell: DwellView;
  highContrast: boolean;
  reduceMotion: boolean;
};

/**
 * The paused trial: Resume (focused on opening), Finish, Discard and the trial's note. The three
 * choices are large targets that can be clicked, dwelt on, or chosen by the scanner.
 */
export const TrialPauseDialog = ({
  selections,
  canFinish,
  onChoose,
  note,
  onNoteChange,
  scanned,
  dwell,
  highContrast,
  reduceMotion,
}: TrialPauseDialogProps) => {
  const headingId = useId();
  const noteId = useId();
  const resumeRef = useRef<HTMLButtonElement>(null);
  useEffect(() => resumeRef.current?.focus(), []);
  return (
    <div className="absolute inset-0 flex items-center justify-center overflow-y-auto bg-black/60 p-3">
      <div
        role="dialog"
        aria-modal="true"
        aria-labelledby={headingId}
        data-pause-dialog
        className={cn(
          'flex w-full max-w-3xl flex-col gap-4 rounded-xl border-4 p-4 sm:p-6',
          highContrast ? 'on-dark border-white bg-black text-white' : 'border-ink bg-surface text-ink',
        )}
      >
        <h2 id={headingId} className="text-2xl font-bold">
          Trial paused
        </h2>
        <p>
          {selections} {selections === 1 ? 'selection' : 'selections'} so far. Paused time is left out of
          words per minute.
        </p>
        <div className="grid gap-3 sm:grid-cols-3">
          {pauseChoices.map((choice, index) => {
            const disabled = choice.id === 'pause-finish' && !canFinish;
            const isScanned = scanned === index;
            return (
              <button
                key={choice.id}
                ref={index === 0 ? resumeRef : undefined}
                type="button"
                data-pause-choice={choice.id}
                data-scanned={isScanned ? 'on' : undefined}
                disabled={disabled}
                className={cn(
                  targetClasses({ highContrast, largeTargets: true, scanned: isScanned }),
                  'text-xl',
                  disabled && 'opacity-50',
                )}
                style={tintStyle(null, false, highContrast, isScanned)}
                onClick={() => onChoose(choice.id)}
                {...(disabled ? {} : dwell?.targetProps(choice.id))}
              >
                {choice.label}
                {dwell && dwell.activeId === choice.id && (
                  <DwellFill progress={dwell.progress} reduceMotion={reduceMotion} />
                )}
              </button>
            );
          })}
        </div>
        {!canFinish && <p>Finish needs at least one key chosen in the trial.</p>}
        <div className="flex flex-col gap-1">
          <label htmlFor={noteId} className="font-bold">
            Note about this trial (optional)
          </label>
          <input
            id={noteId}
            className={fieldClasses(false)}
            value={note}
            maxLength={2000}
            onChange={(event) => onNoteChange(event.target.value)}
          />
        </div>
      </div>
    </div>
  );
};
