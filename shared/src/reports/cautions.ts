// The cautions Keyloom shows wherever it reports or offers suggestions: the printed reports, their PDFs
// and the test keyboard. One wording, kept here, so every place says the same thing.

/** Each caution by what it is about, so a page can show the ones that apply. */
export const cautions = {
  offeredNotInserted: 'Suggestions are offered, never inserted on their own; the client’s own choice stands.',
  notForEmergencies:
    'The test keyboard is for trials; it is not a communication aid for emergencies. Keep the client’s usual means of communication at hand.',
  personalData:
    'Language samples are personal health information: collect them only with consent, keep them in the clinic’s database, and follow local law and the clinic’s policy. Clinical decisions rest with the licensed clinician.',
  notTimeSavings: 'Keystroke savings are not time savings: reading and scanning the list costs time.',
} as const;

/** The cautions, each one sentence or two, in the order they are printed. */
export const reportCautions = [
  cautions.offeredNotInserted,
  cautions.notForEmergencies,
  cautions.personalData,
  cautions.notTimeSavings,
] as const;

/** The heading over the cautions. */
export const REPORT_CAUTIONS_TITLE = 'Please keep in mind';
