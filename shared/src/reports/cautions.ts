// The cautions Keyloom shows wherever it reports or offers suggestions: the printed reports, their PDFs
// and the test keyboard. One wording, kept here, so every place says the same thing.

/** The cautions, each one sentence or two, in the order they are printed. */
export const reportCautions = [
  'Suggestions are offered, never inserted on their own; the client’s own choice stands.',
  'The test keyboard is for trials; it is not a communication aid for emergencies. Keep the client’s usual means of communication at hand.',
  'Language samples are personal health information: collect them only with consent, keep them in the clinic’s database, and follow local law and the clinic’s policy. Clinical decisions rest with the licensed clinician.',
  'Keystroke savings are not time savings: reading and scanning the list costs time.',
] as const;

/** The heading over the cautions. */
export const REPORT_CAUTIONS_TITLE = 'Please keep in mind';
