import {
  type Consent,
  consentScopeLabels,
  type WithdrawalPreview,
  withdrawConsentSchema,
} from '@keyloom/shared';
import { Modal } from '@/components/ui/dialog';
import { LoadError } from '@/components/ui/load-error';
import { ReasonForm } from '@/components/ui/reason-form';
import { useWithdrawalPreview } from '../api/get-withdrawal-preview';
import { useWithdrawConsent } from '../api/withdraw-consent';
import { cancelledItems, countWords, deletedItems } from '../lib/withdrawal-words';

type WithdrawConsentDialogProps = {
  clientId: string;
  pseudonym: string;
  /** The consent being withdrawn; null keeps the dialog closed. */
  consent: Consent | null;
  onClose: () => void;
  onWithdrawn: (consent: Consent) => void;
};

const lowerFirst = (text: string) => text.charAt(0).toLowerCase() + text.slice(1);

/** "the consent given on 2026-09-14 (until 2027-09-13)", or "the consents given on … and …". */
const coveringConsents = (coveredBy: WithdrawalPreview['scopes'][number]['coveredBy']): string => {
  const one = (c: (typeof coveredBy)[number]) =>
    `${c.givenOn}${c.expiresOn ? ` (until ${c.expiresOn})` : ''}`;
  return coveredBy.length === 1
    ? `the consent given on ${one(coveredBy[0])}`
    : `the consents given on ${coveredBy.map(one).join(' and ')}`;
};

/** The sentences under the title: what will go, what stays and why; before anything happens. */
const previewSummary = (pseudonym: string, preview: WithdrawalPreview): string => {
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
  return `${first}${keptSentence} The consent record stays, marked withdrawn, with your reason and a count of what was deleted.`;
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
 * Asks the API what a withdrawal would delete now, lists it, then asks for the reason. The form only
 * appears once the list is known, so nobody confirms without seeing it.
 */
export const WithdrawConsentDialog = ({
  clientId,
  pseudonym,
  consent,
  onClose,
  onWithdrawn,
}: WithdrawConsentDialogProps) => {
  const withdraw = useWithdrawConsent();
  const preview = useWithdrawalPreview(clientId, consent?.id ?? null);
  const report = preview.data?.report;
  const deleted = report ? deletedItems(report) : [];
  const cancelled = report ? cancelledItems(report) : [];
  const samples = report?.samplesDeleted ?? 0;
  const submitLabel =
    samples > 0
      ? `Withdraw and delete ${countWords('samples', samples)}`
      : deleted.length > 0
        ? 'Withdraw and delete the listed data'
        : 'Withdraw consent';

  return (
    <Modal
      open={consent !== null}
      onClose={onClose}
      title={`Withdraw consent for ${pseudonym}?`}
      description={
        preview.data ? (
          <>
            {previewSummary(pseudonym, preview.data)} <strong>This cannot be undone.</strong>
          </>
        ) : (
          'Checking what a withdrawal would delete…'
        )
      }
    >
      {preview.isError && (
        <LoadError
          title="Keyloom could not check what a withdrawal would delete."
          error={preview.error}
          onRetry={() => void preview.refetch()}
        />
      )}
      {consent && preview.data && (
        <div className="flex flex-col gap-5">
          <ItemList id="withdraw-deletes" title="Will be deleted" items={deleted} />
          <ItemList id="withdraw-cancels" title="Will not be sent" items={cancelled} />
          <ReasonForm
            key={consent.id}
            schema={withdrawConsentSchema}
            defaultValues={{ reason: '' }}
            label="Reason for the withdrawal"
            hint="Kept in the consent record only (not in the audit log), e.g. who asked and how."
            submitLabel={submitLabel}
            busyLabel="Withdrawing…"
            submitVariant="danger"
            onSubmit={async (input) => {
              const withdrawn = await withdraw.mutateAsync({ clientId, consentId: consent.id, input });
              onWithdrawn(withdrawn);
            }}
            onCancel={onClose}
            aria-label="Withdraw consent"
          />
        </div>
      )}
    </Modal>
  );
};
