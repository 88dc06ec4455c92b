import {
  type Contact,
  createSummarySchema,
  type ProfileVersion,
  profileVersionStatusLabels,
  type Summary,
  type SummaryPreview,
  type SummaryPreviewRequest,
  summaryPreviewRequestSchema,
} from '@keyloom/shared';
import { useId, useRef, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { formatDate } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { FieldError } from '@/components/ui/field-message';
import { Form, FormServerError } from '@/components/ui/form';
import { TextAreaField } from '@/components/ui/text-area-field';
import { DateField } from '@/components/ui/date-field';
import { useCreateSummary } from '../api/create-summary';
import { useIdempotencyKey } from '../api/idempotency-key';
import { usePreviewSummary } from '../api/preview-summary';
import { defaultPeriod } from '../lib/summary-period';
import { SummaryPreviewView } from './summary-preview';
import { contactBlockedReason } from '../lib/summary-words';

// Versions a summary can report: trained at least (the API refuses the others).
const REPORTABLE = new Set(['trained', 'signed_off', 'active', 'retired', 'sent_back']);

type SummaryComposerProps = {
  clientId: string;
  pseudonym: string;
  contacts: Contact[];
  versions: ProfileVersion[];
  /** Called with the draft once it is stored (nothing is sent yet). */
  onDrafted: (summary: Summary) => void;
  onCancel: () => void;
};

type CheckboxRowProps = {
  /** The field the box belongs to (ties a refused group to its boxes in the list of what needs attention). */
  name: string;
  label: string;
  detail: string;
  checked: boolean;
  disabled?: boolean;
  onChange: (checked: boolean) => void;
};

/** A checkbox of a group whose value is kept as a list by hand (a lone registered box would give a string). */
const CheckboxRow = ({ name, label, detail, checked, disabled, onChange }: CheckboxRowProps) => {
  const id = useId();
  return (
    <div className="flex items-start gap-3">
      <input
        id={id}
        name={name}
        type="checkbox"
        className="mt-1 size-6 shrink-0 accent-ink"
        checked={checked}
        disabled={disabled}
        aria-describedby={`${id}-detail`}
        onChange={(event) => onChange(event.target.checked)}
      />
      <div>
        <label htmlFor={id} className={disabled ? 'font-bold text-ink-soft' : 'font-bold'}>
          {label}
        </label>
        <p id={`${id}-detail`} className="text-ink-soft">
          {detail}
        </p>
      </div>
    </div>
  );
};

const toggled = (list: string[], id: string, on: boolean): string[] =>
  on ? [...new Set([...list, id])] : list.filter((item) => item !== id);

/**
 * "New progress summary": period, versions, recipients and the clinician's note; "Preview" shows
 * the generated text and charts (from the API), "Write the draft" stores a draft to edit and send.
 * Contacts who cannot receive summaries are listed, switched off, with the reason.
 */
export const SummaryComposer = ({
  clientId,
  pseudonym,
  contacts,
  versions,
  onDrafted,
  onCancel,
}: SummaryComposerProps) => {
  const ids = useId();
  const createSummary = useCreateSummary();
  const sendKey = useIdempotencyKey();
  const previewSummary = usePreviewSummary();
  const [preview, setPreview] = useState<{ key: string; result: SummaryPreview } | null>(null);
  const [previewError, setPreviewError] = useState<string | null>(null);
  const previewHeading = useRef<HTMLHeadingElement>(null);
  const reportable = versions
    .filter((version) => REPORTABLE.has(version.status))
    .sort((a, b) => a.number - b.number);
  const allowed = contacts.filter((contact) => contactBlockedReason(contact) === null);

  return (
    <Form
      schema={createSummarySchema}
      aria-labelledby={`${ids}-title`}
      defaultValues={{ ...defaultPeriod(), versionIds: [], contactIds: [], note: '' }}
      errorSummary
      onSubmit={async (input) => {
        // The same key when the same draft is asked for again after an error: it is made once.
        const idempotencyKey = sendKey.keyFor({ clientId, input });
        const summary = await createSummary.mutateAsync({ clientId, input, idempotencyKey });
        sendKey.done();
        onDrafted(summary);
      }}
    >
      {({ register, formState, setValue, watch, getValues }, { checkFields }) => {
        const errors = formState.errors;
        const versionIds = (watch('versionIds') ?? []) as string[];
        const contactIds = (watch('contactIds') ?? []) as string[];
        const request: SummaryPreviewRequest = {
          from: watch('from'),
          to: watch('to'),
          versionIds,
          note: (watch('note') ?? '').trim(),
          includeComments: [],
        };
        const key = JSON.stringify(request);
        const current = preview?.key === key ? preview.result : null;
        const stale = preview !== null && current === null;

        const showPreview = async () => {
          setPreviewError(null);
          if (!(await checkFields(['from', 'to', 'versionIds', 'note']))) return;
          const values = getValues();
          const parsed = summaryPreviewRequestSchema.safeParse(values);
          if (!parsed.success) return;
          try {
            const result = await previewSummary.mutateAsync({ clientId, input: parsed.data });
            setPreview({ key: JSON.stringify({ ...parsed.data }), result });
            // Screen reader and keyboard users land on the preview they asked for.
            requestAnimationFrame(() => previewHeading.current?.focus());
          } catch (error) {
            setPreviewError(error instanceof Error ? error.message : 'The preview could not be made.');
          }
        };

        return (
          <div className="flex flex-col gap-8">
            <div>
              <h3 id={`${ids}-title`} className="text-2xl font-bold">
                New progress summary for {pseudonym}
              </h3>
              <p className="mt-1 text-ink-soft">
                The figures are estimates from practice texts, not measurements of everyday use; the e-mail
                says so. You get a draft to edit before anything is sent. Each e-mail carries a link with
                which the family member can stop receiving summaries without an account.
              </p>
            </div>
            <FormServerError message={errors.root?.server?.message} />

            <fieldset className="grid gap-5 sm:grid-cols-2">
              <legend className="mb-3 text-xl font-bold">Period</legend>
              <DateField label="From" registration={register('from')} error={errors.from} />
              <DateField label="To" registration={register('to')} error={errors.to} />
            </fieldset>

            <fieldset className="flex flex-col gap-3" aria-describedby={`${ids}-versions-hint`}>
              <legend className="mb-1 text-xl font-bold">Versions to include</legend>
              <p id={`${ids}-versions-hint`} className="text-ink-soft">
                Tick none to include only the versions a supervisor approved in the period. A version you tick
                that is not approved is labelled with its status in the e-mail.
              </p>
              {errors.versionIds?.message && (
                <FieldError id={`${ids}-versions-error`}>{errors.versionIds.message}</FieldError>
              )}
              {reportable.length === 0 && <p>No version of {pseudonym}’s profile has been trained yet.</p>}
              {reportable.map((version) => (
                <CheckboxRow
                  key={version.id}
                  name="versionIds"
                  label={`Version ${version.number}`}
                  detail={`${profileVersionStatusLabels[version.status]}${
                    version.trainedAt ? `, trained ${formatDate(version.trainedAt)}` : ''
                  }`}
                  checked={versionIds.includes(version.id)}
                  onChange={(on) =>
                    setValue('versionIds', toggled(versionIds, version.id, on), {
                      shouldValidate: formState.isSubmitted,
                    })
                  }
                />
              ))}
            </fieldset>

            <fieldset
              className="flex flex-col gap-3"
              aria-describedby={
                errors.contactIds?.message
                  ? `${ids}-contacts-hint ${ids}-contacts-error`
                  : `${ids}-contacts-hint`
              }
            >
              <legend className="mb-1 text-xl font-bold">Recipients</legend>
              <p id={`${ids}-contacts-hint`} className="text-ink-soft">
                Only family contacts who agreed to receive summaries can be chosen.
              </p>
              {errors.contactIds?.message && (
                <FieldError id={`${ids}-contacts-error`}>{errors.contactIds.message}</FieldError>
              )}
              {contacts.length === 0 && (
                <p>No family contacts yet. Add them on the Consent &amp; family tab.</p>
              )}
              {contacts.length > 0 && allowed.length === 0 && (
                <p>None of the family contacts can receive summaries at the moment.</p>
              )}
              {contacts.map((contact) => {
                const blocked = contactBlockedReason(contact);
                return (
                  <CheckboxRow
                    key={contact.id}
                    name="contactIds"
                    label={`${contact.name} (${contact.relationship})`}
                    detail={blocked ?? contact.email}
                    disabled={blocked !== null}
                    checked={blocked === null && contactIds.includes(contact.id)}
                    onChange={(on) =>
                      setValue('contactIds', toggled(contactIds, contact.id, on), {
                        shouldValidate: formState.isSubmitted,
                      })
                    }
                  />
                );
              })}
            </fieldset>

            <TextAreaField
              label="Your note to the family"
              hint="Optional. Sent as you write it, after the figures. Up to 4000 characters."
              registration={register('note')}
              error={errors.note}
              rows={5}
            />

            <div className="flex flex-wrap gap-3">
              <Button type="submit" variant="primary" disabled={formState.isSubmitting}>
                {formState.isSubmitting ? 'Writing the draft…' : 'Write the draft'}
              </Button>
              <Button onClick={() => void showPreview()} disabled={previewSummary.isPending}>
                {previewSummary.isPending ? 'Making the preview…' : 'Preview the figures'}
              </Button>
              <Button onClick={onCancel}>Cancel</Button>
            </div>

            <div role="alert">
              {previewError && (
                <Alert tone="error" title="The preview could not be made.">
                  {previewError}
                </Alert>
              )}
            </div>

            <div role="status" aria-live="polite">
              {stale && (
                <Alert tone="info" title="The preview is out of date.">
                  You changed the period, the versions or the note. Preview again to see the new figures.
                </Alert>
              )}
            </div>

            {current && (
              <section aria-labelledby={`${ids}-preview-title`} className="flex flex-col gap-5">
                <h3
                  id={`${ids}-preview-title`}
                  ref={previewHeading}
                  tabIndex={-1}
                  className="text-2xl font-bold"
                >
                  Preview
                </h3>
                <SummaryPreviewView preview={current} />
              </section>
            )}
          </div>
        );
      }}
    </Form>
  );
};
