/** The longest setup label (the setup schemas' limit). */
export const SETUP_LABEL_MAX = 80;

/**
 * Text shortened to at most `max` characters at the end of a whole word, with an ellipsis when anything was cut, so a
 * label never ends in half a word ("…set ride height and alig…"). Runs of white space become one space. A single word
 * longer than half the room is cut inside it rather than leaving almost nothing.
 */
export function shortenAtWord(text: string, max: number): string {
  const clean = text.replace(/\s+/g, ' ').trim();
  if (clean.length <= max) return clean;
  const room = clean.slice(0, max - 1);
  // The room may end exactly on a word's end; otherwise back to the last space in it.
  const lastSpace = clean[max - 1] === ' ' ? room.length : room.lastIndexOf(' ');
  const kept = lastSpace >= max / 2 ? room.slice(0, lastSpace) : room;
  // No dangling comma, dash or colon before the ellipsis.
  return `${kept.replace(/[\s,;:.\-–—]+$/u, '')}…`;
}

/** The label of the setup a closed visit writes when staff give none: "<shop>: <requested work>", shortened. */
export const handoverLabel = (shopName: string, requestedWork: string): string =>
  shortenAtWord(`${shopName}: ${requestedWork}`, SETUP_LABEL_MAX);
