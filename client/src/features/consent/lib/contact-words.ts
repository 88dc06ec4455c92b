import type { Contact } from '@keyloom/shared';

/** What deleting a contact removes and what it keeps, then the choice (Cancel first). */
export const deleteContactWords = (contact: Contact): string =>
  `${contact.name}’s name, relationship and address (${contact.email}) are removed from this client. ` +
  'Summaries already sent to them keep their record of who got what. ' +
  (contact.unsubscribedAt
    ? 'The address stays stopped: adding it again will not send summaries until the family consents anew.'
    : 'No summary will be sent to them any more.');
