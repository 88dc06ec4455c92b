import { type Consent, consentScopeLabels } from '@keyloom/shared';
import { type FormEvent, useId, useRef, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { env } from '@/config/env';
import { cn } from '@/lib/cn';
import { formatDate, formatDateTime } from '@/lib/format';
import { consentDocumentPath, useUploadConsentDocument } from '../api/upload-consent-document';
import { reportSentence } from '../lib/withdrawal-words';

const statusWords: Record<Consent['status'], { label: string; tone: BadgeTone }> = {
  active: { label: 'Active', tone: 'good' },
  expired: { label: 'Expired', tone: 'warn' },
  withdrawn: { label: 'Withdrawn', tone: 'bad' },
  voided: { label: 'Void: recorded in error', tone: 'neutral' },
};

const DOCUMENT_MAX_BYTES = 10 * 1024 * 1024;
const DOCUMENT_ACCEPT = '.pdf,.png,.jpg,.jpeg,application/pdf,image/png,image/jpeg';

const kilobytes = (bytes: number) => `${Math.max(1, Math.round(bytes / 1024))} KB`;

type DocumentUploadProps = { clientId: string; consent: Consent; onDone: (message: string) => void };

const DocumentUpload = ({ clientId, consent, onDone }: DocumentUploadProps) => {
  const inputId = useId();
  const input = useRef<HTMLInputElement>(null);
  const [error, setError] = useState<string | null>(null);
  const upload = useUploadConsentDocument();

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    setError(null);
    const file = input.current?.files?.[0];
    if (!file) return setError('Choose the scanned form first (PDF, PNG or JPEG).');
    if (file.size > DOCUMENT_MAX_BYTES)
      return setError('The file is larger than 10 MB. Scan at a lower resolution.');
    try {
      await upload.mutateAsync({ clientId, consentId: consent.id, file });
      if (input.current) input.current.value = '';
      onDone(`Attached ${file.name} to the consent record.`);
    } catch (caught) {
      setError(caught instanceof Error ? caught.message : 'The form was not attached. Try again.');
    }
  };

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="flex flex-col gap-2">
      <label htmlFor={inputId} className="font-bold">
        {consent.document ? 'Replace the scanned form' : 'Attach the scanned form'}
      </label>
      <p className="text-ink-soft" id={`${inputId}-hint`}>
        PDF, PNG or JPEG, at most 10 MB.
      </p>
      <div className="flex flex-wrap items-center gap-3">
        <input
          id={inputId}
          ref={input}
          type="file"
          accept={DOCUMENT_ACCEPT}
          aria-describedby={`${inputId}-hint`}
          className="max-w-full"
        />
        <Button type="submit" disabled={upload.isPending}>
          {upload.isPending ? 'Uploading…' : 'Upload form'}
        </Button>
      </div>
      <div role="alert">{error && <Alert tone="error">{error}</Alert>}</div>
    </form>
  );
};

type ConsentRecordsProps = {
  clientId: string;
  consents: readonly Consent[];
  /** Owning clinician: may attach forms, withdraw and void. */
  canEdit: boolean;
  onWithdraw: (consent: Consent) => void;
  onVoid: (consent: Consent) => void;
  onChanged: (message: string) => void;
};

/** Each consent record, newest first, with its document and — when withdrawn — what was deleted. */
export const ConsentRecords = ({
  clientId,
  consents,
  canEdit,
  onWithdraw,
  onVoid,
  onChanged,
}: ConsentRecordsProps) => {
  const sorted = [...consents].sort(
    (a, b) => b.givenOn.localeCompare(a.givenOn) || b.createdAt.localeCompare(a.createdAt),
  );
  return (
    <ul className="flex flex-col gap-4">
      {sorted.map((consent) => {
        const status = statusWords[consent.status];
        const voided = consent.status === 'voided';
        // A voided record is struck through (and says so in words, for screen readers).
        const struck = voided ? 'line-through decoration-2' : undefined;
        const givenOn = formatDate(consent.givenOn);
        return (
          <li key={consent.id} className="rounded-xl border-2 border-thread bg-surface p-4 sm:p-5">
            <article aria-label={`Consent given on ${givenOn}`} className="flex flex-col gap-3">
              <div className="flex flex-wrap items-center gap-3">
                <h4 className={cn('text-lg font-bold', struck)}>Consent given on {givenOn}</h4>
                <Badge tone={status.tone}>{status.label}</Badge>
              </div>
              {voided && (
                <Alert
                  tone="info"
                  title={`Voided on ${consent.voidedAt ? formatDateTime(consent.voidedAt) : ''} — ${consent.voidReason ?? ''}`}
                >
                  <p>
                    Voided by {consent.voidedBy}. This record was made in error and never counted as consent.
                  </p>
                  {consent.voidReport && <p>{reportSentence(consent.voidReport)}</p>}
                </Alert>
              )}
              <div className={cn('flex flex-col gap-3', struck)}>
                <p>
                  Given by{' '}
                  {consent.givenBy === 'client'
                    ? 'the client'
                    : `${consent.representativeName ?? 'a representative'} (${consent.representativeRelationship ?? 'representative'})`}
                  ; {consent.expiresOn ? `expires on ${formatDate(consent.expiresOn)}` : 'no expiry date'}.
                </p>
                <div>
                  <p className="font-bold">Covers</p>
                  <ul className="ml-6 list-disc">
                    {consent.scopes.map((scope) => (
                      <li key={scope}>{consentScopeLabels[scope]}</li>
                    ))}
                  </ul>
                </div>
                {consent.notes && <p className="whitespace-pre-line">{consent.notes}</p>}
                <p className="text-ink-soft">
                  Recorded by {consent.recordedBy} on {formatDateTime(consent.createdAt)}.
                </p>
              </div>
              {consent.document ? (
                <p>
                  Scanned form:{' '}
                  <a
                    href={`${env.API_URL}${consentDocumentPath(clientId, consent.id)}`}
                    className="font-bold underline"
                    download={consent.document.fileName}
                  >
                    {consent.document.fileName}
                  </a>{' '}
                  ({kilobytes(consent.document.byteSize)})
                </p>
              ) : (
                <p className="text-ink-soft">No scanned form attached.</p>
              )}
              {consent.status === 'withdrawn' && (
                <Alert
                  tone="info"
                  title={`Withdrawn${consent.withdrawnAt ? ` on ${formatDateTime(consent.withdrawnAt)}` : ''}`}
                >
                  {consent.withdrawalReason && <p>Reason: {consent.withdrawalReason}</p>}
                  {consent.withdrawal && <p>{reportSentence(consent.withdrawal)}</p>}
                </Alert>
              )}
              {canEdit && consent.status !== 'withdrawn' && !voided && (
                <div className="flex flex-col gap-4 border-t border-thread pt-3">
                  <DocumentUpload clientId={clientId} consent={consent} onDone={onChanged} />
                  <div className="flex flex-wrap gap-3">
                    <Button
                      variant="danger"
                      onClick={() => onWithdraw(consent)}
                      aria-label={`Withdraw consent given on ${givenOn}`}
                    >
                      Withdraw consent
                    </Button>
                    <Button
                      onClick={() => onVoid(consent)}
                      aria-label={`Void (recorded in error): consent given on ${givenOn}`}
                    >
                      Void (recorded in error)
                    </Button>
                  </div>
                </div>
              )}
            </article>
          </li>
        );
      })}
    </ul>
  );
};
