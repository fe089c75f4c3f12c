/**
 * A run number as typed. A minus sign (hyphen, "−" or "–"), a decimal point, an exponent or a letter is
 * refused with a message, never read past: "-3" must not become run 3, nor "1e2" run 100.
 */
export function readRunNumber(text: string): { ok: true; value: number } | { ok: false; error: string } {
  const s = text.trim();
  if (/^[-−–]/.test(s)) return { ok: false, error: 'Run numbers start at 1' };
  const value = Number(s);
  if (!/^\d{1,3}$/.test(s) || value < 1) return { ok: false, error: 'Run numbers are whole numbers from 1 to 999' };
  return { ok: true, value };
}
