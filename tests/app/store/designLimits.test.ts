import { describe, expect, it } from 'vitest';
import { OUTPUT_LIMITS, findOutputTube } from '../../../src/index';
import { readDesignFile, writeDesignFile } from '../../../app/keep/designFile';
import { DEMO_DESIGN } from '../../../app/store/demoDesign';
import { DESIGN_LIMITS as L, type Limit } from '../../../app/store/designLimits';
import { compact, FIELDS, type FieldName } from '../../../app/store/fields';
import type { BenchDesign } from '../../../app/store/analysis';
import { MIN_DRAG_BPLUS } from '../../../app/store/dragSlice';
import { outputDesignProblem } from '../../../src/output/outputDesign';

/** Each typed field, its range in the one table, and where the design file keeps it. */
const FIELD_LIMITS: [FieldName, Limit, (d: BenchDesign, v: number) => BenchDesign][] = [
  ['bplus', L.bplus, (d, v) => ({ ...d, bplus: v })],
  ['ra', L.ra, (d, v) => ({ ...d, ra: v })],
  ['rk', L.rk, (d, v) => ({ ...d, rk: v })],
  ['rsource', L.rsource, (d, v) => ({ ...d, rsource: v })],
  ['rg', L.rg, (d, v) => ({ ...d, rg: v })],
  ['rstopper', L.rstopper, (d, v) => ({ ...d, rstopper: v })],
  ['level', L.levelRms, (d, v) => ({ ...d, levelRms: v })],
  ['ra2', L.stage2.ra, (d, v) => ({ ...d, stage2: { ...d.stage2, ra: v } })],
  ['rk2', L.stage2.rk, (d, v) => ({ ...d, stage2: { ...d.stage2, rk: v } })],
  ['fCc', L.stage2.cc, (d, v) => ({ ...d, stage2: { ...d.stage2, kind: 'follower', coupling: { cc: v, rg: 1e6, vbias: 150 } } })],
  ['fRg', L.stage2.rg, (d, v) => ({ ...d, stage2: { ...d.stage2, kind: 'follower', coupling: { cc: 100e-9, rg: v, vbias: 150 } } })],
  ['fVbias', L.stage2.vbias, (d, v) => ({ ...d, stage2: { ...d.stage2, kind: 'follower', coupling: { cc: 100e-9, rg: 1e6, vbias: v } } })],
  ['oBplus', L.output.bplus, (d, v) => ({ ...d, output: { ...d.output, bplus: v } })],
  ['oZ', L.output.zPrimary, (d, v) => ({ ...d, output: { ...d.output, zPrimary: v } })],
  ['oRk', L.output.rk, (d, v) => ({ ...d, output: { ...d.output, rk: v } })],
  ['oSpeaker', L.output.speakerOhms, (d, v) => ({ ...d, output: { ...d.output, speakerOhms: v } })],
];

const parted: BenchDesign = { ...DEMO_DESIGN, drivesOutput: false };
const opens = (d: BenchDesign) => readDesignFile(writeDesignFile({ title: 'limits', design: d })).ok;

describe('one table of limits per design field', () => {
  it.each(FIELD_LIMITS.map(([f, l, put]) => [f, l, put] as const))('%s: typing and files take the same range, ends included', (field, l, put) => {
    // Typed as a builder types it: trade notation (1p), never exponent notation, which the boxes do not read.
    const edge = (v: number) => FIELDS[field].read(String(v).includes('e') ? compact(v) : String(v)).ok;
    const top = l.max;
    const bottom = l.minPart ?? l.min;
    expect(edge(top)).toBe(true);
    expect(edge(top * 1.01)).toBe(false);
    expect(opens(put(parted, top))).toBe(true);
    expect(opens(put(parted, top * 1.01))).toBe(false);
    if (bottom > 0) {
      expect(edge(bottom)).toBe(true);
      expect(edge(bottom * 0.99)).toBe(false);
      expect(opens(put(parted, bottom))).toBe(true);
      expect(opens(put(parted, bottom * 0.99))).toBe(false);
    }
  });

  it('a volume control\'s setting: typing and files take −60 to 0 dB, ends included, and none', () => {
    const typed = (t: string) => FIELDS.volume.read(t);
    expect(typed('-60')).toEqual({ ok: true, value: -60 });
    expect(typed('0')).toEqual({ ok: true, value: 0 });
    expect(typed('-6 dB')).toEqual({ ok: true, value: -6 });
    expect(typed('none')).toEqual({ ok: true, value: null });
    expect(typed('-60.6')).toEqual({ ok: false, message: 'Volume control must be from −60 to 0 dB below full (0 at full, e.g. −6)' });
    expect(typed('6').ok).toBe(false);
    for (const v of [L.volume.min, L.volume.max, null]) expect(opens({ ...parted, volume: v })).toBe(true);
    for (const v of [L.volume.min - 0.5, 0.5]) expect(opens({ ...parted, volume: v })).toBe(false);
  });

  it('the output stage\'s ranges are the model\'s own, and a drag of B+ stops where typing does', () => {
    const el34 = findOutputTube('EL34')!;
    expect(L.output.bplus).toMatchObject({ min: OUTPUT_LIMITS.minBplus, max: OUTPUT_LIMITS.maxBplus });
    expect(outputDesignProblem({ ...DEMO_DESIGN.output, zPrimary: L.output.zPrimary.max }, el34)).toBeNull();
    expect(outputDesignProblem({ ...DEMO_DESIGN.output, zPrimary: L.output.zPrimary.max * 1.01 }, el34)).toMatchObject({ field: 'zPrimary' });
    expect(MIN_DRAG_BPLUS).toBe(L.bplus.min);
  });
});
