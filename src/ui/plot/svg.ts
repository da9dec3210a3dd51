/**
 * Text for SVG documents: escaping of user-typed text (run labels, titles, axis names) for XML content
 * and attribute values. The figure exports write SVG through src/ui/figure/svg-context.ts.
 */

/** Escapes text for XML content and attribute values; drops characters XML 1.0 does not allow. */
export function escapeXml(text: string): string {
  return text
    .replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g, '')
    .replace(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, '\uFFFD')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}
