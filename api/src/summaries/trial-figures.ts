// The measured figures of a version's trials on the test keyboard, and the rules that leave
// implausible ones out. One place for the family summaries and the printed reports, so both count the
// same trials and say the same about the ones they leave out.
import type { EntityManager } from 'typeorm';
import type { TrialFigures, VersionFigures } from './summary-text';

/**
 * Trials shorter than this many characters are left out of the trial figures: a rate over fewer
 * characters than most of one practice phrase says little (test phrases average about 29
 * characters: MacKenzie & Soukoreff 2003, docs/references.md); the threshold itself is common
 * practice, no source.
 */
export const MIN_TRIAL_CHARS = 20;
/**
 * A version's measured trial speed more than this many times its estimate is left out as implausible
 * (a slip in the trial log, e.g. text pasted or a timer that stopped); common practice, no source.
 */
export const PLAUSIBLE_RATE_FACTOR = 2;

/** A version's trials with what did not count: short trials (left out of the means in SQL). */
export type CountedTrials = TrialFigures & { short?: number };

/**
 * The trial figures that may be shown, with a note for what is left out: trials shorter than
 * MIN_TRIAL_CHARS, and a measured speed more than PLAUSIBLE_RATE_FACTOR times the version's estimate.
 */
export function plausibleTrials(
  version: Pick<VersionFigures, 'number' | 'wpmWith'>,
  trials: CountedTrials | null,
  notes: string[],
): TrialFigures | null {
  if (!trials) return null;
  const { short = 0, ...kept } = trials;
  if (short > 0) {
    notes.push(
      `Version ${version.number}: ${short} ${short === 1 ? 'trial' : 'trials'} shorter than ${MIN_TRIAL_CHARS} ` +
        `characters ${short === 1 ? 'was' : 'were'} left out of the trial figures (too short to measure).`,
    );
  }
  if (kept.count < 1) return null;
  if (kept.wpm !== null && version.wpmWith !== null && kept.wpm > PLAUSIBLE_RATE_FACTOR * version.wpmWith) {
    notes.push(
      `Version ${version.number}: the measured trial speed (${kept.wpm.toFixed(1)} words a minute) is more than ` +
        `${PLAUSIBLE_RATE_FACTOR} times the estimate (${version.wpmWith.toFixed(1)}), so it was left out as ` +
        'implausible. Check the trial log on the version’s page.',
    );
    return { ...kept, wpm: null };
  }
  return kept;
}

/**
 * Per version, its trials (finished in the period, when one is given): their number and the means of
 * the measured keystroke savings and words a minute (`trials.measures`, jsonb; a null measure is left
 * out of its mean). Trials under MIN_TRIAL_CHARS characters are counted apart and left out of the
 * means. Read with SQL: the trials table belongs to the test keyboard's module.
 */
export async function countTrials(
  manager: EntityManager,
  versionIds: string[],
  period: { from: string; to: string } | null,
): Promise<Map<string, CountedTrials>> {
  const figures = new Map<string, CountedTrials>();
  if (versionIds.length === 0) return figures;
  const rows = await manager.query<
    {
      version_id: string;
      count: number;
      short: number;
      keystroke_savings: number | null;
      wpm: number | null;
    }[]
  >(
    `SELECT profile_version_id AS version_id,
            count(*) FILTER (WHERE (measures->>'characters')::int >= $4)::int AS count,
            count(*) FILTER (WHERE (measures->>'characters')::int < $4)::int AS short,
            avg((measures->>'keystrokeSavings')::float8) FILTER (WHERE (measures->>'characters')::int >= $4) AS keystroke_savings,
            avg((measures->>'wpm')::float8) FILTER (WHERE (measures->>'characters')::int >= $4) AS wpm
       FROM trials
      WHERE profile_version_id = ANY($1::uuid[])
        AND ($2::date IS NULL OR finished_at::date BETWEEN $2::date AND $3::date)
      GROUP BY profile_version_id`,
    [versionIds, period?.from ?? null, period?.to ?? null, MIN_TRIAL_CHARS],
  );
  for (const row of rows) {
    figures.set(row.version_id, {
      count: row.count,
      keystrokeSavings: row.keystroke_savings,
      wpm: row.wpm,
      short: row.short,
    });
  }
  return figures;
}
