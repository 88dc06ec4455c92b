import { type Consent, withdrawConsentSchema } from '@keyloom/shared';
import { Modal } from '@/components/ui/dialog';
import { ReasonForm } from '@/components/ui/reason-form';
import { useWithdrawConsent } from '../api/withdraw-consent';

type WithdrawConsentDialogProps = {
  clientId: string;
  pseudonym: string;
  /** How many language samples the client has now (all of them are deleted). */
  sampleCount: number;
  /** The consent being withdrawn; null keeps the dialog closed. */
  consent: Consent | null;
  onClose: () => void;
  onWithdrawn: (consent: Consent) => void;
};

const samplesPhrase = (count: number) => (count === 1 ? '1 language sample' : `${count} language samples`);

/** Asks for the reason and says exactly what a withdrawal deletes before anything happens. */
export const WithdrawConsentDialog = ({
  clientId,
  pseudonym,
  sampleCount,
  consent,
  onClose,
  onWithdrawn,
}: WithdrawConsentDialogProps) => {
  const withdraw = useWithdrawConsent();
  return (
    <Modal
      open={consent !== null}
      onClose={onClose}
      title={`Withdraw consent for ${pseudonym}?`}
      description={
        <>
          Keyloom will permanently delete all {samplesPhrase(sampleCount)} of {pseudonym}, and every model
          trained from them. The consent record stays, marked withdrawn, with your reason and a count of what
          was deleted. <strong>This cannot be undone.</strong>
        </>
      }
    >
      {consent && (
        <ReasonForm
          key={consent.id}
          schema={withdrawConsentSchema}
          defaultValues={{ reason: '' }}
          label="Reason for the withdrawal"
          hint="Kept in the consent record and the audit log, e.g. who asked and how."
          submitLabel={`Withdraw and delete ${samplesPhrase(sampleCount)}`}
          busyLabel="Withdrawing…"
          submitVariant="danger"
          onSubmit={async (input) => {
            const withdrawn = await withdraw.mutateAsync({ clientId, consentId: consent.id, input });
            onWithdrawn(withdrawn);
          }}
          onCancel={onClose}
          aria-label="Withdraw consent"
        />
      )}
    </Modal>
  );
};
