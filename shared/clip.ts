/**
 * A piece of someone's input quoted back in a message, cut to a few dozen
 * characters with an ellipsis, so that no answer repeats an unbounded part
 * of what was sent (a 200 MB header cell is quoted as its first 40 characters).
 */
export const CLIP_LENGTH = 40;

export function clip(text: string, max = CLIP_LENGTH): string {
  if (text.length <= max) return text;
  // do not cut a surrogate pair in two
  let end = max - 1;
  const last = text.charCodeAt(end - 1);
  if (last >= 0xd800 && last <= 0xdbff) end--;
  return `${text.slice(0, end)}…`;
}
