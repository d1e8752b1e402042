import { describe, expect, it } from 'vitest';
import { paramProblems } from '#shared/crops/consistency';
import { findCrop } from '#shared/crops/library';
import { CROP_LIBRARY } from '#shared/crops/library';
import { CROP_PARAM_KEYS } from '#shared/crops/params';
import type { CropParamValues } from '#shared/crops/params';

function valuesOf(cropKey: string, changes: Partial<CropParamValues> = {}): CropParamValues {
  const crop = findCrop(cropKey)!;
  const out = Object.fromEntries(CROP_PARAM_KEYS.map((k) => [k, crop.params[k].value]));
  return { ...out, ...changes } as CropParamValues;
}

describe('crop parameters checked together', () => {
  it('when the library defaults are read, then every crop is consistent', () => {
    for (const crop of CROP_LIBRARY) expect(paramProblems(valuesOf(crop.key)), crop.key).toEqual({});
  });

  it('when the upper threshold is below the base, then both are named in plain words with units', () => {
    const problems = paramProblems(valuesOf('tomato', { baseC: 25, upperC: 15 }));
    const message = 'The upper threshold (15 °C) must be above the base temperature (25 °C).';
    expect(problems).toEqual({ baseC: message, upperC: message });
  });

  it('when the upper threshold equals the base, or is not set, then only the equal pair is a problem', () => {
    expect(Object.keys(paramProblems(valuesOf('tomato', { baseC: 20, upperC: 20 })))).toEqual(['baseC', 'upperC']);
    expect(paramProblems(valuesOf('lettuce', { baseC: 25, upperC: null }))).toEqual({});
  });

  it('when the garden reads °F, then the figures are said in °F', () => {
    expect(paramProblems(valuesOf('tomato', { baseC: 25, upperC: 15 }), 'F').upperC).toBe('The upper threshold (59 °F) must be above the base temperature (77 °F).');
  });

  it('when germination temperatures are out of order, then each field in a broken pair is named', () => {
    expect(Object.keys(paramProblems(valuesOf('tomato', { germMinC: 30 }))).sort()).toEqual(['germMinC', 'germOptC']);
    expect(Object.keys(paramProblems(valuesOf('tomato', { germOptC: 40 }))).sort()).toEqual(['germMaxC', 'germOptC']);
    expect(Object.keys(paramProblems(valuesOf('tomato', { germMinC: 40, germOptC: null, germMaxC: 30 }))).sort()).toEqual(['germMaxC', 'germMinC']);
    expect(paramProblems(valuesOf('tomato', { germMinC: 20, germOptC: 20, germMaxC: 20 }))).toEqual({});
  });

  it('when vernalization, blossom-drop highs or nights are out of order, then those pairs are named', () => {
    expect(Object.keys(paramProblems(valuesOf('cabbage', { vernalizationMinC: 10, vernalizationMaxC: 10 }))).sort()).toEqual(['vernalizationMaxC', 'vernalizationMinC']);
    expect(paramProblems(valuesOf('tomato', { blossomDropWatchC: 35, blossomDropWarningC: 33 })).blossomDropWatchC).toMatch(/warning high \(33 °C\) must not be below the blossom-drop watch high \(35 °C\)/);
    expect(Object.keys(paramProblems(valuesOf('tomato', { blossomDropNightBelowC: 21, blossomDropNightAboveC: 21 }))).sort()).toEqual(['blossomDropNightAboveC', 'blossomDropNightBelowC']);
  });

  it('when the base temperature is not set, then it is named: degree days cannot be counted', () => {
    expect(paramProblems(valuesOf('pea', { baseC: null })).baseC).toMatch(/need a base temperature/);
  });

  it('when one field breaks two pairs, then its message holds both sentences', () => {
    const p = paramProblems(valuesOf('tomato', { germOptC: 5, germMinC: 10, germMaxC: 4 }));
    expect(p.germOptC).toMatch(/must not be below the minimum.*must not be below the optimum/);
  });
});
