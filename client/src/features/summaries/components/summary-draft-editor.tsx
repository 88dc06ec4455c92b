import { type Summary, type SummaryCommentRef, updateSummarySchema } from '@keyloom/shared';
import { useEffect, useId, useRef, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Modal } from '@/components/ui/dialog';
import { Form, FormServerError } from '@/components/ui/form';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';
import { useDeleteSummary } from '../api/delete-summary';
import { useIdempotencyKey } from '../api/idempotency-key';
import { useSendSummary } from '../api/send-summary';
import { useUpdateSummary } from '../api/update-summary';
import { SummaryMessageView } from './summary-message-view';

type SummaryDraftEditorProps = {
  summary: Summary;
  pseudonym: string;
  /** Names of the draft's recipients, for the Send button and its confirmation. */
  recipientNames: string[];
  onSent: (summary: Summary) => void;
  onDeleted: () => void;
  onClose: () => void;
};

const sameComment = (a: SummaryCommentRef, b: SummaryCommentRef) =>
  a.versionId === b.versionId && a.kind === b.kind;

const kindWords: Record<SummaryCommentRef['kind'], string> = {
  'sign-off': 'signing off after the trial',
  approval: 'approving',
};

/**
 * A draft summary: its subject and text to edit, the staff comments the clinician may tick one by
 * one (none is quoted otherwise), what was left out and why (for the clinician only), the e-mail
 * exactly as the family will get it, then Send — or delete the draft.
 */
export const SummaryDraftEditor = ({
  summary,
  pseudonym,
  recipientNames,
  onSent,
  onDeleted,
  onClose,
}: SummaryDraftEditorProps) => {
  const ids = useId();
  const update = useUpdateSummary();
  const send = useSendSummary();
  const remove = useDeleteSummary();
  const sendKey = useIdempotencyKey();
  const [status, setStatus] = useState<string | null>(null);
  const [previewing, setPreviewing] = useState(false);
  const [confirm, setConfirm] = useState<'delete' | 'regenerate' | null>(null);
  const [actionError, setActionError] = useState<string | null>(null);
  const statusRef = useRef<HTMLParagraphElement>(null);
  const titleRef = useRef<HTMLHeadingElement>(null);
  // Opened (just written, or from the list): focus starts on the draft's heading.
  useEffect(() => titleRef.current?.focus(), []);
  const previewHeading = useRef<HTMLHeadingElement>(null);
  const say = (words: string) => {
    setStatus(words);
    requestAnimationFrame(() => statusRef.current?.focus());
  };
  const recipients = recipientNames.length === 1 ? recipientNames[0] : `${recipientNames.length} recipients`;

  return (
    <section aria-labelledby={`${ids}-title`} className="flex flex-col gap-6">
      <div>
        <h3 id={`${ids}-title`} ref={titleRef} tabIndex={-1} className="text-2xl font-bold">
          Draft summary for {pseudonym}, not sent
        </h3>
        <p className="mt-1 max-w-3xl text-ink-soft">
          Edit the words as you would write them to the family. Only versions a supervisor approved are in it
          unless you chose others; staff comments are quoted only when you tick them. Nothing is sent until
          you press Send.
        </p>
      </div>
      <p ref={statusRef} tabIndex={-1} role="status" className="font-bold">
        {status}
      </p>

      {summary.notes.length > 0 && (
        <Alert tone="info" title="Left out of this summary (only you see this)">
          <ul className="ml-6 list-disc">
            {summary.notes.map((note) => (
              <li key={note}>{note}</li>
            ))}
          </ul>
        </Alert>
      )}

      <Form
        // Saved or rewritten on the server: the fields start again from what is stored.
        key={`${summary.subject}\u0000${summary.text}\u0000${JSON.stringify(summary.includeComments)}`}
        schema={updateSummarySchema}
        aria-label="Edit the draft summary"
        errorSummary
        defaultValues={{
          subject: summary.subject,
          text: summary.text,
          includeComments: summary.includeComments,
        }}
        onSubmit={async (input) => {
          // Only what changed: a text sent unchanged would count as an edit of the generated text.
          const changedComments =
            JSON.stringify(input.includeComments ?? []) !== JSON.stringify(summary.includeComments);
          const saved = await update.mutateAsync({
            summaryId: summary.id,
            input: {
              ...(input.subject !== summary.subject ? { subject: input.subject } : {}),
              ...(input.text !== summary.text ? { text: input.text } : {}),
              ...(changedComments ? { includeComments: input.includeComments } : {}),
            },
          });
          setPreviewing(true);
          say(
            changedComments && saved.textEdited
              ? 'Draft saved. Your edited text was kept, so the comments you ticked are not in it: add them in your own words, or write the text again.'
              : 'Draft saved. The preview below shows it as the family will get it.',
          );
        }}
      >
        {({ register, formState, setValue, watch, reset }) => {
          const errors = formState.errors;
          const ticked = (watch('includeComments') ?? []) as SummaryCommentRef[];
          const dirty = formState.isDirty;
          return (
            <div className="flex flex-col gap-6">
              <FormServerError message={errors.root?.server?.message} />
              <TextField label="Subject" registration={register('subject')} error={errors.subject} />
              <TextAreaField
                label="Text of the e-mail"
                hint="Plain text: a blank line starts a new paragraph. The charts and the stop link are added below it."
                registration={register('text')}
                error={errors.text}
                rows={16}
              />
              {summary.textEdited && (
                <div className="flex flex-col gap-2">
                  <p className="text-ink-soft">
                    You edited this text. Changing the comments below keeps your words; to start again from
                    the text Keyloom writes, replace it.
                  </p>
                  <Button className="self-start" onClick={() => setConfirm('regenerate')}>
                    Replace my text with the generated text
                  </Button>
                </div>
              )}

              <fieldset className="flex flex-col gap-3" aria-describedby={`${ids}-comments-hint`}>
                <legend className="mb-1 text-xl font-bold">Staff comments to quote</legend>
                <p id={`${ids}-comments-hint`} className="text-ink-soft">
                  Comments were written for the team, not the family. Tick one only if it reads well to them.
                </p>
                {summary.availableComments.length === 0 && (
                  <p>The versions in this summary have no staff comments.</p>
                )}
                {summary.availableComments.map((comment) => {
                  const id = `${ids}-${comment.versionId}-${comment.kind}`;
                  const on = ticked.some((c) => sameComment(c, comment));
                  return (
                    <div key={id} className="flex items-start gap-3">
                      <input
                        id={id}
                        type="checkbox"
                        className="mt-1 size-6 shrink-0 accent-ink"
                        checked={on}
                        aria-describedby={`${id}-text`}
                        onChange={(event) =>
                          setValue(
                            'includeComments',
                            event.target.checked
                              ? [...ticked, { versionId: comment.versionId, kind: comment.kind }]
                              : ticked.filter((c) => !sameComment(c, comment)),
                            { shouldDirty: true },
                          )
                        }
                      />
                      <div>
                        <label htmlFor={id} className="font-bold">
                          Quote {comment.by} on version {comment.versionNumber}
                        </label>
                        <p id={`${id}-text`} className="text-ink-soft">
                          When {kindWords[comment.kind]}: “{comment.text}”
                        </p>
                      </div>
                    </div>
                  );
                })}
              </fieldset>

              <div className="flex flex-wrap gap-3">
                <Button type="submit" variant="primary" disabled={formState.isSubmitting}>
                  {formState.isSubmitting ? 'Saving…' : 'Save and preview'}
                </Button>
                <Button
                  variant="primary"
                  disabled={dirty || send.isPending || recipientNames.length === 0}
                  aria-describedby={`${ids}-send-hint`}
                  onClick={() => {
                    setActionError(null);
                    const idempotencyKey = sendKey.keyFor(summary.id);
                    // mutateAsync, not mutate's callbacks: once sent, the draft leaves the list and this
                    // editor unmounts, but the panel still has to hear that it was sent.
                    send.mutateAsync({ summaryId: summary.id, idempotencyKey }).then(
                      (sent) => {
                        sendKey.done();
                        onSent(sent);
                      },
                      (failure: Error) => setActionError(failure.message),
                    );
                  }}
                >
                  {send.isPending ? 'Sending…' : `Send to ${recipients}`}
                </Button>
                <Button
                  onClick={() => {
                    reset();
                    onClose();
                  }}
                >
                  Close the draft
                </Button>
                <Button variant="danger" onClick={() => setConfirm('delete')}>
                  Delete draft
                </Button>
              </div>
              <p id={`${ids}-send-hint`} className="text-ink-soft">
                {dirty
                  ? 'Save your changes first: Send sends the saved draft, exactly as the preview shows it.'
                  : `Goes to ${recipientNames.join(', ') || 'nobody yet'}, exactly as the preview shows it.`}
              </p>
            </div>
          );
        }}
      </Form>

      <div role="alert">
        {actionError && (
          <Alert tone="error" title="That did not work.">
            {actionError}
          </Alert>
        )}
      </div>

      {!previewing && (
        <Button
          className="self-start"
          onClick={() => {
            setPreviewing(true);
            requestAnimationFrame(() => previewHeading.current?.focus());
          }}
        >
          Preview the e-mail
        </Button>
      )}
      {previewing && (
        <section aria-labelledby={`${ids}-preview`} className="flex flex-col gap-3">
          <h4 id={`${ids}-preview`} ref={previewHeading} tabIndex={-1} className="text-xl font-bold">
            The e-mail as the family will get it
          </h4>
          <SummaryMessageView summaryId={summary.id} />
        </section>
      )}

      <Modal
        open={confirm === 'delete'}
        onClose={() => setConfirm(null)}
        title="Delete this draft?"
        description="Its text, subject and choices are deleted. Nothing was sent, so the family is not affected."
      >
        <div className="flex flex-wrap gap-3">
          <Button
            variant="danger"
            disabled={remove.isPending}
            onClick={() => {
              // As with Send: the editor unmounts once the draft is gone; the panel still hears it.
              remove.mutateAsync(summary.id).then(
                () => {
                  setConfirm(null);
                  onDeleted();
                },
                (failure: Error) => {
                  setConfirm(null);
                  setActionError(failure.message);
                },
              );
            }}
          >
            {remove.isPending ? 'Deleting…' : 'Delete the draft'}
          </Button>
          <Button onClick={() => setConfirm(null)}>Keep it</Button>
        </div>
      </Modal>
      <Modal
        open={confirm === 'regenerate'}
        onClose={() => setConfirm(null)}
        title="Replace your text?"
        description="Your edits to the text are replaced by the text Keyloom writes from the figures and the comments you ticked. The subject stays."
      >
        <div className="flex flex-wrap gap-3">
          <Button
            variant="danger"
            disabled={update.isPending}
            onClick={() =>
              update.mutate(
                { summaryId: summary.id, input: { regenerate: true } },
                {
                  onSuccess: () => {
                    setConfirm(null);
                    say('The text was written again from the figures. Your earlier edits are gone.');
                  },
                  onError: (failure) => {
                    setConfirm(null);
                    setActionError(failure.message);
                  },
                },
              )
            }
          >
            Replace my text
          </Button>
          <Button onClick={() => setConfirm(null)}>Keep my text</Button>
        </div>
      </Modal>
    </section>
  );
};
