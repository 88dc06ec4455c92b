/** The pause dialog's choices, in scanning order (their ids are also their dwell targets). */
export const pauseChoices = [
  { id: 'pause-resume', label: 'Resume trial' },
  { id: 'pause-finish', label: 'Finish trial' },
  { id: 'pause-discard', label: 'Discard trial' },
] as const;
export type PauseChoiceId = (typeof pauseChoices)[number]['id'];
