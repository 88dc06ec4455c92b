/** One refused field: its name in the form, the words of its label, what is wrong, and its control. */
export type ErrorSummaryEntry = { name: string; label: string; message: string; control: HTMLElement };

const controlsOf = (form: HTMLFormElement, name: string): HTMLElement[] =>
  Array.from(form.elements).filter(
    (element): element is HTMLElement =>
      element instanceof HTMLElement && element.getAttribute('name') === name,
  );

/** The control a summary link moves to: the first of its name that can take focus (a box may be switched off). */
const controlOf = (form: HTMLFormElement, name: string): HTMLElement | undefined => {
  const controls = controlsOf(form, name);
  return controls.find((control) => !control.matches(':disabled')) ?? controls[0];
};

/**
 * The visible words that name a control: its fieldset's legend for a group of boxes, else the
 * elements it is labelled by (a label that also holds a hint), else its label.
 */
const labelOf = (control: HTMLElement): string => {
  const grouped =
    control instanceof HTMLInputElement && (control.type === 'radio' || control.type === 'checkbox');
  const legend = grouped ? control.closest('fieldset')?.querySelector('legend') : null;
  if (legend?.textContent) return legend.textContent.trim();
  const labelledBy = (control.getAttribute('aria-labelledby') ?? '')
    .split(/\s+/)
    .map((id) => control.ownerDocument.getElementById(id)?.textContent?.trim() ?? '')
    .filter(Boolean)
    .join(' ');
  if (labelledBy) return labelledBy;
  const labels = 'labels' in control ? (control as HTMLInputElement).labels : null;
  return labels?.[0]?.textContent?.trim() ?? control.getAttribute('aria-label') ?? '';
};

/** The refused fields in the order they stand in the form (errors of fields not on screen are left out). */
export const errorSummaryEntries = (
  form: HTMLFormElement,
  errors: ReadonlyArray<{ name: string; message: string }>,
): ErrorSummaryEntry[] =>
  errors
    .map((error) => ({ ...error, control: controlOf(form, error.name) }))
    .filter((error): error is typeof error & { control: HTMLElement } => error.control !== undefined)
    .sort((a, b) =>
      a.control.compareDocumentPosition(b.control) & Node.DOCUMENT_POSITION_FOLLOWING ? -1 : 1,
    )
    .map(({ name, message, control }) => ({ name, message, control, label: labelOf(control) || name }));
