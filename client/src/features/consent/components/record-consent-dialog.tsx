import { type Consent, consentScopeLabels, consentScopes, createConsentSchema } from '@keyloom/shared';
import { Modal } from '@/components/ui/dialog';
import { Form, FormServerError } from '@/components/ui/form';
import { FormActions } from '@/components/ui/form-actions';
import { FieldError } from '@/components/ui/field-message';
import { TextAreaField } from '@/components/ui/text-area-field';
import { DateField } from '@/components/ui/date-field';
import { TextField } from '@/components/ui/text-field';
import { useCreateConsent } from '../api/create-consent';

// An empty date field means "no date", which the schema takes as null.
const emptyToNull = (value: unknown) => (value === '' ? null : value);

type RecordConsentDialogProps = {
  open: boolean;
  clientId: string;
  pseudonym: string;
  onClose: () => void;
  onRecorded: (consent: Consent) => void;
};

/** Records who consented, to what, from when and until when. */
export const RecordConsentDialog = ({
  open,
  clientId,
  pseudonym,
  onClose,
  onRecorded,
}: RecordConsentDialogProps) => {
  const createConsent = useCreateConsent();
  return (
    <Modal
      open={open}
      onClose={onClose}
      title={`Record consent for ${pseudonym}`}
      description="Record what was agreed, as written on the signed form. You can attach a scan of the form afterwards."
    >
      <Form
        schema={createConsentSchema}
        // Nothing is chosen for the clinician: who gave consent, what it covers and the date are read
        // from the signed form, so an empty submit is refused rather than recording a guess.
        defaultValues={{
          representativeName: '',
          representativeRelationship: '',
          scopes: [],
          givenOn: '',
          expiresOn: null,
          notes: '',
        }}
        errorSummary
        onSubmit={async (input) => {
          const consent = await createConsent.mutateAsync({ clientId, input });
          onRecorded(consent);
        }}
        aria-label="Consent record"
      >
        {({ register, formState, watch }) => {
          const byRepresentative = watch('givenBy') === 'representative';
          const { errors } = formState;
          return (
            <>
              <FormServerError message={errors.root?.server?.message} />
              <div className="flex flex-col gap-5">
                <fieldset
                  className="flex flex-col gap-2"
                  aria-describedby={errors.givenBy?.message ? 'consent-given-by-error' : undefined}
                >
                  <legend className="mb-1 font-bold">Who gave consent</legend>
                  {errors.givenBy?.message && (
                    <FieldError id="consent-given-by-error">{errors.givenBy.message}</FieldError>
                  )}
                  <label className="flex min-h-11 items-center gap-3">
                    <input
                      type="radio"
                      value="client"
                      className="size-5 accent-ink"
                      {...register('givenBy')}
                    />
                    The client, {pseudonym}
                  </label>
                  <label className="flex min-h-11 items-center gap-3">
                    <input
                      type="radio"
                      value="representative"
                      className="size-5 accent-ink"
                      {...register('givenBy')}
                    />
                    A representative on the client’s behalf
                  </label>
                </fieldset>
                {byRepresentative && (
                  <>
                    <TextField
                      label="Representative’s name"
                      autoComplete="off"
                      registration={register('representativeName')}
                      error={errors.representativeName}
                    />
                    <TextField
                      label="Relationship to the client"
                      autoComplete="off"
                      hint="For example: mother, legal guardian, attorney."
                      registration={register('representativeRelationship')}
                      error={errors.representativeRelationship}
                    />
                  </>
                )}
                <fieldset
                  className="flex flex-col gap-2"
                  aria-describedby={errors.scopes?.message ? 'consent-scopes-error' : undefined}
                >
                  <legend className="mb-1 font-bold">What the consent covers</legend>
                  {errors.scopes?.message && (
                    <FieldError id="consent-scopes-error">{errors.scopes.message}</FieldError>
                  )}
                  {consentScopes.map((scope) => (
                    <label key={scope} className="flex min-h-11 items-start gap-3">
                      <input
                        type="checkbox"
                        value={scope}
                        className="mt-1 size-5 shrink-0 accent-ink"
                        {...register('scopes')}
                      />
                      {consentScopeLabels[scope]}
                    </label>
                  ))}
                </fieldset>
                <DateField
                  label="Date consent was given"
                  hint="As written on the signed form; not after today."
                  registration={register('givenOn')}
                  error={errors.givenOn}
                />
                <DateField
                  label="Expires on (optional)"
                  hint="Leave empty when the consent has no end date."
                  registration={register('expiresOn', { setValueAs: emptyToNull })}
                  error={errors.expiresOn}
                />
                <TextAreaField
                  label="Notes (optional)"
                  rows={3}
                  registration={register('notes')}
                  error={errors.notes}
                />
                <FormActions
                  submitLabel="Record consent"
                  busyLabel="Recording…"
                  submitting={formState.isSubmitting}
                  onCancel={onClose}
                />
              </div>
            </>
          );
        }}
      </Form>
    </Modal>
  );
};
