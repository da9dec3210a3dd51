import { describe, expect, it } from 'vitest';
import { escapeXml } from '../../../src/ui/plot';
import { xmlProblems } from './xml-check';

describe('escapeXml', () => {
  it('escapes markup characters and drops characters XML 1.0 forbids', () => {
    expect(escapeXml(`a<b>&"'`)).toBe('a&lt;b&gt;&amp;&quot;&#39;');
    expect(escapeXml('bell\u0007 tab\t')).toBe('bell tab\t');
    expect(escapeXml('lone \uD800 surrogate')).toBe('lone \uFFFD surrogate');
    expect(escapeXml('pair \uD83D\uDE00')).toBe('pair \uD83D\uDE00');
  });
});

describe('xmlProblems (the checker itself)', () => {
  it('finds unbalanced tags, bare < and raw &', () => {
    expect(xmlProblems('<svg><g></svg>')).not.toEqual([]);
    expect(xmlProblems('<svg><text>a < b</text></svg>')).toEqual(["bare '<' at 13"]);
    expect(xmlProblems('<svg><text>a & b</text></svg>')).toEqual(["unescaped '&' at 13"]);
    expect(xmlProblems('<svg/><svg/>')).toEqual(['2 root elements']);
    expect(xmlProblems('<svg><g a="1"/></svg>')).toEqual([]);
  });
});
