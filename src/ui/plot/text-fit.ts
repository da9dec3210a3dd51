/**
 * Fitting text into a width: shorten with an ellipsis, or wrap at spaces into a few lines with the
 * last one shortened. Pure functions over a width measure, so the figure layout, the map's title
 * plates and the tests share them (the tests measure with a fixed advance per character).
 */

/** Width of `text` in pixels (one font fixed by the caller). */
export type WidthOf = (text: string) => number;

export const ELLIPSIS = '\u2026';

/**
 * `text` if it fits in `width`, else its longest prefix (cut at a code point, trailing spaces
 * dropped) followed by an ellipsis that fits; the ellipsis alone when even one character does not.
 */
export function ellipsize(text: string, width: number, widthOf: WidthOf): string {
  if (widthOf(text) <= width) return text;
  const chars = Array.from(text);
  // Binary search for the longest prefix p with widthOf(p + ELLIPSIS) <= width.
  let lo = 0;
  let hi = chars.length;
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (widthOf(chars.slice(0, mid).join('').trimEnd() + ELLIPSIS) <= width) lo = mid;
    else hi = mid - 1;
  }
  return chars.slice(0, lo).join('').trimEnd() + ELLIPSIS;
}

/**
 * Wraps `text` at spaces into at most `maxLines` lines no wider than `width`. A word wider than the
 * width is shortened on its own line; if the text needs more lines, the last line ends with an
 * ellipsis. Every returned line fits the width (given a measure that is monotone in length).
 */
export function wrapText(text: string, width: number, widthOf: WidthOf, maxLines: number): string[] {
  const words = text.split(/\s+/).filter(Boolean);
  if (!words.length || maxLines < 1) return [];
  const lines: string[] = [];
  let line = '';
  let next = 0;
  while (next < words.length) {
    const candidate = line ? `${line} ${words[next]}` : words[next];
    if (widthOf(candidate) <= width) {
      line = candidate;
      next++;
      continue;
    }
    if (!line) line = ellipsize(words[next++], width, widthOf); // a word wider than the line
    lines.push(line);
    line = '';
    if (lines.length === maxLines) break;
  }
  if (line) lines.push(line);
  if (next < words.length) {
    // Words are left over: the last line runs on into them and ends with an ellipsis.
    const last = lines[lines.length - 1];
    if (!last.endsWith(ELLIPSIS)) lines[lines.length - 1] = ellipsize(`${last} ${words.slice(next).join(' ')}`, width, widthOf);
  }
  return lines;
}
