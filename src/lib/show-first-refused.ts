/** The first marked field of a form gets the focus and comes into view: on a phone it may sit under the Save bar. */
export function showFirstRefused(form: HTMLFormElement | null): void {
  requestAnimationFrame(() => {
    const first = form?.querySelector<HTMLElement>('[aria-invalid="true"]');
    first?.focus();
    first?.scrollIntoView?.({ block: 'center' });
  });
}
