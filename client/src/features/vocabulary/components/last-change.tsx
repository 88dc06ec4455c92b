import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import type { ChangeOrigin, VocabularyEditor } from './use-vocabulary-editor';

type LastChangeProps = {
  editor: VocabularyEditor;
  origin: ChangeOrigin;
  /** Where focus goes once the Undo button has gone (the section's heading). */
  onUndone: () => void;
};

/** A polite status line in a section: what was just saved there, with Undo; or why Undo failed. */
export const LastChange = ({ editor, origin, onUndone }: LastChangeProps) => {
  const [error, setError] = useState<string | null>(null);
  const last = editor.lastChange?.origin === origin ? editor.lastChange : null;
  return (
    <div role="status" aria-live="polite" aria-atomic="true">
      {last && (
        <Alert tone="success" className="flex flex-wrap items-center gap-4">
          <span>{last.text}</span>
          <Button
            disabled={editor.saving}
            onClick={() => {
              setError(null);
              editor
                .undo()
                .then(onUndone, (reason: unknown) =>
                  setError(reason instanceof Error ? reason.message : 'The change could not be undone.'),
                );
            }}
          >
            Undo
          </Button>
        </Alert>
      )}
      {!last && error && <Alert tone="error">{error}</Alert>}
    </div>
  );
};
