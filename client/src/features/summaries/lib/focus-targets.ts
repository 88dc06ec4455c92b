/** The id of a summary's card in the list (focus lands there once it is sent). */
export const summaryCardId = (summaryId: string) => `summary-${summaryId}`;
