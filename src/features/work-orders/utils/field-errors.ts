import { useEffect, useRef, useState } from 'react';
import { isApiError } from '@/lib/api-client';
import { showFirstRefused } from '@/lib/show-first-refused';

const FALLBACK = 'Something went wrong. Nothing you typed was lost; try again.';

/**
 * A failed save's messages: per field key ("lines.0.quantity"), and what concerns the whole form. The message for the
 * whole form is left out when the fields say it, unless some of them are not on this form (`marks` lists the keys it
 * can mark): closing a visit may be refused for a click count on the build sheet, further up the page.
 */
export function splitErrors(error: unknown, marks?: readonly string[]): { fields: Record<string, string>; form: string | null } {
  if (!error) return { fields: {}, form: null };
  if (!isApiError(error)) return { fields: {}, form: FALLBACK };
  const fields = Object.fromEntries(Object.entries(error.fieldErrors).map(([k, v]) => [k, v.join(' ')]));
  const allMarked = error.hasFieldErrors && (!marks || Object.keys(fields).every((k) => marks.includes(k)));
  return { fields, form: allMarked ? null : error.message || FALLBACK };
}

/** What to say by the Save button: the form's own message, or, when fields are marked, how many and where. */
export function attentionMessage(form: string | null, fields: number): string | null {
  if (form) return form;
  if (fields === 0) return null;
  return fields === 1 ? 'One value needs attention; it is marked above.' : `${fields} values need attention; they are marked above.`;
}

/**
 * A form whose marked fields may sit far above its Save button (a corner grid on a phone): `refused()` brings the
 * first one into view and gives it the focus, once the marks are drawn.
 */
export function useShowRefused() {
  const formRef = useRef<HTMLFormElement>(null);
  const [times, setTimes] = useState(0);
  useEffect(() => {
    if (times > 0) showFirstRefused(formRef.current);
  }, [times]);
  return { formRef, refused: () => setTimes((n) => n + 1) };
}
