/**
 * Finds where a value sits in JSON text, so a problem found in the parsed value can be reported at its
 * line and column in the file. Assumes text that JSON.parse accepted.
 */
export type JsonPath = readonly (string | number)[];

export interface TextPosition {
  /** 1-based line. */
  line: number;
  /** 1-based column in UTF-16 code units. */
  column: number;
}

/** Offset of the first character of the value at `path` (for a duplicate key, the first one). */
export function valueOffset(text: string, path: JsonPath): number | undefined {
  let i = skipSpace(text, 0);
  for (const key of path) {
    const open = text[i];
    if (open === '{' && typeof key === 'string') {
      i = skipSpace(text, i + 1);
      let found: number | undefined;
      while (text[i] === '"' && found === undefined) {
        const end = stringEnd(text, i);
        const name = JSON.parse(text.slice(i, end)) as string;
        i = skipSpace(text, skipSpace(text, end) + 1); // past ':'
        if (name === key) found = i;
        else i = skipSpace(text, afterValue(text, i) + 1); // past ','
      }
      if (found === undefined) return undefined;
      i = found;
    } else if (open === '[' && typeof key === 'number') {
      i = skipSpace(text, i + 1);
      for (let k = 0; k < key; k++) {
        if (text[i] === ']') return undefined;
        i = skipSpace(text, afterValue(text, i) + 1);
      }
      if (text[i] === ']') return undefined;
    } else {
      return undefined;
    }
  }
  return i;
}

/** Offset in the file of the character at `index` of the decoded JSON string starting at `quote`. */
export function offsetInString(text: string, quote: number, index: number): number {
  let raw = quote + 1;
  for (let k = 0; k < index && raw < text.length; k++) raw += text[raw] === '\\' ? (text[raw + 1] === 'u' ? 6 : 2) : 1;
  return raw;
}

export function positionOf(text: string, offset: number): TextPosition {
  const before = text.slice(0, offset);
  const lastBreak = before.lastIndexOf('\n');
  return { line: before.split('\n').length, column: offset - lastBreak };
}

function skipSpace(text: string, i: number): number {
  while (i < text.length && ' \t\r\n'.includes(text[i])) i++;
  return i;
}

/** Offset just past the closing quote of the string starting at `i`. */
function stringEnd(text: string, i: number): number {
  let j = i + 1;
  while (j < text.length && text[j] !== '"') j += text[j] === '\\' ? 2 : 1;
  return j + 1;
}

/** Offset just past the value starting at `i`, and past any spaces after it. */
function afterValue(text: string, i: number): number {
  const ch = text[i];
  if (ch === '"') return skipSpace(text, stringEnd(text, i));
  if (ch === '{' || ch === '[') {
    let depth = 0;
    let j = i;
    while (j < text.length) {
      const c = text[j];
      if (c === '"') {
        j = stringEnd(text, j);
        continue;
      }
      if (c === '{' || c === '[') depth++;
      if (c === '}' || c === ']') depth--;
      j++;
      if (depth === 0) break;
    }
    return skipSpace(text, j);
  }
  let j = i;
  while (j < text.length && !',]} \t\r\n'.includes(text[j])) j++;
  return skipSpace(text, j);
}
