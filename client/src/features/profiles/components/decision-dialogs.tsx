import {
  approveSchema,
  type ProfileVersion,
  reportProblemSchema,
  retireSchema,
  sendBackSchema,
  signOffSchema,
} from '@keyloom/shared';
import { z } from 'zod';
import { Modal } from '@/components/ui/dialog';
import { Form, FormServerError } from '@/components/ui/form';
import { FormActions } from '@/components/ui/form-actions';
import { TextAreaField } from '@/components/ui/text-area-field';
import { type Decision, type DecisionInputs, useDecideProfileVersion } from '../api/decide-profile-version';
import { retireDescription } from '../lib/profile-words';

type DialogProps = {
  open: boolean;
  version: Pick<ProfileVersion, 'id' | 'number'>;
  onClose: () => void;
  onDone: (version: ProfileVersion) => void;
};

type RetireDialogProps = DialogProps & {
  /** The version that becomes active instead, or null when none does. */
  next: Pick<ProfileVersion, 'number'> | null;
};

// What each decision asks for: one required text (its schema from @keyloom/shared) and the words
// around it. The dialog edits the text as `text` and sends it under the decision's own field name.
const decisions = {
  'sign-off': {
    formName: 'Sign off',
    field: 'comment',
    text: signOffSchema.shape.comment,
    title: (n: number) => `Sign off version ${n}?`,
    description: 'Say how the try-outs went. A supervisor reads your comment before approving the version.',
    label: 'How did the try-outs go?',
    rows: 4,
    submitLabel: 'Sign off',
    busyLabel: 'Signing off…',
    danger: false,
  },
  'report-problem': {
    formName: 'Report a problem',
    field: 'reason',
    text: reportProblemSchema.shape.reason,
    title: (n: number) => `Report a problem with version ${n}?`,
    description: 'The version goes back to the clinician with what you write; it will not be signed off.',
    label: 'What went wrong in the trials?',
    rows: 4,
    submitLabel: 'Report the problem',
    busyLabel: 'Reporting…',
    danger: true,
  },
  approve: {
    formName: 'Approve',
    field: 'comment',
    text: approveSchema.shape.comment,
    title: (n: number) => `Approve version ${n}?`,
    description:
      'It becomes the client’s active profile; the version active until now is retired. The clinical decision rests with the licensed clinician.',
    label: 'Comment for the record',
    rows: 3,
    submitLabel: 'Approve',
    busyLabel: 'Approving…',
    danger: false,
  },
  'send-back': {
    formName: 'Send back',
    field: 'reason',
    text: sendBackSchema.shape.reason,
    title: (n: number) => `Send version ${n} back?`,
    description: 'The clinician sees your reason; a change of settings means training a new version.',
    label: 'What needs to change',
    rows: 3,
    submitLabel: 'Send back',
    busyLabel: 'Sending back…',
    danger: true,
  },
  retire: {
    formName: 'Retire',
    field: 'reason',
    text: retireSchema.shape.reason,
    title: (n: number) => `Retire version ${n}?`,
    description: '',
    label: 'Why is this version retired?',
    rows: 3,
    submitLabel: 'Retire this version',
    busyLabel: 'Retiring…',
    danger: true,
  },
} as const satisfies Record<Decision, { field: string; text: z.ZodType<string>; [key: string]: unknown }>;

/** One decision on a version: a required comment or reason, then the POST; server errors shown in the form. */
const DecisionDialog = <D extends Decision>({
  decision,
  open,
  version,
  onClose,
  onDone,
  description,
}: DialogProps & { decision: D; description?: string }) => {
  const decide = useDecideProfileVersion(decision);
  const words = decisions[decision];
  const schema = z.object({ text: words.text });
  return (
    <Modal
      open={open}
      onClose={onClose}
      title={words.title(version.number)}
      description={description ?? words.description}
    >
      <Form
        schema={schema}
        defaultValues={{ text: '' }}
        aria-label={words.formName}
        errorSummary
        onSubmit={async ({ text }) => {
          const input = { [words.field]: text } as DecisionInputs[D];
          onDone(await decide.mutateAsync({ versionId: version.id, input }));
        }}
      >
        {({ register, formState }) => (
          <div className="flex flex-col gap-5">
            <FormServerError message={formState.errors.root?.server?.message} />
            <TextAreaField
              label={words.label}
              rows={words.rows}
              registration={register('text')}
              error={formState.errors.text}
            />
            <FormActions
              submitLabel={words.submitLabel}
              busyLabel={words.busyLabel}
              submitting={formState.isSubmitting}
              onCancel={onClose}
              {...(words.danger ? { submitVariant: 'danger' as const } : {})}
            />
          </div>
        )}
      </Form>
    </Modal>
  );
};

/** The carer's sign-off after trying the version, with a required comment. */
export const SignOffDialog = (props: DialogProps) => <DecisionDialog decision="sign-off" {...props} />;

/** The carer says what went wrong in the trials instead of signing off; the version goes back. */
export const ReportProblemDialog = (props: DialogProps) => (
  <DecisionDialog decision="report-problem" {...props} />
);

/** The supervisor's approval, with a comment for the record. */
export const ApproveDialog = (props: DialogProps) => <DecisionDialog decision="approve" {...props} />;

/** The supervisor sends a signed-off version back, saying what needs to change. */
export const SendBackDialog = (props: DialogProps) => <DecisionDialog decision="send-back" {...props} />;

/** The supervisor takes the active version out of use, with a reason; the previous one returns. */
export const RetireDialog = ({ next, ...props }: RetireDialogProps) => (
  <DecisionDialog decision="retire" description={retireDescription(props.version, next)} {...props} />
);
