import {
  PROFILE_FILE_INTACT_TEXT,
  type ProfileFileCheck,
  profileFileAuthenticityLabels,
} from '@keyloom/shared';
import { type FormEvent, useId, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useVerifyProfileExport } from '../api/verify-profile-export';

const words = (key: string) =>
  key
    .replace(/^header\./, '')
    .replace(/\./g, ' ')
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .toLowerCase()
    .replace(/^./, (c) => c.toUpperCase());

// Nested objects of the answer (e.g. the file's header) become "version number: 3" lines, two
// levels deep; larger parts (settings, metrics, samples) stay one line each.
const flatten = (value: Record<string, unknown>, prefix = '', depth = 0): [string, unknown][] =>
  Object.entries(value).flatMap(([key, inner]): [string, unknown][] => {
    const name = prefix ? `${prefix}.${key}` : key;
    if (
      inner &&
      typeof inner === 'object' &&
      !Array.isArray(inner) &&
      depth < 2 &&
      !['settings', 'metrics'].includes(key)
    ) {
      return flatten(inner as Record<string, unknown>, name, depth + 1);
    }
    return [[name, inner]];
  });

const show = (value: unknown): string => {
  if (value === null || value === undefined) return '—';
  if (typeof value === 'boolean') return value ? 'Yes' : 'No';
  if (typeof value === 'object') {
    const text = JSON.stringify(value);
    return text.length > 240 ? `${text.slice(0, 240)}…` : text;
  }
  return String(value);
};

// The two findings, shown first and in words; the rest of the answer is listed below them.
const FINDINGS = ['valid', 'intact', 'authenticity'];

/** The two lines of a check: damage, and who made the file. */
const Findings = ({ damage, origin }: { damage: string; origin: string }) => (
  <dl className="mt-2 flex flex-col gap-1">
    <div>
      <dt className="inline font-bold">Damage: </dt>
      <dd className="inline">{damage}</dd>
    </div>
    <div>
      <dt className="inline font-bold">Made by: </dt>
      <dd className="inline">{origin}</dd>
    </div>
  </dl>
);

/** Checks an exported profile file: shows what it holds, or what is wrong with it. */
export const VerifyExportPanel = () => {
  const inputId = useId();
  const verify = useVerifyProfileExport();
  const [file, setFile] = useState<File | null>(null);
  const [missing, setMissing] = useState(false);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!file) {
      setMissing(true);
      return;
    }
    verify.mutate(file);
  };

  const check: ProfileFileCheck | undefined = verify.data;
  return (
    <section aria-labelledby="verify-heading" className="flex flex-col gap-4">
      <h3 id="verify-heading" className="text-2xl font-bold">
        Check an exported file
      </h3>
      <form
        noValidate
        onSubmit={submit}
        className="flex flex-wrap items-end gap-3"
        aria-label="Check an exported file"
      >
        <div className="flex w-full max-w-md min-w-0 flex-col gap-1">
          <label htmlFor={inputId} className="font-bold">
            Exported profile file
          </label>
          <input
            id={inputId}
            type="file"
            aria-invalid={missing || undefined}
            className="min-h-11 w-full min-w-0 rounded-lg border-2 border-field-border bg-surface px-3 py-2"
            onChange={(event) => {
              setFile(event.target.files?.[0] ?? null);
              setMissing(false);
              verify.reset();
            }}
          />
        </div>
        <Button type="submit" disabled={verify.isPending}>
          {verify.isPending ? 'Checking…' : 'Check file'}
        </Button>
      </form>
      <div role="status" aria-live="polite">
        {missing && <Alert tone="error">Choose a file to check.</Alert>}
        {verify.isError && (
          <Alert tone="error" title="The file is damaged or is not a Keyloom profile.">
            <Findings damage={verify.error.message} origin="Cannot be checked on a damaged file." />
          </Alert>
        )}
        {check && (
          <Alert
            tone={check.valid ? 'success' : 'error'}
            title={
              check.valid
                ? 'Made by this clinic and not damaged.'
                : 'Not signed by this clinic: do not rely on this file.'
            }
          >
            <Findings
              damage={PROFILE_FILE_INTACT_TEXT}
              origin={profileFileAuthenticityLabels[check.authenticity]}
            />
            <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
              {flatten(check)
                .filter(([key]) => !FINDINGS.includes(key))
                .map(([key, value]) => (
                  <div key={key} className="contents">
                    <dt className="font-bold">{words(key)}</dt>
                    <dd className="break-all">{show(value)}</dd>
                  </div>
                ))}
            </dl>
          </Alert>
        )}
      </div>
    </section>
  );
};
