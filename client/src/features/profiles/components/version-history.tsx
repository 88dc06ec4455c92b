import { type ProfileVersion, profileVersionStatusLabels } from '@keyloom/shared';
import { formatDateTime } from '@/lib/format';

/** Each step of a version's path, oldest first: status, when, who and what they said. */
export const VersionHistory = ({ history }: { history: ProfileVersion['history'] }) =>
  history.length === 0 ? (
    <p>No steps recorded yet.</p>
  ) : (
    <ol aria-label="History" className="flex flex-col gap-3 border-l-4 border-thread pl-5">
      {history.map((event, index) => (
        <li key={`${event.at}-${index}`}>
          <p className="font-bold">
            {profileVersionStatusLabels[event.status]}{' '}
            <span className="font-normal text-ink-soft">
              {formatDateTime(event.at)}
              {event.by ? ` · ${event.by}` : ''}
            </span>
          </p>
          {event.comment && <p className="max-w-3xl">“{event.comment}”</p>}
        </li>
      ))}
    </ol>
  );
