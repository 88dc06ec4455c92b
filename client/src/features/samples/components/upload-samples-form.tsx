import { sampleLimits, uploadSamplesFieldsSchema } from '@keyloom/shared';
import { type DragEvent, useId, useState } from 'react';
import { z } from 'zod';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { FieldError } from '@/components/ui/field-message';
import { Form, FormServerError } from '@/components/ui/form';
import { TextField } from '@/components/ui/text-field';
import { cn } from '@/lib/cn';
import { useUploadSamples } from '../api/upload-samples';
import { SampleMetaFields } from './sample-meta-fields';

type FileState = 'waiting' | 'sending' | 'stored' | 'duplicate' | 'refused';

export type FileProgress = { key: string; file: File; state: FileState; message: string };

const stateWords: Record<FileState, { label: string; tone: BadgeTone }> = {
  waiting: { label: 'Ready to upload', tone: 'neutral' },
  sending: { label: 'Uploading…', tone: 'neutral' },
  stored: { label: 'Stored', tone: 'good' },
  duplicate: { label: 'Already uploaded', tone: 'warn' },
  refused: { label: 'Refused', tone: 'bad' },
};

const isCsv = (file: File) => file.name.toLowerCase().endsWith('.csv');
const megabytes = (bytes: number) => `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
const fileSize = (bytes: number) =>
  bytes < 1024 * 1024 ? `${Math.max(1, Math.ceil(bytes / 1024))} KB` : megabytes(bytes);

/** Checks the browser can make before sending: size per file. */
const checkLocally = (file: File): string | null =>
  file.size === 0
    ? 'The file is empty. Choose a file that has the client’s writing in it.'
    : file.size > sampleLimits.maxFileBytes
      ? `The file is ${megabytes(file.size)}; the limit is ${megabytes(sampleLimits.maxFileBytes)} per file. Split it into smaller files.`
      : null;

const NO_FILES = 'Choose at least one file to upload.';

// The shared fields plus the number of files waiting, so that "no file chosen" is refused like any
// other field (listed at the top of the form, linked to the file picker).
const uploadFormSchema = uploadSamplesFieldsSchema.and(
  z.object({ fileCount: z.number().int().min(1, { error: NO_FILES }) }),
);

type UploadSamplesFormProps = {
  clientId: string;
  onFinished: (stored: number, problems: number) => void;
};

/**
 * Drop zone and file picker in one (the native file input stays keyboard-operable); each file
 * is sent on its own so one refused file never holds the others back, and its answer shows beside it.
 */
export const UploadSamplesForm = ({ clientId, onFinished }: UploadSamplesFormProps) => {
  const inputId = useId();
  const [files, setFiles] = useState<FileProgress[]>([]);
  const [dragging, setDragging] = useState(false);
  const [filesError, setFilesError] = useState<string | null>(null);
  const upload = useUploadSamples();

  const addFiles = (list: FileList | null) => {
    if (!list || list.length === 0) return;
    setFilesError(null);
    const added = [...list].map((file, index) => ({
      key: `${file.name}-${file.size}-${file.lastModified}-${Date.now()}-${index}`,
      file,
      state: 'waiting' as const,
      message: checkLocally(file) ?? '',
    }));
    setFiles((current) => {
      const next = [...current.filter((entry) => entry.state === 'waiting'), ...added];
      if (next.length > sampleLimits.maxFiles) {
        setFilesError(`Choose at most ${sampleLimits.maxFiles} files at a time; upload the rest afterwards.`);
        return next.slice(0, sampleLimits.maxFiles);
      }
      return next;
    });
  };

  const setState = (key: string, state: FileState, message = '') =>
    setFiles((current) => current.map((entry) => (entry.key === key ? { ...entry, state, message } : entry)));

  const onDrop = (event: DragEvent<HTMLLabelElement>) => {
    event.preventDefault();
    setDragging(false);
    addFiles(event.dataTransfer.files);
  };

  const waiting = files.filter((entry) => entry.state === 'waiting');
  const hasCsv = waiting.some((entry) => isCsv(entry.file));

  return (
    <Form
      schema={uploadFormSchema}
      defaultValues={{
        sourceKind: 'messages',
        periodStart: null,
        periodEnd: null,
        note: '',
        csvColumn: '',
        fileCount: 0,
      }}
      // The CSV column is shown only while a CSV file is waiting: otherwise it is cleared before the
      // check, so a leftover value can never block the upload.
      prepare={(values) => ({
        ...values,
        csvColumn: hasCsv ? values.csvColumn : '',
        fileCount: waiting.length,
      })}
      errorSummary
      // `fields` carries fileCount too; only its text fields are sent.
      onSubmit={async (fields) => {
        const queue = waiting;
        let stored = 0;
        let problems = 0;
        for (const entry of queue) {
          const local = checkLocally(entry.file);
          if (local) {
            setState(entry.key, 'refused', local);
            problems += 1;
            continue;
          }
          setState(entry.key, 'sending');
          try {
            const result = await upload.mutateAsync({
              clientId,
              files: [entry.file],
              // The column only means something for a CSV file.
              fields: { ...fields, csvColumn: isCsv(entry.file) ? fields.csvColumn : null },
            });
            const duplicate = result.duplicates[0];
            if (duplicate) {
              setState(entry.key, 'duplicate', duplicate.message);
              problems += 1;
            } else {
              setState(entry.key, 'stored', `Stored as “${result.samples[0]?.title ?? entry.file.name}”.`);
              stored += 1;
            }
          } catch (caught) {
            setState(
              entry.key,
              'refused',
              caught instanceof Error ? caught.message : 'The file was not stored.',
            );
            problems += 1;
          }
        }
        onFinished(stored, problems);
      }}
      aria-label="Upload files"
    >
      {({ register, formState }) => {
        // "No file chosen" holds only until a file is chosen (the picker is not a registered field).
        const noFiles = waiting.length === 0 ? formState.errors.fileCount?.message : undefined;
        const filesMessage = noFiles ?? filesError;
        return (
          <>
            <FormServerError message={formState.errors.root?.server?.message} />
            <div className="flex flex-col gap-5">
              <div className="flex flex-col gap-2">
                <input
                  id={inputId}
                  // The name ties a refused "no file" to this picker in the list of what needs attention.
                  name="fileCount"
                  type="file"
                  multiple
                  accept=".txt,.md,.csv,text/plain,text/markdown,text/csv"
                  aria-labelledby={`${inputId}-label`}
                  aria-describedby={`${inputId}-hint${filesMessage ? ` ${inputId}-error` : ''}`}
                  aria-invalid={noFiles ? true : undefined}
                  className="peer sr-only"
                  onChange={(event) => {
                    addFiles(event.target.files);
                    // Choosing the same file again must fire onChange again.
                    event.target.value = '';
                  }}
                />
                <label
                  htmlFor={inputId}
                  onDragOver={(event) => {
                    event.preventDefault();
                    setDragging(true);
                  }}
                  onDragLeave={() => setDragging(false)}
                  onDrop={onDrop}
                  className={cn(
                    'flex cursor-pointer flex-col items-center gap-2 rounded-xl border-4 border-dashed px-4 py-8 text-center',
                    'peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-rust',
                    dragging
                      ? 'border-ink bg-saffron-light'
                      : 'border-field-border bg-surface hover:bg-paper-deep',
                  )}
                >
                  <span id={`${inputId}-label`} className="text-lg font-bold">
                    Choose files, or drop them here
                  </span>
                  <span id={`${inputId}-hint`} className="text-ink-soft">
                    Plain text (.txt, .md) in UTF-8 or UTF-16, or .csv with one column of text. Up to{' '}
                    {sampleLimits.maxFiles} files, {megabytes(sampleLimits.maxFileBytes)} each.
                  </span>
                </label>
                {filesMessage && <FieldError id={`${inputId}-error`}>{filesMessage}</FieldError>}
              </div>

              {files.length > 0 && (
                <ul aria-label="Chosen files" className="flex flex-col gap-2">
                  {files.map((entry) => {
                    const words =
                      stateWords[entry.message && entry.state === 'waiting' ? 'refused' : entry.state];
                    return (
                      <li
                        key={entry.key}
                        className="flex flex-col gap-1 rounded-lg border-2 border-thread bg-surface p-3"
                      >
                        <div className="flex flex-wrap items-center gap-3">
                          <span className="font-bold break-all">{entry.file.name}</span>
                          <span className="text-ink-soft">{fileSize(entry.file.size)}</span>
                          <Badge tone={words.tone}>
                            {entry.message && entry.state === 'waiting' ? 'Will be refused' : words.label}
                          </Badge>
                          {entry.state === 'waiting' && (
                            <Button
                              variant="quiet"
                              onClick={() =>
                                setFiles((current) => current.filter((other) => other.key !== entry.key))
                              }
                              aria-label={`Remove ${entry.file.name} from the list`}
                            >
                              Remove
                            </Button>
                          )}
                        </div>
                        {entry.message && (
                          <p className={cn(entry.state === 'stored' ? 'text-ink' : 'font-bold text-danger')}>
                            {entry.message}
                          </p>
                        )}
                      </li>
                    );
                  })}
                </ul>
              )}
              {hasCsv && (
                <TextField
                  label="CSV column with the text"
                  autoComplete="off"
                  spellCheck={false}
                  hint="The header of the column that holds the client’s writing, e.g. message. Other columns are ignored."
                  registration={register('csvColumn')}
                  error={formState.errors.csvColumn}
                />
              )}
              <SampleMetaFields register={register} errors={formState.errors} />
              <div>
                <Button type="submit" variant="primary" disabled={formState.isSubmitting}>
                  {formState.isSubmitting ? 'Uploading…' : 'Upload files'}
                </Button>
              </div>
            </div>
          </>
        );
      }}
    </Form>
  );
};
