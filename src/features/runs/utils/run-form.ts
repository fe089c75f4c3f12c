/**
 * A run form's messages by field, named as the server names them in its fieldErrors ("rawTimeSec", "runNumber",
 * "hotPressuresKpa.lf"; "_" for the run as a whole), so that the phone's own checks and a refused upload mark the
 * same fields the same way.
 */
export type RunFormErrors = Partial<Record<string, string>>;

/** Is anything marked? A cleared field's message is left as undefined. */
export const anyRefused = (errors: RunFormErrors) => Object.values(errors).some(Boolean);

/** The first marked field gets the focus and comes into view: on a phone it may sit under the Save bar. */
export function showFirstRefused(form: HTMLFormElement | null): void {
  requestAnimationFrame(() => {
    const first = form?.querySelector<HTMLElement>('[aria-invalid="true"]');
    first?.focus();
    first?.scrollIntoView?.({ block: 'center' });
  });
}
