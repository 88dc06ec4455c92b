import { type ProfileVersion, type Summary, summaryStatusLabels, type SummaryStatus } from '@keyloom/shared';
import { useId, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Modal } from '@/components/ui/dialog';
import {
  ColumnHeader,
  RowHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import { formatDateRange, formatDateTime } from '@/lib/format';
import { useIdempotencyKey } from '../api/idempotency-key';
import { useResendSummary } from '../api/resend-summary';
import {
  failureWords,
  recipientState,
  recipientStateLabels,
  recipientStateTones,
} from '../lib/summary-words';
import { summaryCardId } from '../lib/focus-targets';

const summaryTones: Record<SummaryStatus, BadgeTone> = {
  draft: 'warn',
  sending: 'neutral',
  sent: 'good',
  partly_failed: 'warn',
  failed: 'bad',
};

/** "versions 1 and 2", from the stored ids and the client's versions. */
const versionWords = (ids: string[], versions: ProfileVersion[]): string => {
  if (ids.length === 0) return 'No version (note only)';
  const numbers = ids.map((id) => versions.find((v) => v.id === id)?.number).filter((n) => n !== undefined);
  if (numbers.length === 0) return `${ids.length} ${ids.length === 1 ? 'version' : 'versions'}`;
  return `${numbers.length === 1 ? 'Version' : 'Versions'} ${numbers.sort((a, b) => a - b).join(', ')}`;
};

type ResendDialogProps = {
  summary: Summary | null;
  onClose: () => void;
  onResent: (summary: Summary) => void;
};

/** Confirms a re-send: a new e-mail to each original contact who may still receive summaries. */
const ResendDialog = ({ summary, onClose, onResent }: ResendDialogProps) => {
  const resend = useResendSummary();
  const resendKey = useIdempotencyKey();
  const [error, setError] = useState<string | null>(null);
  const close = () => {
    setError(null);
    // Closing ends this action: opening the dialog again is a new one, with a new key.
    resendKey.done();
    onClose();
  };
  return (
    <Modal
      open={summary !== null}
      onClose={close}
      title="Send this summary again?"
      description="The same text and charts go out again as new e-mails to the original recipients who still agree to receive summaries. Anyone who stopped summaries is left out."
    >
      <div role="alert">
        {error && (
          <Alert tone="error" className="mb-4">
            {error}
          </Alert>
        )}
      </div>
      <div className="flex flex-wrap gap-3">
        <Button
          variant="primary"
          disabled={resend.isPending}
          onClick={() => {
            if (!summary) return;
            setError(null);
            // Trying again after an error reuses the key, so the round goes out at most once.
            const idempotencyKey = resendKey.keyFor(summary.id);
            resend.mutate(
              { summaryId: summary.id, idempotencyKey },
              {
                onSuccess: (saved) => {
                  setError(null);
                  resendKey.done();
                  onResent(saved);
                },
                onError: (failure) => setError(failure.message),
              },
            );
          }}
        >
          {resend.isPending ? 'Sending…' : 'Send again'}
        </Button>
        <Button onClick={close}>Cancel</Button>
      </div>
    </Modal>
  );
};

type SummaryCardProps = {
  summary: Summary;
  versions: ProfileVersion[];
  canSend: boolean;
  onResend: (summary: Summary) => void;
  onOpenDraft: (summary: Summary) => void;
};

const SummaryCard = ({ summary, versions, canSend, onResend, onOpenDraft }: SummaryCardProps) => {
  const id = useId();
  const rounds = Math.max(1, ...summary.recipients.map((r) => r.round));
  const period = formatDateRange(summary.from, summary.to);
  if (summary.status === 'draft') {
    return (
      <article
        id={summaryCardId(summary.id)}
        tabIndex={-1}
        aria-labelledby={`${id}-title`}
        className="flex flex-col gap-3 rounded-xl border-2 border-dashed border-thread bg-surface p-5"
      >
        <div className="flex flex-wrap items-start justify-between gap-3">
          <div className="flex flex-col gap-1">
            <h3 id={`${id}-title`} className="text-xl font-bold">
              {period}
            </h3>
            <p className="text-ink-soft">
              {versionWords(summary.versionIds, versions)} · drafted {formatDateTime(summary.createdAt)}
            </p>
          </div>
          <Badge tone={summaryTones[summary.status]}>{summaryStatusLabels[summary.status]}</Badge>
        </div>
        <p className="font-bold">{summary.subject}</p>
        {canSend && (
          <div>
            <Button onClick={() => onOpenDraft(summary)}>
              Open the draft
              <span className="sr-only">: {period}</span>
            </Button>
          </div>
        )}
      </article>
    );
  }
  return (
    <article
      id={summaryCardId(summary.id)}
      tabIndex={-1}
      aria-labelledby={`${id}-title`}
      className="flex flex-col gap-4 rounded-xl border-2 border-thread bg-surface p-5"
    >
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="flex flex-col gap-1">
          <h3 id={`${id}-title`} className="text-xl font-bold">
            {period}
          </h3>
          <p className="text-ink-soft">
            {versionWords(summary.versionIds, versions)} · sent{' '}
            {formatDateTime(summary.sentAt ?? summary.createdAt)}
            {summary.sentBy ? ` by ${summary.sentBy}` : ''}
            {rounds > 1 ? ` · sent ${rounds} times` : ''}
          </p>
        </div>
        <Badge tone={summaryTones[summary.status]}>{summaryStatusLabels[summary.status]}</Badge>
      </div>
      <Table caption={<span className="text-base">E-mails of this summary</span>}>
        <TableHead>
          <ColumnHeader>Recipient</ColumnHeader>
          <ColumnHeader>Round</ColumnHeader>
          <ColumnHeader>Status</ColumnHeader>
          <ColumnHeader>Sent</ColumnHeader>
          <ColumnHeader>What happened</ColumnHeader>
        </TableHead>
        <TableBody>
          {summary.recipients.map((recipient) => {
            const state = recipientState(recipient);
            const words = failureWords(recipient.lastError);
            return (
              <TableRow key={recipient.id}>
                <RowHeader label="Recipient">
                  <span>{recipient.name}</span>
                  <span className="block font-normal text-ink-soft">{recipient.email}</span>
                </RowHeader>
                <TableCell label="Round">{recipient.round}</TableCell>
                <TableCell label="Status">
                  <Badge tone={recipientStateTones[state]}>{recipientStateLabels[state]}</Badge>
                </TableCell>
                <TableCell label="Sent">
                  {recipient.sentAt ? formatDateTime(recipient.sentAt) : '—'}
                </TableCell>
                <TableCell label="What happened">
                  {state === 'stopped'
                    ? 'Used the stop link: gets no more summaries.'
                    : (words ?? (recipient.status === 'sent' ? 'Handed to the mail server.' : '—'))}
                  {state === 'stopped' && words ? <span className="block text-ink-soft">{words}</span> : null}
                </TableCell>
              </TableRow>
            );
          })}
        </TableBody>
      </Table>
      <details>
        <summary className="min-h-11 cursor-pointer py-2 font-bold">Show the text as sent</summary>
        <p className="mt-2 font-bold">{summary.subject}</p>
        <div className="mt-2 whitespace-pre-wrap leading-relaxed">{summary.text}</div>
      </details>
      {canSend && (
        <div>
          <Button onClick={() => onResend(summary)}>
            Send again
            <span className="sr-only">: summary {period}</span>
          </Button>
        </div>
      )}
    </article>
  );
};

type SummaryListProps = {
  summaries: Summary[];
  versions: ProfileVersion[];
  canSend: boolean;
  onResent: (summary: Summary) => void;
  onOpenDraft: (summary: Summary) => void;
};

/** The client's summaries, newest first: drafts to open, and sent ones with the state of every e-mail. */
export const SummaryList = ({ summaries, versions, canSend, onResent, onOpenDraft }: SummaryListProps) => {
  const [resending, setResending] = useState<Summary | null>(null);
  return (
    <div className="flex flex-col gap-5">
      {summaries.map((summary) => (
        <SummaryCard
          key={summary.id}
          summary={summary}
          versions={versions}
          canSend={canSend}
          onResend={setResending}
          onOpenDraft={onOpenDraft}
        />
      ))}
      {canSend && (
        <ResendDialog
          summary={resending}
          onClose={() => setResending(null)}
          onResent={(saved) => {
            setResending(null);
            onResent(saved);
          }}
        />
      )}
    </div>
  );
};
