import { format } from 'd3';

/**
 * A readable label for a loss value: the fewest significant digits (up to 12) that give the value back,
 * plain decimals for 1e-4 <= |v| < 1e6, exponent form otherwise. Hyphen-minus for negatives. Shared by
 * the page's labels and the results CSV (its nearest_minimum column), so both write the same text.
 */
export function formatValue(v: number): string {
  if (v === 0) return '0';
  if (!Number.isFinite(v)) return String(v);
  let p = 1;
  while (p < 12 && Number(v.toPrecision(p)) !== v) p++;
  const m = Math.abs(v);
  return asciiMinus(formatOf(m >= 1e-4 && m < 1e6 ? `.${p}~r` : `.${Math.max(0, p - 1)}~e`)(v));
}

/** d3 formatters by specifier (at most 24 of them), so a table of numbers parses each specifier once. */
const FORMATTERS = new Map<string, (v: number) => string>();
function formatOf(specifier: string): (v: number) => string {
  let f = FORMATTERS.get(specifier);
  if (!f) FORMATTERS.set(specifier, (f = format(specifier)));
  return f;
}

/** d3-format writes the Unicode minus sign; labels use the ASCII hyphen-minus so they parse as numbers. */
export function asciiMinus(label: string): string {
  return label.replace(/\u2212/g, '-');
}
