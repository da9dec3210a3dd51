import { describe, expect, it } from 'vitest';
import { formatConstants, parseConstants } from '../../../src/ui/surface/constants-text';

describe('named constants typed as text', () => {
  it('reads commas or semicolons and any spacing, and formats back', () => {
    expect(parseConstants('a = 1, b = 2')).toEqual({ a: 1, b: 2 });
    expect(parseConstants(' a=1;b =-2.5e3 ,')).toEqual({ a: 1, b: -2500 });
    expect(formatConstants({ a: 1, b: 2 })).toBe('a = 1, b = 2');
  });

  it('names that a plain object already has are ordinary names', () => {
    const c = parseConstants('constructor = 1, __proto__ = 3, toString = 2') as Record<string, number>;
    expect(Object.entries(c)).toEqual([['constructor', 1], ['__proto__', 3], ['toString', 2]]);
  });

  it('says what is wrong with a part', () => {
    expect(parseConstants('a =')).toBe('named constants: "a =" should look like name = number');
    expect(parseConstants('a = 1x')).toBe('named constants: the value of a must be a finite number, got "1x"');
    expect(parseConstants('a = 1, a = 2')).toBe('named constants: a is given twice');
  });
});
