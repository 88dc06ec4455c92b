import { Alert } from './alert';
import { Button } from './button';

type LoadErrorProps = {
  /** What could not be loaded, e.g. "The client list could not be loaded." */
  title: string;
  error: Error;
  onRetry: () => void;
};

/** A failed load, announced at once, with the server's words and a way to try again. */
export const LoadError = ({ title, error, onRetry }: LoadErrorProps) => (
  <div role="alert">
    <Alert tone="error" title={title}>
      <p>{error.message}</p>
      <Button className="mt-3" onClick={onRetry}>
        Try again
      </Button>
    </Alert>
  </div>
);
