import type { ClientSummary } from '@keyloom/shared';
import { type FormEvent, useId, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { fieldClasses } from '@/components/ui/field-classes';
import { useCarersAvailable } from '../api/get-carers-available';
import { useCreateAssignment } from '../api/create-assignment';
import { useDeleteAssignment } from '../api/delete-assignment';

type CarerAssignmentsProps = {
  client: Pick<ClientSummary, 'id' | 'pseudonym' | 'carers'>;
  /** Owning clinician or admin: may assign and remove. */
  canManage: boolean;
  onChanged: (message: string) => void;
};

/** The carers assigned to a client; assign and remove controls for those allowed. */
export const CarerAssignments = ({ client, canManage, onChanged }: CarerAssignmentsProps) => {
  const pickerId = useId();
  const headingId = useId();
  const [choice, setChoice] = useState('');
  const [error, setError] = useState<string | null>(null);
  const available = useCarersAvailable(client.id, canManage);
  const assign = useCreateAssignment();
  const remove = useDeleteAssignment();
  const assignedIds = new Set(client.carers.map((carer) => carer.id));
  const choices = (available.data ?? []).filter((carer) => !assignedIds.has(carer.id));

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    setError(null);
    const carer = choices.find((option) => option.id === choice);
    if (!carer) {
      setError('Choose a carer to assign.');
      return;
    }
    try {
      await assign.mutateAsync({ clientId: client.id, userId: carer.id });
      setChoice('');
      onChanged(`${carer.name} is now assigned to ${client.pseudonym}.`);
    } catch (caught) {
      setError(caught instanceof Error ? caught.message : 'The carer was not assigned. Try again.');
    }
  };

  const unassign = async (carer: { id: string; name: string }) => {
    setError(null);
    try {
      await remove.mutateAsync({ clientId: client.id, userId: carer.id });
      onChanged(`${carer.name} is no longer assigned to ${client.pseudonym}.`);
    } catch (caught) {
      setError(caught instanceof Error ? caught.message : 'The carer was not removed. Try again.');
    }
  };

  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-3">
      <h3 id={headingId} className="text-lg font-bold">
        Carers for {client.pseudonym}
      </h3>
      {client.carers.length === 0 ? (
        <p className="text-ink-soft">No carer is assigned yet.</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {client.carers.map((carer) => (
            <li key={carer.id} className="flex flex-wrap items-center gap-3">
              <span>{carer.name}</span>
              {canManage && (
                <Button
                  variant="quiet"
                  onClick={() => void unassign(carer)}
                  disabled={remove.isPending}
                  aria-label={`Remove ${carer.name} from ${client.pseudonym}`}
                >
                  Remove
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
      <div role="alert">{error && <Alert tone="error">{error}</Alert>}</div>
      {canManage && (
        <form onSubmit={(event) => void submit(event)} className="flex flex-wrap items-end gap-3" noValidate>
          <div className="flex min-w-56 flex-col gap-1">
            <label htmlFor={pickerId} className="font-bold">
              Carer to assign to {client.pseudonym}
            </label>
            <select
              id={pickerId}
              value={choice}
              onChange={(event) => setChoice(event.target.value)}
              className={fieldClasses(false)}
            >
              <option value="">
                {available.isPending
                  ? 'Loading carers…'
                  : choices.length
                    ? 'Choose a carer'
                    : 'No other active carers'}
              </option>
              {choices.map((carer) => (
                <option key={carer.id} value={carer.id}>
                  {carer.name}
                </option>
              ))}
            </select>
          </div>
          <Button type="submit" disabled={assign.isPending}>
            Assign carer
          </Button>
        </form>
      )}
    </section>
  );
};
