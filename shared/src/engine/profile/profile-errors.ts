// Errors the profile pipeline throws on purpose; anything else is a fault.

/** The input cannot make a profile (too little text, settings out of range). The message is meant for the clinician. */
export class ProfileInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ProfileInputError';
  }
}

/** `shouldCancel()` answered true; nothing was returned or saved. */
export class CancelledError extends Error {
  constructor(message = 'profile training was cancelled') {
    super(message);
    this.name = 'CancelledError';
  }
}
