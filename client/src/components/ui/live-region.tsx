import { Alert, type AlertTone } from './alert';

export type Announcement = { tone: Exclude<AlertTone, 'info'>; text: string } | null;

/**
 * A polite live region that is always on the page, so screen readers hear each message
 * placed in it without losing their place.
 */
export const LiveRegion = ({ message }: { message: Announcement }) => (
  <div role="status" aria-live="polite" aria-atomic="true">
    {message && (
      <Alert tone={message.tone} className="mb-6">
        {message.text}
      </Alert>
    )}
  </div>
);
