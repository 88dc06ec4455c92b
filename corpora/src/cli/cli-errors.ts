// Errors the command line reports as one line with exit code 2: bad
// arguments, unreadable or non-text input. Anything else exits with 1.
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}
