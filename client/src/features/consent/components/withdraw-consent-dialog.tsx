import {
  type Consent,
  consentScopeLabels,
  voidConsentSchema,
  type WithdrawalPreview,
  withdrawConsentSchema,
} from '@keyloom/shared';
import { Modal } from '@/components/ui/dialog';
import { LoadError } from '@/components/ui/load-error';
import { formatDate } from '@/lib/format';
import { ReasonForm } from '@/components/ui/reason-form';
import { useWithdrawalPreview } from '../api/get-withdrawal-preview';
import { useVoidConsent } from '../api/void-consent';
import { useWithdrawConsent } from '../api/withdraw-consent';
import { cancelledItems, countWords, deletedItems } from '../lib/withdrawal-words';

/** Withdrawn: the person took consent back. Voided: the record was made in error. */
export type ConsentEnding = 'withdraw' | 'void';

type WithdrawConsentDialogProps = {
  clientId: string;
  pseudonym: string;
  /** The consent being withdrawn or voided; null keeps the dialog closed. */
  consent: Consent | null;
  /** What is done to it (default: withdraw). Both delete the same: what only this record allowed. */
  ending?: ConsentEnding;
  onClose: () => void;
  onWithdrawn: (consent: Consent) => void;
};

const endingWords = {
  withdraw: {
    title: (pseudonym: string) => `Withdraw consent for ${pseudonym}?`,
    checking: 'Checking what a withdrawal would delete…',
    checkFailed: 'Keyloom could not check what a withdrawal would delete.',
    marked: 'marked withdrawn',
    label: 'Reason for the withdrawal',
    hint: 'Kept in the consent record only (not in the audit log), e.g. who asked and how.',
    verb: 'Withdraw',
    plain: 'Withdraw consent',
    busy: 'Withdrawing…',
    form: 'Withdraw consent',
  },
  void: {
    title: (pseudonym: string) => `Void this consent record for ${pseudonym}?`,
    checking: 'Checking what voiding this record would delete…',
    checkFailed: 'Keyloom could not check what voiding this record would delete.',
    marked: 'struck through as recorded in error',
    label: 'Why this record is wrong',
    hint: 'For example: recorded for the wrong client, wrong date, wrong scope. Kept in the consent record; the audit log keeps that it was voided.',
    verb: 'Void',
    plain: 'Void the record',
    busy: 'Voiding…',
    form: 'Void consent record',
  },
} as const;

const lowerFirst = (text: string) => text.charAt(0).toLowerCase() + text.slice(1);

/** "the consent given on 14 Sept 2026 (until 13 Sept 2027)", or "the consents given on … and …". */
const coveringConsents = (coveredBy: WithdrawalPreview['scopes'][number]['coveredBy']): string => {
  const one = (c: (typeof coveredBy)[number]) =>
    `${formatDate(c.givenOn)}${c.expiresOn ? ` (until ${formatDate(c.expiresOn)})` : ''}`;
  return coveredBy.length === 1
    ? `the consent given on ${one(coveredBy[0])}`
    : `the consents given on ${coveredBy.map(one).join(' and ')}`;
};

/** The sentences under the title: what will go, what stays and why; before anything happens. */
const previewSummary = (pseudonym: string, preview: WithdrawalPreview, ending: ConsentEnding): string => {
  const deleted = deletedItems(preview.report);
  const kept = preview.scopes
    .filter((s) => s.coveredBy.length > 0)
    .map(
      (s) =>
        `${coveringConsents(s.coveredBy)} still covers ${lowerFirst(consentScopeLabels[s.scope])}, so nothing it allows is deleted`,
    );
  const first =
    deleted.length > 0
      ? `Keyloom will permanently delete what this consent alone allowed for ${pseudonym}, listed below.`
      : `Nothing will be deleted for ${pseudonym}.`;
  const keptSentence =
    kept.length > 0 ? ` ${kept.map((k) => k.charAt(0).toUpperCase() + k.slice(1)).join('. ')}.` : '';
  return `${first}${keptSentence} The consent record stays, ${endingWords[ending].marked}, with your reason and a count of what was deleted.`;
};

/** A titled list of counts (a region named by its heading); nothing when the list is empty. */
const ItemList = ({ id, title, items }: { id: string; title: string; items: readonly string[] }) =>
  items.length === 0 ? null : (
    <section aria-labelledby={`${id}-heading`}>
      <h3 id={`${id}-heading`} className="font-bold">
        {title}
      </h3>
      <ul className="ml-6 list-disc">
        {items.map((item) => (
          <li key={item}>{item}</li>
        ))}
      </ul>
    </section>
  );

/**
 * Asks the API what a withdrawal (or voiding) would delete now, lists it, then asks for the reason.
 * The form only appears once the list is known, so nobody confirms without seeing it.
 */
export const WithdrawConsentDialog = ({
  clientId,
  pseudonym,
  consent,
  ending = 'withdraw',
  onClose,
  onWithdrawn,
}: WithdrawConsentDialogProps) => {
  const withdraw = useWithdrawConsent();
  const voidRecord = useVoidConsent();
  const words = endingWords[ending];
  const preview = useWithdrawalPreview(clientId, consent?.id ?? null);
  const report = preview.data?.report;
  const deleted = report ? deletedItems(report) : [];
  const cancelled = report ? cancelledItems(report) : [];
  const samples = report?.samplesDeleted ?? 0;
  const submitLabel =
    samples > 0
      ? `${words.verb} and delete ${countWords('samples', samples)}`
      : deleted.length > 0
        ? `${words.verb} and delete the listed data`
        : words.plain;

  return (
    <Modal
      open={consent !== null}
      onClose={onClose}
      title={words.title(pseudonym)}
      description={
        preview.data ? (
          <>
            {previewSummary(pseudonym, preview.data, ending)} <strong>This cannot be undone.</strong>
          </>
        ) : (
          words.checking
        )
      }
    >
      {preview.isError && (
        <LoadError title={words.checkFailed} error={preview.error} onRetry={() => void preview.refetch()} />
      )}
      {consent && preview.data && (
        <div className="flex flex-col gap-5">
          <ItemList id="withdraw-deletes" title="Will be deleted" items={deleted} />
          <ItemList id="withdraw-cancels" title="Will not be sent" items={cancelled} />
          <ReasonForm
            key={`${ending}-${consent.id}`}
            schema={ending === 'void' ? voidConsentSchema : withdrawConsentSchema}
            defaultValues={{ reason: '' }}
            label={words.label}
            hint={words.hint}
            submitLabel={submitLabel}
            busyLabel={words.busy}
            submitVariant="danger"
            onSubmit={async (input) => {
              const mutation = ending === 'void' ? voidRecord : withdraw;
              onWithdrawn(await mutation.mutateAsync({ clientId, consentId: consent.id, input }));
            }}
            onCancel={onClose}
            aria-label={words.form}
          />
        </div>
      )}
    </Modal>
  );
};
