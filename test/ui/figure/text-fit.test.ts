import { describe, expect, it } from 'vitest';
import { ELLIPSIS, ellipsize, wrapText } from '../../../src/ui/plot';

/** A fixed advance of 7 px per code point, so widths can be worked by hand. */
const mono = (t: string) => Array.from(t).length * 7;

describe('ellipsize', () => {
  it('keeps text that fits and shortens text that does not, the ellipsis included in the width', () => {
    expect(ellipsize('Adam lr=0.01', 84, mono)).toBe('Adam lr=0.01'); // 12 chars = 84 px
    // 70 px holds 10 characters: 9 of the text and the ellipsis.
    expect(ellipsize('Heavy-ball momentum lr=0.01', 70, mono)).toBe(`Heavy-bal${ELLIPSIS}`);
    expect(mono(ellipsize('Heavy-ball momentum lr=0.01', 70, mono))).toBeLessThanOrEqual(70);
  });

  it('drops trailing spaces before the ellipsis and gives the ellipsis alone when nothing else fits', () => {
    expect(ellipsize('Plain descent', 49, mono)).toBe(`Plain${ELLIPSIS}`); // "Plain " would be 6 + 1 chars
    expect(ellipsize('Momentum', 5, mono)).toBe(ELLIPSIS);
  });

  it('never splits a surrogate pair', () => {
    const s = ellipsize('\u{1D4B3}\u{1D4B4}\u{1D4B5}\u{1D4B6}', 21, mono);
    expect(Array.from(s)).toEqual(['\u{1D4B3}', '\u{1D4B4}', ELLIPSIS]);
  });
});

describe('wrapText', () => {
  // A data-fit title as describe.ts builds it, with an imported file of a long name.
  const title = 'Linear regression of response on dose (mean squared error) - reservoir-outflow-probe-calibration-second-field-season.csv (L2 0.1, standardised inputs)';

  it('wraps at spaces, every line within the width', () => {
    const lines = wrapText('one two three four five', 70, mono, 3); // 10 chars per line
    expect(lines).toEqual(['one two', 'three four', 'five']);
  });

  it('ends the last allowed line with an ellipsis when words are left over', () => {
    const lines = wrapText(title, 420, mono, 2); // 60 characters per line
    expect(lines).toHaveLength(2);
    expect(lines[0]).toBe('Linear regression of response on dose (mean squared error) -');
    expect(lines[1].endsWith(ELLIPSIS)).toBe(true);
    expect(lines[1].startsWith('reservoir-outflow')).toBe(true);
    for (const line of lines) expect(mono(line)).toBeLessThanOrEqual(420);
  });

  it('shortens a single word longer than the line', () => {
    expect(wrapText('reservoir-outflow-probe-calibration.csv', 70, mono, 2)).toEqual([`reservoir${ELLIPSIS}`]);
    expect(wrapText('a reservoir-outflow-probe-calibration.csv b', 70, mono, 3)).toEqual(['a', `reservoir${ELLIPSIS}`, 'b']);
  });

  it('returns the whole text on one line when it fits, and nothing for empty text', () => {
    expect(wrapText('Rosenbrock', 400, mono, 2)).toEqual(['Rosenbrock']);
    expect(wrapText('   ', 400, mono, 2)).toEqual([]);
  });
});
