import {
  flagDecisionSchema,
  personalDataKindLabels,
  redactionToken,
  type SampleDetail,
  type SampleFlag,
} from '@keyloom/shared';
import { type ReactNode, useState } from 'react';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Modal } from '@/components/ui/dialog';
import { ReasonForm } from '@/components/ui/reason-form';
import { useDecideFlag } from '../api/decide-flag';
import { useUndoRedaction } from '../api/undo-redaction';
import { focusSoon } from '../lib/focus-targets';
import { type PreviewPiece, redactionPreview } from '../lib/redaction-preview';

const flagStatusWords: Record<SampleFlag['status'], { label: string; tone: BadgeTone }> = {
  open: { label: 'To review', tone: 'warn' },
  redacted: { label: 'Redacted', tone: 'good' },
  kept: { label: 'Kept', tone: 'neutral' },
};

const flagAnchor = (flag: SampleFlag) => `flag-${flag.id}`;

/** Flags whose span is still visible in the text (open or kept, matching the text at their offsets). */
const visibleFlags = (sample: SampleDetail): SampleFlag[] =>
  sample.flags
    .filter(
      (flag) =>
        flag.status !== 'redacted' &&
        flag.text !== null &&
        sample.text.slice(flag.start, flag.end) === flag.text,
    )
    .sort((a, b) => a.start - b.start);

/** The sample's text with each visible flag as a highlighted button that leads to its decision. */
const FlaggedText = ({ sample }: { sample: SampleDetail }) => {
  const pieces: ReactNode[] = [];
  let at = 0;
  for (const flag of visibleFlags(sample)) {
    if (flag.start < at) continue; // overlapping spans: the first one wins
    pieces.push(sample.text.slice(at, flag.start));
    pieces.push(
      <mark key={flag.id} className={flag.status === 'open' ? 'bg-saffron-light' : 'bg-paper-deep'}>
        <button
          type="button"
          className="rounded border-b-4 border-rust px-0.5 font-bold text-ink"
          onClick={() => document.getElementById(flagAnchor(flag))?.focus()}
        >
          <span className="sr-only">
            {personalDataKindLabels[flag.kind]}, {flagStatusWords[flag.status].label.toLowerCase()}:{' '}
          </span>
          {flag.text}
        </button>
      </mark>,
    );
    at = flag.end;
  }
  pieces.push(sample.text.slice(at));
  return (
    // Focusable so the keyboard can scroll it even when it holds no flag buttons.
    <div
      role="region"
      aria-label="Sample text"
      tabIndex={0}
      className="max-h-[36rem] overflow-y-auto rounded-xl border-2 border-thread bg-surface p-4 leading-relaxed break-words whitespace-pre-wrap"
    >
      {pieces}
    </div>
  );
};

/** One side of the preview: the span marked inside its surrounding text. */
const PreviewText = ({ label, piece }: { label: string; piece: PreviewPiece }) => (
  <div className="flex flex-col gap-1">
    <p className="font-bold">{label}</p>
    <p className="rounded-lg border-2 border-thread bg-paper p-3 break-words whitespace-pre-wrap">
      {piece.lead}
      <mark className="bg-saffron-light font-bold">{piece.span}</mark>
      {piece.tail}
    </p>
  </div>
);

type FlagReviewProps = {
  sample: SampleDetail;
  /** Owning clinician; supervisors read only. */
  canEdit: boolean;
  announce: (tone: 'success' | 'error', text: string) => void;
};

/** The text with its personal-data flags, and per flag: redact, or keep with a reason. */
export const FlagReview = ({ sample, canEdit, announce }: FlagReviewProps) => {
  const decide = useDecideFlag();
  const undo = useUndoRedaction();
  const [keeping, setKeeping] = useState<SampleFlag | null>(null);
  const [previewing, setPreviewing] = useState<SampleFlag | null>(null);
  const preview = previewing ? redactionPreview(sample, previewing.id) : null;
  const flags = [...sample.flags].sort((a, b) => a.start - b.start);
  const open = flags.filter((flag) => flag.status === 'open').length;

  const redact = async (flag: SampleFlag) => {
    try {
      await decide.mutateAsync({
        sampleId: sample.id,
        flagId: flag.id,
        decision: { action: 'redact', reason: null },
      });
      setPreviewing(null);
      announce(
        'success',
        `Redacted the ${personalDataKindLabels[flag.kind].toLowerCase()}; the text now reads ${redactionToken(flag.kind)} there.`,
      );
      focusSoon(flagAnchor(flag));
    } catch (caught) {
      setPreviewing(null);
      announce('error', caught instanceof Error ? caught.message : 'The flag was not redacted. Try again.');
    }
  };

  const undoRedaction = async (flag: SampleFlag) => {
    const kind = personalDataKindLabels[flag.kind].toLowerCase();
    try {
      await undo.mutateAsync({ sampleId: sample.id, flagId: flag.id });
      announce('success', `Undid the redaction: the ${kind} is back in the text and waits for a decision.`);
    } catch (caught) {
      announce(
        'error',
        caught instanceof Error ? caught.message : 'The redaction was not undone. Try again.',
      );
    }
    focusSoon(flagAnchor(flag));
  };

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <section aria-labelledby="text-heading" className="flex min-w-0 flex-col gap-3">
        <h3 id="text-heading" className="text-2xl font-bold">
          Text
        </h3>
        <p className="text-ink-soft">Highlighted spans are flagged; choose one to go to its decision.</p>
        <FlaggedText sample={sample} />
      </section>
      <section aria-labelledby="flags-heading" className="flex min-w-0 flex-col gap-3">
        <h3 id="flags-heading" className="text-2xl font-bold">
          Personal data found ({flags.length})
        </h3>
        <p className="text-ink-soft">
          {flags.length === 0
            ? 'Nothing was flagged in this sample.'
            : open === 0
              ? 'Every flag has been decided.'
              : `${open} flag${open === 1 ? '' : 's'} still to review.`}
        </p>
        <ul className="flex flex-col gap-3">
          {flags.map((flag) => {
            const words = flagStatusWords[flag.status];
            const kind = personalDataKindLabels[flag.kind];
            return (
              <li key={flag.id}>
                <article
                  id={flagAnchor(flag)}
                  tabIndex={-1}
                  aria-label={`${kind}: ${flag.text ?? redactionToken(flag.kind)}`}
                  className="flex flex-col gap-2 rounded-xl border-2 border-thread bg-surface p-4"
                >
                  <div className="flex flex-wrap items-center gap-3">
                    <h4 className="font-bold">{kind}</h4>
                    <Badge tone={words.tone}>{words.label}</Badge>
                  </div>
                  <p className="break-all">
                    {flag.status === 'redacted' ? (
                      <>
                        Replaced by <code>{redactionToken(flag.kind)}</code>
                      </>
                    ) : (
                      <q>{flag.text}</q>
                    )}
                  </p>
                  {flag.reason && <p>Reason: {flag.reason}</p>}
                  {canEdit && flag.status !== 'redacted' && sample.status !== 'excluded' && (
                    <div className="flex flex-wrap gap-2">
                      <Button
                        variant="primary"
                        disabled={decide.isPending}
                        onClick={() => setPreviewing(flag)}
                        aria-label={`Redact ${kind.toLowerCase()} ${flag.text ?? ''}…`.trim()}
                      >
                        Redact…
                      </Button>
                      {flag.status === 'open' && (
                        <Button
                          onClick={() => setKeeping(flag)}
                          aria-label={`Keep ${kind.toLowerCase()} ${flag.text ?? ''}`.trim()}
                        >
                          Keep…
                        </Button>
                      )}
                    </div>
                  )}
                  {canEdit && flag.status === 'redacted' && sample.status !== 'excluded' && (
                    <div className="flex flex-wrap gap-2">
                      <Button
                        disabled={undo.isPending}
                        onClick={() => void undoRedaction(flag)}
                        aria-label={`Undo redaction of ${kind.toLowerCase()}`}
                      >
                        Undo redaction
                      </Button>
                    </div>
                  )}
                </article>
              </li>
            );
          })}
        </ul>
      </section>

      <Modal
        open={previewing !== null}
        onClose={() => setPreviewing(null)}
        title="Redact this?"
        description={
          previewing
            ? `The ${personalDataKindLabels[previewing.kind].toLowerCase()} becomes ${redactionToken(previewing.kind)} in the text. You can undo it until a version is trained on this sample.`
            : undefined
        }
      >
        {previewing && preview && (
          <div className="flex flex-col gap-4">
            <PreviewText label="Now" piece={preview.before} />
            <PreviewText label="After redaction" piece={preview.after} />
            <div className="flex flex-wrap gap-2">
              <Button variant="primary" disabled={decide.isPending} onClick={() => void redact(previewing)}>
                {decide.isPending ? 'Redacting…' : 'Redact'}
              </Button>
              <Button onClick={() => setPreviewing(null)}>Cancel</Button>
            </div>
          </div>
        )}
      </Modal>

      <Modal
        open={keeping !== null}
        onClose={() => setKeeping(null)}
        title="Keep this in the text?"
        description={
          keeping ? (
            <>
              The {personalDataKindLabels[keeping.kind].toLowerCase()} <q>{keeping.text}</q> stays in the
              sample and can reach a model. Say why, for the record.
            </>
          ) : undefined
        }
      >
        {keeping && (
          <ReasonForm
            key={keeping.id}
            schema={flagDecisionSchema}
            defaultValues={{ action: 'keep', reason: '' }}
            label="Reason for keeping it"
            hint="For example: it is the name of the sailing club, not a person’s details."
            submitLabel="Keep it"
            busyLabel="Saving…"
            onSubmit={async (decision) => {
              await decide.mutateAsync({ sampleId: sample.id, flagId: keeping.id, decision });
              announce(
                'success',
                `Kept the ${personalDataKindLabels[keeping.kind].toLowerCase()} with your reason.`,
              );
              setKeeping(null);
            }}
            onCancel={() => setKeeping(null)}
            aria-label="Keep flagged text"
          />
        )}
      </Modal>
    </div>
  );
};
