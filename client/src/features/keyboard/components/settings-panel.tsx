import {
  keyboardLayoutLabels,
  keyboardLayouts,
  type KeyboardLayout,
  keySpacingLabels,
  keySpacings,
  type KeySpacing,
  type SuggestionsScanned,
  trialScanPatternLabels,
  trialScanPatterns,
  type TrialScanPattern,
  trialSelectionModeLabels,
  trialSelectionModes,
  type TrialSelectionMode,
} from '@keyloom/shared';
import { memo, type ReactNode, useId, useState } from 'react';
import { fieldClasses } from '@/components/ui/field-classes';
import {
  clampMs,
  DEFAULT_SCAN_ACCEPT_MS,
  type KeyboardViewSettings,
  textScales,
} from '../logic/keyboard-settings';

/** The physical switch keys of each scanning pattern, said beside the pattern. */
const scanPatternKeys: Record<TrialScanPattern, string> = {
  'auto-row-column': 'Space is the switch (Enter works too).',
  'auto-group-row-key': 'Space is the switch (Enter works too).',
  'step-one-switch': 'Space is the switch (Enter works too): each press moves one step; a pause chooses.',
  'step-two-switch': 'Space moves one step; Enter chooses.',
};

/** Beside the key order: a caution for people who type by position. */
const MODEL_ORDER_CAUTION = `“${keyboardLayoutLabels['model-ordered']}” moves the letters after every letter typed, so it does not suit typing by position.`;

type SettingsPanelProps = {
  settings: KeyboardViewSettings;
  onChange: (next: KeyboardViewSettings) => void;
  /** True while the system asks for reduced motion: the switch stays on. */
  osReducedMotion: boolean;
  /** Method and timings are fixed while a trial runs (the log records one setting per trial). */
  trialRunning: boolean;
};

const Field = ({
  label,
  hint,
  children,
}: {
  label: string;
  hint?: string;
  children: (id: string, hintId?: string) => ReactNode;
}) => {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-bold">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-ink-soft">
          {hint}
        </p>
      )}
      {children(id, hintId)}
    </div>
  );
};

const Toggle = ({
  label,
  checked,
  disabled,
  hint,
  onChange,
}: {
  label: string;
  checked: boolean;
  disabled?: boolean;
  hint?: string;
  onChange: (checked: boolean) => void;
}) => {
  const id = useId();
  return (
    <div className="flex items-start gap-3">
      <input
        id={id}
        type="checkbox"
        className="mt-1 size-6 shrink-0 accent-ink"
        checked={checked}
        disabled={disabled}
        aria-describedby={hint ? `${id}-hint` : undefined}
        onChange={(event) => onChange(event.target.checked)}
      />
      <div>
        <label htmlFor={id} className="font-bold">
          {label}
        </label>
        {hint && (
          <p id={`${id}-hint`} className="text-ink-soft">
            {hint}
          </p>
        )}
      </div>
    </div>
  );
};

/** A milliseconds field: a value in range applies at once; anything else is put back in range on leaving. */
const MsField = ({
  label,
  hint,
  min,
  max,
  value,
  disabled,
  onCommit,
}: {
  label: string;
  hint: string;
  min: number;
  max: number;
  value: number;
  disabled: boolean;
  onCommit: (value: number) => void;
}) => {
  const [draft, setDraft] = useState(String(value));
  return (
    <Field label={label} hint={hint}>
      {(id, hintId) => (
        <input
          id={id}
          type="number"
          inputMode="numeric"
          min={min}
          max={max}
          step={50}
          aria-describedby={hintId}
          className={fieldClasses(false)}
          value={draft}
          disabled={disabled}
          onChange={(event) => {
            setDraft(event.target.value);
            const next = Number(event.target.value);
            if (Number.isInteger(next) && next >= min && next <= max) onCommit(next);
          }}
          onBlur={() => {
            const next = clampMs(draft, min, max, value);
            setDraft(String(next));
            onCommit(next);
          }}
        />
      )}
    </Field>
  );
};

/** The keyboard's settings: changing them keeps the text typed so far. */
export const SettingsPanel = memo(function SettingsPanel({
  settings,
  onChange,
  osReducedMotion,
  trialRunning,
}: SettingsPanelProps) {
  const set = (patch: Partial<KeyboardViewSettings>) => onChange({ ...settings, ...patch });
  return (
    <section
      aria-labelledby="keyboard-settings-heading"
      className="flex flex-col gap-4 rounded-xl border-2 border-thread bg-surface p-4 sm:p-6"
    >
      <h2 id="keyboard-settings-heading" className="text-2xl font-bold">
        Settings
      </h2>
      <p className="text-ink-soft">
        The client record’s access method and timing are the starting values. Changing a setting keeps the
        text.
        {trialRunning && ' The selection mode and its timing stay fixed until the trial ends.'}
      </p>
      <div className="grid gap-5 md:grid-cols-2">
        <Field label="Key order" hint={MODEL_ORDER_CAUTION}>
          {(id, hintId) => (
            <select
              id={id}
              className={fieldClasses(false)}
              aria-describedby={hintId}
              value={settings.layout}
              onChange={(event) => set({ layout: event.target.value as KeyboardLayout })}
            >
              {keyboardLayouts.map((layout) => (
                <option key={layout} value={layout}>
                  {keyboardLayoutLabels[layout]}
                </option>
              ))}
            </select>
          )}
        </Field>
        <Field label="Selection mode">
          {(id) => (
            <select
              id={id}
              className={fieldClasses(false)}
              value={settings.selectionMode}
              disabled={trialRunning}
              onChange={(event) => set({ selectionMode: event.target.value as TrialSelectionMode })}
            >
              {trialSelectionModes.map((mode) => (
                <option key={mode} value={mode}>
                  {trialSelectionModeLabels[mode]}
                </option>
              ))}
            </select>
          )}
        </Field>
        {settings.selectionMode === 'dwell' && (
          <MsField
            label="Dwell time (ms)"
            hint="How long the pointer must rest on a key before it is chosen (100–5000)."
            min={100}
            max={5000}
            value={settings.dwellMs ?? 800}
            disabled={trialRunning}
            onCommit={(dwellMs) => set({ dwellMs })}
          />
        )}
        {settings.selectionMode === 'dwell' && (
          <MsField
            label="Pause after a selection (ms)"
            hint="After each selection no dwell starts for this long, so a resting gaze does not choose the next key at once (0–2000)."
            min={0}
            max={2000}
            value={settings.dwellRefractoryMs}
            disabled={trialRunning}
            onCommit={(dwellRefractoryMs) => set({ dwellRefractoryMs })}
          />
        )}
        {settings.selectionMode === 'scanning' && (
          <MsField
            label="Scan interval (ms)"
            hint="How long each row or key stays highlighted (100–10000)."
            min={100}
            max={10_000}
            value={settings.scanIntervalMs ?? 1000}
            disabled={trialRunning}
            onCommit={(scanIntervalMs) => set({ scanIntervalMs })}
          />
        )}
        {settings.selectionMode === 'scanning' && (
          <Field label="Scanning pattern" hint={scanPatternKeys[settings.scanPattern ?? 'auto-row-column']}>
            {(id, hintId) => (
              <select
                id={id}
                aria-describedby={hintId}
                className={fieldClasses(false)}
                value={settings.scanPattern ?? 'auto-row-column'}
                disabled={trialRunning}
                onChange={(event) => set({ scanPattern: event.target.value as TrialScanPattern })}
              >
                {trialScanPatterns.map((pattern) => (
                  <option key={pattern} value={pattern}>
                    {trialScanPatternLabels[pattern]}
                  </option>
                ))}
              </select>
            )}
          </Field>
        )}
        {settings.selectionMode === 'scanning' && (
          <Field label="Suggestions scanned">
            {(id) => (
              <select
                id={id}
                className={fieldClasses(false)}
                value={settings.suggestionsScanned ?? 'first'}
                disabled={trialRunning}
                onChange={(event) => set({ suggestionsScanned: event.target.value as SuggestionsScanned })}
              >
                <option value="first">First, before the keys</option>
                <option value="last">Last, after the keys</option>
              </select>
            )}
          </Field>
        )}
        {settings.selectionMode === 'scanning' && settings.scanPattern === 'step-one-switch' && (
          <MsField
            label="Acceptance time (ms)"
            hint="How long without a press before the highlighted row or key is chosen (500–10000)."
            min={500}
            max={10_000}
            value={settings.scanAcceptMs ?? DEFAULT_SCAN_ACCEPT_MS}
            disabled={trialRunning}
            onCommit={(scanAcceptMs) => set({ scanAcceptMs })}
          />
        )}
        <Field label="Text size">
          {(id) => (
            <select
              id={id}
              className={fieldClasses(false)}
              value={String(settings.textScale)}
              onChange={(event) => set({ textScale: Number(event.target.value) })}
            >
              {textScales.map((scale) => (
                <option key={scale} value={String(scale)}>
                  {Math.round(scale * 100)} %
                </option>
              ))}
            </select>
          )}
        </Field>
        <Field label="Key spacing" hint="The gap between keys, between rows and between suggestions.">
          {(id, hintId) => (
            <select
              id={id}
              aria-describedby={hintId}
              className={fieldClasses(false)}
              value={settings.keySpacing}
              onChange={(event) => set({ keySpacing: event.target.value as KeySpacing })}
            >
              {keySpacings.map((spacing) => (
                <option key={spacing} value={spacing}>
                  {keySpacingLabels[spacing]}
                </option>
              ))}
            </select>
          )}
        </Field>
      </div>
      <div className="grid gap-4 md:grid-cols-2">
        <Toggle
          label="Large targets"
          hint="Keys and suggestions at least 64 by 64 pixels; on a narrow screen rows wrap onto more lines."
          checked={settings.largeTargets}
          onChange={(largeTargets) => set({ largeTargets })}
        />
        <Toggle
          label="High contrast"
          hint="Black, white and yellow only."
          checked={settings.highContrast}
          onChange={(highContrast) => set({ highContrast })}
        />
        <Toggle
          label="Tint likely next keys"
          hint="Stronger tint for likelier letters; the three likeliest also get a thick border."
          checked={settings.tintKeys}
          onChange={(tintKeys) => set({ tintKeys })}
        />
        <Toggle
          label="Capital after a full stop"
          hint="The next letter is a capital at the message's start, after a line break and after . ? or ! and a space."
          checked={settings.autoCapital}
          onChange={(autoCapital) => set({ autoCapital })}
        />
        <Toggle
          label="Number keys pick suggestions"
          hint="In direct mode, the keys 1 to 9 of a physical keyboard pick suggestions 1 to 9 instead of typing digits."
          checked={settings.numberKeysPick}
          onChange={(numberKeysPick) => set({ numberKeysPick })}
        />
        {settings.selectionMode === 'dwell' && (
          <Toggle
            label="Sound on selection"
            hint="A short tone each time a dwell chooses a key or suggestion."
            checked={settings.dwellSound}
            disabled={trialRunning}
            onChange={(dwellSound) => set({ dwellSound })}
          />
        )}
        {settings.selectionMode === 'scanning' && (
          <Toggle
            label="Announce the scan highlight"
            hint="A screen reader says each row, key or suggestion as the scan highlights it: for switch users who listen. Off, nothing extra is read."
            checked={settings.scanAnnounce}
            onChange={(scanAnnounce) => set({ scanAnnounce })}
          />
        )}
        <Toggle
          label="Reduce motion"
          hint={
            osReducedMotion
              ? 'On because this device asks for reduced motion.'
              : 'The dwell fill and scan highlight move in steps, without animation.'
          }
          checked={settings.reduceMotion || osReducedMotion}
          disabled={osReducedMotion}
          onChange={(reduceMotion) => set({ reduceMotion })}
        />
      </div>
    </section>
  );
});
