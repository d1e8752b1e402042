import { describe, expect, it } from 'vitest';
import { CROP_LIBRARY } from '#shared/crops/library';
import { sourceInPlainWords } from '#shared/crops/source-words';

describe('crop sources in plain words', () => {
  it('when a library source carries internal marks, then growers read none of them, and an unread figure still says so', () => {
    expect(sourceInPlainWords('Extension default for cool-season crops, base 40 °F (4.4 °C) (from memory)')).toBe(
      'Extension default for cool-season crops, base 40 °F (4.4 °C) (a commonly given figure, not checked against a published table)',
    );
    expect(sourceInPlainWords('SCIENCE §4: chilling injury of warm-season crops below ~50 °F (M)')).toBe('chilling injury of warm-season crops below ~50 °F');
    expect(sourceInPlainWords('Common practice (from memory, no source read)')).toBe('Common growing practice; not checked against a published table');
  });

  it('when every source in the library is worded for growers, then none shows a section mark or "from memory"', () => {
    const sources = CROP_LIBRARY.flatMap((c) => Object.values(c.params).map((p) => p.source));
    expect(sources.length).toBeGreaterThan(50);
    for (const s of sources) {
      const plain = sourceInPlainWords(s);
      expect(plain, s).not.toMatch(/SCIENCE|§|\((?:H|M|L)\)/);
      expect(plain, s).not.toMatch(/from memory|no source/i);
      expect(plain.length).toBeGreaterThan(3);
    }
  });
});
