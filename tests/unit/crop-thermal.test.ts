import { describe, expect, it } from 'vitest';
import { findCrop } from '#shared/crops/library';
import { CROP_PARAM_KEYS } from '#shared/crops/params';
import type { CropParamKey, CropParamValues } from '#shared/crops/params';
import { BOLT_TRIGGER_DEFAULTS, STRESS_PROFILE_DEFAULTS, boltTriggersOf, fToC } from '#shared/thermal/index';
import { cropBoltTriggers, cropMethod, cropStressProfile } from '../../server/modules/crops/crop-thermal';

function valuesOf(cropKey: string, changes: Partial<CropParamValues> = {}): CropParamValues {
  const crop = findCrop(cropKey)!;
  return { ...Object.fromEntries(CROP_PARAM_KEYS.map((k) => [k, crop.params[k].value])), ...changes } as CropParamValues;
}

type Row = { ddBaseC: number | null; ddUpperC: number | null; ddMethod: 'single-sine' | null; ddCutoff: 'horizontal' | null };
const rows = (entries: [CropParamKey, Row][] = []) => new Map(entries);
const unrecorded: Row = { ddBaseC: null, ddUpperC: null, ddMethod: null, ddCutoff: null };

describe('crop method', () => {
  it('when a crop has an upper threshold, then the method carries it; without one, none', () => {
    expect(cropMethod(valuesOf('tomato'))).toEqual({ base: 10, upper: 30, method: 'single-sine', cutoff: 'horizontal' });
    expect(cropMethod(valuesOf('lettuce'))).toEqual({ base: fToC(40), method: 'single-sine', cutoff: 'horizontal' });
    expect(cropMethod(valuesOf('sweet-corn')).method).toBe('clamped-average');
  });

  it('when the base is not set, then a RangeError names it', () => {
    expect(() => cropMethod(valuesOf('pea', { baseC: null }))).toThrow(RangeError);
  });
});

describe('crop bolt triggers', () => {
  it('when a crop does not bolt, then there are no triggers', () => {
    expect(cropBoltTriggers('pea', valuesOf('pea'), rows())).toBeNull();
    expect(cropBoltTriggers('tomato', valuesOf('tomato'), rows())).toBeNull();
  });

  it('when nothing is overridden, then the triggers are the engine defaults', () => {
    expect(cropBoltTriggers('spinach', valuesOf('spinach'), rows())).toEqual({ triggers: boltTriggersOf(BOLT_TRIGGER_DEFAULTS.spinach), notes: [] });
    expect(cropBoltTriggers('bok-choy', valuesOf('bok-choy'), rows())!.triggers).toEqual(boltTriggersOf(BOLT_TRIGGER_DEFAULTS['bok choy']));
  });

  it('when the garden overrides bolting figures, then its values replace the defaults and a cleared one is left out', () => {
    const t = cropBoltTriggers('lettuce', valuesOf('lettuce', { boltHeatThresholdC: 25, boltHeatStreakDays: 5, criticalPhotoperiodH: null }), rows())!;
    expect(t.triggers).toEqual({ heatThresholdC: 25, heatStreakDays: 5 });
  });

  it('when a vernalization figure is missing, then vernalization is left out with a note', () => {
    const t = cropBoltTriggers('cabbage', valuesOf('cabbage', { vernalizationDays: null }), rows())!;
    expect(t.triggers.vernalization).toBeUndefined();
    expect(t.notes.join(' ')).toMatch(/Vernalization is left out/);
  });

  it('when a biennial has no trigger figures, then the triggers are empty and a note says so', () => {
    expect(cropBoltTriggers('carrot', valuesOf('carrot'), rows())).toEqual({ triggers: {}, notes: [expect.stringMatching(/No bolt trigger figures are set for carrot/)] });
  });

  it('when the juvenile phase was counted at the crop’s current method, then the gate holds', () => {
    const values = valuesOf('cabbage', { juvenileGdd: 400 });
    const row: Row = { ddBaseC: fToC(40), ddUpperC: null, ddMethod: 'single-sine', ddCutoff: 'horizontal' };
    expect(cropBoltTriggers('cabbage', values, rows([['juvenileGdd', row]]))).toEqual({
      triggers: { vernalization: { minC: 4, maxC: 10, requiredDays: 42, juvenileGdd: 400 } },
      notes: [],
    });
  });

  it('when the crop’s base changed after the juvenile phase was set, then the gate is off and a note says why in units', () => {
    const values = valuesOf('cabbage', { baseC: 7, juvenileGdd: 400 });
    const row: Row = { ddBaseC: fToC(40), ddUpperC: null, ddMethod: 'single-sine', ddCutoff: 'horizontal' };
    const t = cropBoltTriggers('cabbage', values, rows([['juvenileGdd', row]]))!;
    expect(t.triggers.vernalization!.juvenileGdd).toBe(0);
    expect(t.notes).toEqual([
      'Your juvenile phase of 400 °C-days was counted at base 4.4 °C, single sine; this crop now counts from base 7 °C, single sine, so cold counts from the start until you set the juvenile phase again.',
    ]);
  });

  it('when a row has no recorded basis, then it counts as measured with the library default method', () => {
    const same = cropBoltTriggers('cabbage', valuesOf('cabbage', { juvenileGdd: 400 }), rows([['juvenileGdd', unrecorded]]))!;
    expect(same.triggers.vernalization!.juvenileGdd).toBe(400);
    const moved = cropBoltTriggers('cabbage', valuesOf('cabbage', { baseC: 5 }), rows())!;
    expect(moved.triggers.vernalization!.juvenileGdd).toBe(0);
    expect(moved.notes[0]).toMatch(/^The library’s juvenile phase of 500 °C-days was counted at base 4.4 °C, single sine; this crop now counts from base 5 °C/);
  });
});

describe('crop stress profile', () => {
  it('when nothing is overridden, then the profile matches the engine’s defaults in °F', () => {
    expect(cropStressProfile('tomato', valuesOf('tomato'))).toEqual(STRESS_PROFILE_DEFAULTS.tomato.profile);
    expect(cropStressProfile('sweet-corn', valuesOf('sweet-corn'))).toEqual(STRESS_PROFILE_DEFAULTS['sweet corn'].profile);
    expect(cropStressProfile('lettuce', valuesOf('lettuce'))).toEqual({ hardiness: 'very-hardy', chillingSensitive: false });
  });

  it('when the garden sets figures in °C, then they reach the engine in °F, and an incomplete group is left out', () => {
    const p = cropStressProfile('tomato', valuesOf('tomato', { blossomDropWatchC: 30, hardiness: 'warm-loving', chillingSensitive: false }));
    expect(p.blossomDrop!.highWatchF).toBeCloseTo(86, 10);
    expect(p).toMatchObject({ hardiness: 'warm-loving', chillingSensitive: false });
    expect(cropStressProfile('tomato', valuesOf('tomato', { blossomDropDays: null })).blossomDrop).toBeUndefined();
  });
});
