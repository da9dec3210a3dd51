/**
 * A small well-formedness check for the SVG export (node has no DOMParser): every tag is a proper start,
 * end or empty-element tag with quoted attributes, tags nest and balance under one root, and text holds
 * no bare '<' or unescaped '&'.
 */
export function xmlProblems(xml: string): string[] {
  const problems: string[] = [];
  const stack: string[] = [];
  let roots = 0;
  const token = /<\?[\s\S]*?\?>|<!--[\s\S]*?-->|<(\/?)([A-Za-z][\w:.-]*)((?:\s+[\w:.-]+="[^"<]*")*)\s*(\/?)>|<|&(?!(?:amp|lt|gt|quot|apos|#\d+|#x[0-9a-fA-F]+);)/g;
  for (const m of xml.matchAll(token)) {
    const [whole, close, name, , selfClose] = m;
    if (whole === '<') problems.push(`bare '<' at ${m.index}`);
    else if (whole.startsWith('&')) problems.push(`unescaped '&' at ${m.index}`);
    else if (!name) continue; // declaration or comment
    else if (close) {
      const open = stack.pop();
      if (open !== name) problems.push(`</${name}> closes <${open}> at ${m.index}`);
    } else {
      if (stack.length === 0) roots++;
      if (!selfClose) stack.push(name);
    }
  }
  if (stack.length) problems.push(`unclosed: ${stack.join(', ')}`);
  if (roots !== 1) problems.push(`${roots} root elements`);
  return problems;
}
