import type { Consent, Contact } from '@keyloom/shared';
import { useEffect, useRef, useState } from 'react';
import { PageLoading } from '@/components/layout/page-loading';
import { formatDate } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { useConsents } from '../api/get-consents';
import { useContacts } from '../api/get-contacts';
import { ConsentRecords } from './consent-records';
import { ContactDialog } from './contact-dialog';
import { ContactsTable } from './contacts-table';
import { DeleteContactDialog } from './delete-contact-dialog';
import { RenewSummariesDialog } from './renew-summaries-dialog';
import { RecordConsentDialog } from './record-consent-dialog';
import { type ConsentEnding, WithdrawConsentDialog } from './withdraw-consent-dialog';
import { reportSentence } from '../lib/withdrawal-words';

type ConsentPanelProps = {
  clientId: string;
  pseudonym: string;
  /** Owning clinician; supervisors read only. */
  canEdit: boolean;
  announce: (tone: 'success' | 'error', text: string) => void;
};

/** The "Consent & family" tab: consent records, withdrawal, scanned forms and family contacts. */
/** How long after a dialog's action focus that falls to the page is put back on the heading, ms. */
const RESCUE_MS = 3000;

export const ConsentPanel = ({ clientId, pseudonym, canEdit, announce }: ConsentPanelProps) => {
  const consents = useConsents(clientId);
  const contacts = useContacts(clientId);
  const [recording, setRecording] = useState(false);
  const [ending, setEnding] = useState<{ consent: Consent; ending: ConsentEnding } | null>(null);
  const [editingContact, setEditingContact] = useState<Contact | 'new' | null>(null);
  const [deletingContact, setDeletingContact] = useState<Contact | null>(null);
  const [renewingContact, setRenewingContact] = useState<Contact | null>(null);
  // After recording, withdrawing or voiding, focus goes to the records' heading once the dialog has
  // closed (after a withdrawal or a void the button that opened the dialog is gone), so keyboard users
  // carry on from the list that shows the change.
  // The same after deleting a contact or lifting a stop: focus goes to the contacts' heading.
  const recordsHeading = useRef<HTMLHeadingElement>(null);
  const contactsHeading = useRef<HTMLHeadingElement>(null);
  const [focusAfter, setFocusAfter] = useState<'records' | 'contacts' | null>(null);
  // The refetched list may drop the button the dialog gave focus back to (focus falls to the page or
  // the tab panel): for RESCUE_MS after, focus that falls there goes to the heading again. Focus the user
  // has moved to a control is never taken.
  const rescueFrame = useRef(0);
  useEffect(() => () => cancelAnimationFrame(rescueFrame.current), []);
  useEffect(() => {
    if (!focusAfter) return;
    const target = (focusAfter === 'records' ? recordsHeading : contactsHeading).current;
    const timer = window.setTimeout(() => {
      target?.focus();
      setFocusAfter(null);
      cancelAnimationFrame(rescueFrame.current);
      const until = performance.now() + RESCUE_MS;
      const rescue = () => {
        // Lost: on the page itself, or on a container holding the heading (e.g. the tab panel).
        const active = document.activeElement;
        const lost = !active || active === document.body || (active !== target && active.contains(target));
        if (lost && target?.isConnected && document.querySelector('[role="dialog"]') === null) target.focus();
        if (performance.now() < until) rescueFrame.current = requestAnimationFrame(rescue);
      };
      rescueFrame.current = requestAnimationFrame(rescue);
    }, 0);
    return () => window.clearTimeout(timer);
  }, [focusAfter]);

  return (
    <div className="flex flex-col gap-10">
      <section aria-labelledby="consent-heading" className="flex flex-col gap-4">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <h3 id="consent-heading" ref={recordsHeading} tabIndex={-1} className="text-2xl font-bold">
            Consent records
          </h3>
          {canEdit && (
            <Button variant="primary" onClick={() => setRecording(true)}>
              Record consent
            </Button>
          )}
        </div>
        <p className="max-w-3xl text-ink-soft">
          Writing can be uploaded, and a model trained, only while a consent for model training is active.
          Withdrawing a consent deletes only what no other active consent still covers: the language samples
          and everything trained from them go once no consent covers training, and queued summary e-mails are
          stopped once none covers summaries. A record made in error (wrong client, date or scope) is voided
          instead: it stays, struck through, and deletes the same. The dialog lists what will go before you
          confirm.
        </p>
        {consents.isPending && <PageLoading />}
        {consents.isError && (
          <LoadError
            title="The consent records could not be loaded."
            error={consents.error}
            onRetry={() => void consents.refetch()}
          />
        )}
        {consents.isSuccess && consents.data.length === 0 && (
          <EmptyState title="No consent recorded yet.">
            {canEdit
              ? 'Record the consent from the signed form before uploading any writing.'
              : 'The clinician has not recorded consent yet.'}
          </EmptyState>
        )}
        {consents.isSuccess && consents.data.length > 0 && (
          <ConsentRecords
            clientId={clientId}
            consents={consents.data}
            canEdit={canEdit}
            onWithdraw={(consent) => setEnding({ consent, ending: 'withdraw' })}
            onVoid={(consent) => setEnding({ consent, ending: 'void' })}
            onChanged={(message) => announce('success', message)}
          />
        )}
      </section>

      <section aria-labelledby="contacts-heading" className="flex flex-col gap-4">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <h3 id="contacts-heading" ref={contactsHeading} tabIndex={-1} className="text-2xl font-bold">
            Family contacts
          </h3>
          {canEdit && <Button onClick={() => setEditingContact('new')}>Add family contact</Button>}
        </div>
        {contacts.isPending && <PageLoading />}
        {contacts.isError && (
          <LoadError
            title="The family contacts could not be loaded."
            error={contacts.error}
            onRetry={() => void contacts.refetch()}
          />
        )}
        {contacts.isSuccess && contacts.data.length === 0 && (
          <EmptyState title="No family contacts yet.">
            People who may receive progress summaries are listed here once added.
          </EmptyState>
        )}
        {contacts.isSuccess && contacts.data.length > 0 && (
          <ContactsTable
            contacts={contacts.data}
            canEdit={canEdit}
            onEdit={setEditingContact}
            onDelete={setDeletingContact}
            onRenew={setRenewingContact}
          />
        )}
      </section>

      {canEdit && (
        <>
          <RecordConsentDialog
            open={recording}
            clientId={clientId}
            pseudonym={pseudonym}
            onClose={() => setRecording(false)}
            onRecorded={(consent) => {
              setRecording(false);
              setFocusAfter('records');
              announce('success', `Consent given on ${formatDate(consent.givenOn)} is recorded.`);
            }}
          />
          <WithdrawConsentDialog
            clientId={clientId}
            pseudonym={pseudonym}
            consent={ending?.consent ?? null}
            ending={ending?.ending}
            onClose={() => setEnding(null)}
            onWithdrawn={(consent) => {
              setEnding(null);
              setFocusAfter('records');
              const report = consent.voidReport ?? consent.withdrawal;
              const what = consent.status === 'voided' ? 'Consent record voided.' : 'Consent withdrawn.';
              announce('success', `${what} ${report ? reportSentence(report) : ''}`.trim());
            }}
          />
          <DeleteContactDialog
            clientId={clientId}
            contact={deletingContact}
            onClose={() => setDeletingContact(null)}
            onDeleted={(contact) => {
              setDeletingContact(null);
              setFocusAfter('contacts');
              announce('success', `Deleted ${contact.name}. Summaries already sent keep their record.`);
            }}
          />
          <RenewSummariesDialog
            clientId={clientId}
            contact={renewingContact}
            onClose={() => setRenewingContact(null)}
            onRenewed={(contact) => {
              setRenewingContact(null);
              setFocusAfter('contacts');
              announce(
                'success',
                `Summaries to ${contact.name} are on again (consent given on ${formatDate(contact.summariesConsentGivenOn)}).`,
              );
            }}
          />
          <ContactDialog
            open={editingContact !== null}
            clientId={clientId}
            contact={editingContact === 'new' || editingContact === null ? undefined : editingContact}
            onClose={() => setEditingContact(null)}
            onSaved={(contact) => {
              setEditingContact(null);
              announce('success', `Saved ${contact.name}.`);
            }}
          />
        </>
      )}
    </div>
  );
};
