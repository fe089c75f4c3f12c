export type TextPart = { kind: 'text'; text: string } | { kind: 'link'; text: string; path: string };

const URL_PATTERN = /https?:\/\/[^\s<>"']+/g;
/** Punctuation that ends a sentence rather than the address ("…/reset?token=abc."). */
const TRAILING = /[.,;:!?)\]]+$/;

/**
 * Splits a plain-text e-mail into text and links. Only addresses on this app's own origin become
 * links (as in-app paths); anything else stays text, so a caught e-mail cannot send the developer elsewhere.
 */
export function linkifyOwnOrigin(text: string, origin: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const url = match[0].replace(TRAILING, '');
    const start = match.index;
    const rest = url.slice(origin.length);
    if (!url.startsWith(origin) || (rest !== '' && !/^[/?#]/.test(rest))) continue;
    if (start > last) parts.push({ kind: 'text', text: text.slice(last, start) });
    parts.push({ kind: 'link', text: url, path: rest.startsWith('/') ? rest : `/${rest}` });
    last = start + url.length;
  }
  if (last < text.length) parts.push({ kind: 'text', text: text.slice(last) });
  return parts;
}
