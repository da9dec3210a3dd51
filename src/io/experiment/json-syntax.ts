/**
 * Where JSON text first goes wrong and why, for text JSON.parse refused (its messages do not always
 * give a position). A strict RFC 8259 recogniser: no comments, no trailing commas, no single quotes.
 */
export interface JsonSyntaxError {
  offset: number;
  message: string;
}

const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
const STRING = /"(?:[^"\\\u0000-\u001f]|\\["\\/bfnrt]|\\u[0-9a-fA-F]{4})*"/y;

export function jsonSyntaxError(text: string): JsonSyntaxError | null {
  let i = 0;
  const space = () => {
    while (i < text.length && ' \t\r\n'.includes(text[i])) i++;
  };
  const fail = (message: string): never => {
    throw { offset: i, message: i >= text.length ? `unexpected end of the text (${message})` : `${message}, found ${JSON.stringify(text[i])}` };
  };
  const match = (re: RegExp): boolean => {
    re.lastIndex = i;
    const m = re.exec(text);
    if (m) i += m[0].length;
    return m !== null;
  };
  const value = (): void => {
    space();
    const ch = text[i];
    if (ch === '{') {
      i++;
      space();
      if (text[i] === '}') return void i++;
      for (;;) {
        space();
        if (text[i] !== '"' || !match(STRING)) fail('expected a field name in double quotes');
        space();
        if (text[i] !== ':') fail("expected ':' after a field name");
        i++;
        value();
        space();
        if (text[i] === ',') i++;
        else if (text[i] === '}') return void i++;
        else fail("expected ',' or '}' after a field's value");
      }
    }
    if (ch === '[') {
      i++;
      space();
      if (text[i] === ']') return void i++;
      for (;;) {
        value();
        space();
        if (text[i] === ',') i++;
        else if (text[i] === ']') return void i++;
        else fail("expected ',' or ']' after a list item");
      }
    }
    if (ch === '"') return void (match(STRING) || fail('a string that is not closed or has a bad escape'));
    if (text.startsWith('true', i) || text.startsWith('null', i)) return void (i += 4);
    if (text.startsWith('false', i)) return void (i += 5);
    if (!match(NUMBER)) fail('expected a value (object, list, string, number, true, false or null)');
  };
  try {
    value();
    space();
    if (i < text.length) fail('expected the end of the text after the value');
    return null;
  } catch (e) {
    return e as JsonSyntaxError;
  }
}
