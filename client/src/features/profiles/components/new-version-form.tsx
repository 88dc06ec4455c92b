import {
  accessTimingFields,
  accessTimingLabels,
  type AccessMethod,
  accessMethodLabels,
  createProfileVersionSchema,
  defaultAccessTiming,
  defaultProfileSettings,
  escapeMethods,
  MIN_PROFILE_CHARS,
  type ProfileVersion,
} from '@keyloom/shared';
import { useId, useState } from 'react';
import type { FieldError as FormFieldError } from 'react-hook-form';
import { EngineDetails } from '@/components/ui/engine-details';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { FieldError } from '@/components/ui/field-message';
import { Form, FormServerError } from '@/components/ui/form';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useCreateProfileVersion } from '../api/create-profile-version';
import { useTrainProfileVersion } from '../api/train-profile-version';
import { useUpdateProfileVersion } from '../api/update-profile-version';
import { NextVersionNote } from '@/features/vocabulary/components/next-version-note';
import { escapeExplanations } from '../lib/profile-words';
import { BaseOnlyBadge } from './base-only-badge';

/** A sample that can go into a version (the ready ones; the page passes them). */
export type TrainableSample = { id: string; title: string; characters: number };

/** The client's access method and timings: the defaults of the version's estimates. */
export type AccessDefaults = {
  method: AccessMethod;
  scanIntervalMs: number | null;
  dwellMs: number | null;
  keyTimeMs: number | null;
};

// Empty number boxes become undefined (the schema's default, or "not set"), never 0.
const optionalNumber = (value: unknown) => (value === '' || value === null ? undefined : value);
// An empty weight box must not slip through as 0: NaN fails the schema with its message.
const requiredNumber = (value: unknown) => (value === '' ? Number.NaN : value);

// Fields whose input type is loose (coerced numbers) get merged error types; keep the message only.
const messageOf = (error: { message?: string } | undefined): FormFieldError | undefined =>
  error?.message ? { type: 'validate', message: error.message } : undefined;

/** One sample's checkbox, its size under the title. */
const SampleCheckbox = ({
  sample,
  checked,
  onChange,
}: {
  sample: TrainableSample;
  checked: boolean;
  onChange: (checked: boolean) => void;
}) => {
  const id = useId();
  return (
    <div className="flex items-start gap-3">
      <input
        id={id}
        type="checkbox"
        // The field's name, so a refused submit's summary links to the first box.
        name="sampleIds"
        aria-describedby={`${id}-size`}
        className="mt-1 size-6 shrink-0 accent-ink"
        checked={checked}
        onChange={(event) => onChange(event.target.checked)}
      />
      <div>
        <label htmlFor={id} className="font-bold">
          {sample.title}
        </label>
        <p id={`${id}-size`} className="text-ink-soft">
          {sample.characters.toLocaleString('en-GB')} characters
        </p>
      </div>
    </div>
  );
};

/**
 * How much writing a profile needs and how much the ticked samples hold, updated as samples are
 * ticked (the API refuses a version under MIN_PROFILE_CHARS with the same two figures).
 */
const ChosenAmount = ({ samples, chosen }: { samples: readonly TrainableSample[]; chosen: string[] }) => {
  const total = samples.filter((s) => chosen.includes(s.id)).reduce((n, s) => n + s.characters, 0);
  const short = total < MIN_PROFILE_CHARS;
  return (
    <p id="samples-amount" aria-live="polite" className={short ? 'font-bold text-danger' : 'text-ink-soft'}>
      Needed: at least {MIN_PROFILE_CHARS.toLocaleString('en-GB')} characters of writing. Chosen:{' '}
      {total.toLocaleString('en-GB')} characters
      {short ? ` (${(MIN_PROFILE_CHARS - total).toLocaleString('en-GB')} more needed).` : '.'}
    </p>
  );
};

/** What a base-only version is, in the clinic's words (the form and the version's page). */
export const BaseOnlyNote = () => (
  <p className="max-w-3xl text-lg">
    <BaseOnlyBadge /> This version learns nothing from the client’s writing. Its suggestions come from the
    general English model and the words added to the client’s list; on the device it picks up the client’s
    words as they are typed. It has no measured results (there is no writing of the client’s to test it on):
    the trial on the test keyboard measures it.
  </p>
);

/** Where the suggestions come from: the client's writing, or general English only (base-only). */
const SourceChoice = ({
  baseOnly,
  readyChars,
  onChange,
}: {
  baseOnly: boolean;
  readyChars: number;
  onChange: (baseOnly: boolean) => void;
}) => {
  const id = useId();
  const enough = readyChars >= MIN_PROFILE_CHARS;
  const options = [
    {
      value: false,
      label: 'The client’s own writing',
      hint: enough
        ? `A personal model from the ready samples (${readyChars.toLocaleString('en-GB')} characters), blended with general English.`
        : `Needs at least ${MIN_PROFILE_CHARS.toLocaleString('en-GB')} characters of ready writing; there ${readyChars === 1 ? 'is' : 'are'} ${readyChars.toLocaleString('en-GB')}.`,
    },
    {
      value: true,
      label: 'General English only (base-only)',
      hint: 'For a client with too little writing so far: no personal text. Tried, signed off and approved like any version.',
    },
  ];
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="mb-1 text-xl font-bold">What the suggestions learn from</legend>
      {options.map((option) => (
        <div key={String(option.value)} className="flex items-start gap-3">
          <input
            id={`${id}-${String(option.value)}`}
            type="radio"
            name={`${id}-source`}
            className="mt-1 size-6 shrink-0 accent-ink"
            checked={baseOnly === option.value}
            disabled={!option.value && !enough}
            aria-describedby={`${id}-${String(option.value)}-hint`}
            onChange={() => onChange(option.value)}
          />
          <div>
            <label htmlFor={`${id}-${String(option.value)}`} className="font-bold">
              {option.label}
            </label>
            <p id={`${id}-${String(option.value)}-hint`} className="text-ink-soft">
              {option.hint}
            </p>
          </div>
        </div>
      ))}
    </fieldset>
  );
};

type NewVersionFormProps = {
  clientId: string;
  samples: readonly TrainableSample[];
  access: AccessDefaults;
  /** The newest version (its vocabulary page holds the client's list), or null. */
  latestVersionId?: string | null;
  onCancel: () => void;
  /** Called with the version once it is created and its training has been asked for. */
  onStarted?: (version: ProfileVersion, trainError: string | null) => void;
  /**
   * A draft to edit instead: the form starts from its settings, samples and note, and saving sends
   * them to the draft (PATCH) without training it.
   */
  draft?: ProfileVersion;
  /** Called with the draft once the changes are saved. */
  onSaved?: (version: ProfileVersion) => void;
};

/** The settings of a new profile version, validated by the shared schema; submitting creates and trains it. */
export const NewVersionForm = ({
  clientId,
  samples,
  access,
  latestVersionId = null,
  onCancel,
  onStarted,
  draft,
  onSaved,
}: NewVersionFormProps) => {
  const create = useCreateProfileVersion();
  const train = useTrainProfileVersion();
  const update = useUpdateProfileVersion();
  const [weightMode, setWeightMode] = useState<'auto' | 'fixed'>(
    draft && !draft.baseOnly && draft.settings.baseWeight !== 'auto' ? 'fixed' : 'auto',
  );
  const readyChars = samples.reduce((n, s) => n + s.characters, 0);
  // A new version starts base-only when the ready writing is too little for a personal one.
  const startBaseOnly = draft ? draft.baseOnly : readyChars < MIN_PROFILE_CHARS;
  // A draft's access keeps its own timings; the boxes it did not set show the client's or the default.
  const startAccess = draft?.settings.access ?? access;

  return (
    <Form
      schema={createProfileVersionSchema}
      aria-label={draft ? `Edit draft version ${draft.number}` : 'New profile version'}
      errorSummary
      // Base-only: the sample boxes and the weight are hidden, so they cannot block the submit.
      prepare={(values) =>
        values.baseOnly
          ? { ...values, sampleIds: undefined, settings: { ...values.settings, baseWeight: 1 } }
          : values
      }
      defaultValues={{
        baseOnly: startBaseOnly,
        sampleIds: draft
          ? draft.samples.map((sample) => sample.id).filter((id) => samples.some((s) => s.id === id))
          : samples.map((sample) => sample.id),
        note: draft?.note ?? '',
        settings: {
          ...(draft?.settings ?? defaultProfileSettings),
          access: {
            method: startAccess.method,
            scanIntervalMs:
              startAccess.scanIntervalMs ?? access.scanIntervalMs ?? defaultAccessTiming.scanIntervalMs,
            dwellMs: startAccess.dwellMs ?? access.dwellMs ?? defaultAccessTiming.dwellMs,
            keyTimeMs: startAccess.keyTimeMs ?? access.keyTimeMs ?? defaultAccessTiming.keyTimeMs,
          },
        },
      }}
      onSubmit={async (input) => {
        // Only the timing the chosen access method uses is sent (the other boxes were hidden).
        const chosen = input.settings.access;
        const access = chosen && {
          method: chosen.method,
          ...Object.fromEntries(accessTimingFields[chosen.method].map((field) => [field, chosen[field]])),
        };
        // No `vocabulary` in the settings: the API freezes the client's current list into the version
        // (the schema's default, an empty list, would otherwise replace it).
        // eslint-disable-next-line @typescript-eslint/no-unused-vars -- left out on purpose
        const { vocabulary, ...settings } = input.settings;
        if (draft) {
          // An edited draft keeps the word list frozen in it, and stays base-only or personal.
          // eslint-disable-next-line @typescript-eslint/no-unused-vars -- fixed at creation
          const { baseOnly, ...changes } = input;
          const saved = await update.mutateAsync({
            versionId: draft.id,
            input: {
              ...changes,
              settings: { ...settings, access, vocabulary: draft.settings.vocabulary },
              note: input.note ?? '',
            },
          });
          onSaved?.(saved);
          return;
        }
        const version = await create.mutateAsync({
          clientId,
          input: {
            ...input,
            baseOnly: input.baseOnly || undefined,
            settings: { ...settings, access },
            note: input.note || undefined,
          },
        });
        try {
          onStarted?.(await train.mutateAsync(version.id), null);
        } catch (error) {
          // The draft is saved; its page offers Train again and says what went wrong.
          onStarted?.(version, error instanceof Error ? error.message : 'Training could not start.');
        }
      }}
    >
      {({ register, formState, setValue, watch }) => {
        const errors = formState.errors;
        const method = watch('settings.access.method') as AccessMethod;
        const baseOnly = watch('baseOnly') === true;
        return (
          <div className="flex flex-col gap-8">
            <FormServerError message={errors.root?.server?.message} />

            {draft ? (
              draft.baseOnly && <BaseOnlyNote />
            ) : (
              <SourceChoice
                baseOnly={baseOnly}
                readyChars={readyChars}
                onChange={(next) => setValue('baseOnly', next)}
              />
            )}

            {!baseOnly && (
              <fieldset className="flex flex-col gap-3" aria-describedby="samples-hint samples-amount">
                <legend className="mb-1 text-xl font-bold">Writing samples to learn from</legend>
                <p id="samples-hint" className="text-ink-soft">
                  Every ready sample is included; untick any to leave out of this version. The chosen set is
                  frozen with the version.
                </p>
                {errors.sampleIds?.message && (
                  <FieldError id="samples-error">{errors.sampleIds.message}</FieldError>
                )}
                <ChosenAmount samples={samples} chosen={(watch('sampleIds') ?? []) as string[]} />
                {samples.map((sample) => {
                  // Kept as an array by hand: a lone registered checkbox would give a string, not a list.
                  const chosen = (watch('sampleIds') ?? []) as string[];
                  return (
                    <SampleCheckbox
                      key={sample.id}
                      sample={sample}
                      checked={chosen.includes(sample.id)}
                      onChange={(checked) =>
                        setValue(
                          'sampleIds',
                          checked ? [...chosen, sample.id] : chosen.filter((id) => id !== sample.id),
                          { shouldValidate: formState.isSubmitted },
                        )
                      }
                    />
                  );
                })}
              </fieldset>
            )}

            <fieldset className="grid gap-5 md:grid-cols-2">
              <legend className="mb-3 text-xl font-bold">Suggestions and access</legend>
              <TextField
                label="Suggestion slots"
                type="number"
                inputMode="numeric"
                hint="How many words the list offers at once, 1 to 10. Results are measured for 1 to 10 either way."
                registration={register('settings.slots', { setValueAs: optionalNumber })}
                error={messageOf(errors.settings?.slots)}
              />
              <SelectField
                label="Access method for the speed estimate"
                options={Object.entries(accessMethodLabels).map(([value, label]) => ({ value, label }))}
                hint="From the client record; change it here only to compare."
                registration={register('settings.access.method')}
                error={errors.settings?.access?.method}
              />
              {accessTimingFields[method].map((field) => (
                <TextField
                  key={field}
                  label={accessTimingLabels[field]}
                  type="number"
                  inputMode="numeric"
                  registration={register(`settings.access.${field}`, { setValueAs: optionalNumber })}
                  error={messageOf(errors.settings?.access?.[field])}
                />
              ))}
            </fieldset>

            <fieldset className="grid gap-5 md:grid-cols-2">
              <legend className="mb-3 text-xl font-bold">What the suggestions lean on</legend>
              <CheckboxField
                label="Ignore capitals"
                hint="Learn and suggest in lower case only; the client types capitals themselves."
                registration={register('settings.caseFold')}
              />
              {!baseOnly && (
                <fieldset className="flex flex-col gap-2 md:col-span-2">
                  <legend className="font-bold">Weight of the general English model</legend>
                  <p className="text-ink-soft">
                    How much the suggestions lean on ordinary English rather than the client’s own writing.
                  </p>
                  <div className="flex flex-wrap gap-6">
                    {(['auto', 'fixed'] as const).map((mode) => (
                      <label key={mode} className="flex min-h-11 items-center gap-2">
                        <input
                          type="radio"
                          name="base-weight-mode"
                          className="size-5 accent-ink"
                          checked={weightMode === mode}
                          onChange={() => {
                            setWeightMode(mode);
                            setValue('settings.baseWeight', mode === 'auto' ? 'auto' : 0.5);
                          }}
                        />
                        {mode === 'auto' ? 'Automatic (tuned on held-out text)' : 'A fixed value'}
                      </label>
                    ))}
                  </div>
                  {weightMode === 'fixed' && (
                    <TextField
                      label="Weight, 0 to 1"
                      type="number"
                      step="0.05"
                      hint="0 uses the client’s writing alone; 1 uses general English alone."
                      registration={register('settings.baseWeight', { setValueAs: requiredNumber })}
                      error={messageOf(errors.settings?.baseWeight)}
                      className="max-w-xs"
                    />
                  )}
                </fieldset>
              )}
            </fieldset>

            {!baseOnly && (
              <EngineDetails
                description="How the model of the client’s writing is built. The defaults suit most writing."
                forceOpen={Boolean(errors.settings?.order || errors.settings?.escape)}
              >
                <div className="grid gap-5 md:grid-cols-2">
                  <TextField
                    label="Context order"
                    type="number"
                    inputMode="numeric"
                    hint="How many letters back the model looks, 1 to 12 (5 suits most writing)."
                    registration={register('settings.order', { setValueAs: optionalNumber })}
                    error={messageOf(errors.settings?.order)}
                  />
                  <SelectField
                    label="Escape method"
                    options={escapeMethods.map((letter) => ({ value: letter, label: `Method ${letter}` }))}
                    hint={
                      escapeExplanations[(watch('settings.escape') ?? 'C') as keyof typeof escapeExplanations]
                    }
                    registration={register('settings.escape')}
                    error={errors.settings?.escape}
                  />
                  <CheckboxField
                    label="Exclusion"
                    hint="When falling back to a shorter context, skip letters the longer one already offered."
                    registration={register('settings.exclusion')}
                  />
                </div>
              </EngineDetails>
            )}

            {!draft && <NextVersionNote clientId={clientId} latestVersionId={latestVersionId} />}

            <TextField
              label="Note (optional)"
              hint="What this version tries, e.g. “order 6 with the new diary”."
              registration={register('note')}
              error={errors.note}
            />

            <div className="flex flex-wrap gap-3">
              <Button type="submit" variant="primary" disabled={formState.isSubmitting}>
                {draft
                  ? formState.isSubmitting
                    ? 'Saving…'
                    : 'Save draft'
                  : formState.isSubmitting
                    ? 'Starting…'
                    : 'Train this version'}
              </Button>
              <Button onClick={onCancel}>Cancel</Button>
            </div>
          </div>
        );
      }}
    </Form>
  );
};
