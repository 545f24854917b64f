import { describe, expect, it } from 'vitest';
import { designAtPlanePoint, distortion, feasibleRegion, findTube, rankTubes, solveStage, swing, type FeasibleRegion, type RegionStage, type Targets } from '../../src/index';

/**
 * The full analysis a builder would do by hand for one design, target by
 * target, with the ordinary calls at their full precision (1024 samples per
 * cycle, levels met to 1e-8): the region must agree with it.
 */
function meets(stage: RegionStage, t: Targets, vpk: number, ia: number): boolean | 'unreachable' {
  const at = designAtPlanePoint({ tube: stage.tube, bplus: stage.bplus, vpk, ia });
  if (!at.ok) return 'unreachable';
  const design = { tube: stage.tube, bplus: stage.bplus, ra: at.ra, rk: at.rk, bypassed: stage.bypassed, rl: stage.rl, rsource: stage.rsource, rg: stage.rg ?? 1e6, rstopper: stage.rstopper ?? 0, ...(stage.volume !== undefined ? { volume: stage.volume } : {}) };
  const s = solveStage(design);
  if (!s.ok) return 'unreachable';
  const sw = swing(design);
  if (!sw.ok) return 'unreachable';
  const rec = stage.tube.kind === 'tube' ? stage.tube : null;
  if (t.minGain !== undefined && Math.abs(s.gain) < t.minGain) return false;
  if (t.maxZout !== undefined && s.zout > t.maxZout) return false;
  if (t.maxDissipationFraction !== undefined && rec && s.op.pa > t.maxDissipationFraction * rec.ratings.maxPlateDissipation) return false;
  if (t.minCleanOutputRms !== undefined && sw.output.rms < t.minCleanOutputRms) return false;
  if (t.minGridHeadroom !== undefined && sw.inputPeak < t.minGridHeadroom) return false;
  if (t.raRange && (at.ra < t.raRange[0] || at.ra > t.raRange[1])) return false;
  if (t.rkRange && (at.rk < t.rkRange[0] || at.rk > t.rkRange[1])) return false;
  if (t.heaterCathodeWithinRating && rec?.ratings.maxHeaterCathodeVoltage && s.op.vk > rec.ratings.maxHeaterCathodeVoltage) return false;
  if (t.maxThdAt) {
    if (t.maxThdAt.outputRms > sw.output.rms) return false;
    const d = distortion(design, { outputRms: t.maxThdAt.outputRms });
    if (!d.ok || d.thdPercent > 100 * t.maxThdAt.thd) return false;
  }
  return true;
}

/** Points whose eight neighbours share their verdict: off the boundary by more than a cell. */
function interior(r: FeasibleRegion, i: number, j: number): boolean {
  for (let a = -1; a <= 1; a++) for (let b = -1; b <= 1; b++) {
    const n = r.inside[i + a]?.[j + b];
    if (n === undefined || n !== r.inside[i]![j]) return false;
    if ((r.failing[i + a]![j + b]![0] === 'unreachable') !== (r.failing[i]![j]![0] === 'unreachable')) return false;
  }
  return true;
}

const ax7: RegionStage = { tube: findTube('12AX7')!, bplus: 300, rl: 470e3, rsource: 10e3, bypassed: true };
const au7: RegionStage = { tube: findTube('12AU7')!, bplus: 250, rl: 100e3, rsource: 600, bypassed: true };

describe('the region where a stage meets its targets', () => {
  // Each over the stretch of the plane where its region lies (the tubes' usual working currents).
  const cases: [string, RegionStage, Targets, { vmax: number; iaMax: number }][] = [
    ['12AX7: gain, clean output, THD at 2 V, dissipation, Zout', ax7, { minGain: 45, minCleanOutputRms: 20, maxThdAt: { outputRms: 2, thd: 0.01 }, maxDissipationFraction: 0.7, maxZout: 60e3 }, { vmax: 300, iaMax: 0.003 }],
    ['12AU7: grid headroom, Ra and Rk ranges, heater–cathode', au7, { minGridHeadroom: 4, raRange: [10e3, 47e3], rkRange: [470, 2200], heaterCathodeWithinRating: true }, { vmax: 250, iaMax: 0.015 }],
    ['12AU7 unbypassed, a high source: THD at 5 V and gain', { ...au7, bypassed: false, rsource: 100e3 }, { maxThdAt: { outputRms: 5, thd: 0.02 }, minGain: 8 }, { vmax: 250, iaMax: 0.015 }],
    ['12AX7 behind a 100k grid stopper: clean output and THD at 10 V', { ...ax7, rsource: 1e3, rstopper: 100e3 }, { minCleanOutputRms: 15, maxThdAt: { outputRms: 10, thd: 0.03 } }, { vmax: 300, iaMax: 0.003 }],
    ['12AU7 behind a 500k volume control at 0.4 of its track, from 47k: clean output and THD at 8 V', { ...au7, rsource: 47e3, rg: 500e3, volume: 0.4 }, { minCleanOutputRms: 12, maxThdAt: { outputRms: 8, thd: 0.02 } }, { vmax: 250, iaMax: 0.015 }],
  ];
  it.each(cases)('%s: every point off the boundary is what the full analysis says, inside or out', (_name, stage, targets, extent) => {
    const r = feasibleRegion(stage, targets, { nx: 30, ny: 24, extent });
    if (!r.ok) throw new Error(r.message);
    let inside = 0;
    let outside = 0;
    for (let i = 0; i < r.va.length; i++) {
      for (let j = 0; j < r.ia.length; j++) {
        if (!interior(r, i, j)) continue;
        const full = meets(stage, targets, r.va[i]!, r.ia[j]!);
        if (full === 'unreachable') expect(r.failing[i]![j]).toEqual(['unreachable']);
        else expect(full, `at ${r.va[i]!.toFixed(0)} V, ${(r.ia[j]! * 1e3).toFixed(2)} mA: ${r.failing[i]![j]!.join(', ')}`).toBe(r.inside[i]![j]);
        if (r.inside[i]![j]) inside++;
        else if (full !== 'unreachable') outside++;
      }
    }
    // Both sides are really there: a region all in or all out would test nothing.
    expect(inside).toBeGreaterThan(3);
    expect(outside).toBeGreaterThan(3);
  });

  // Invented demo data, worked by hand: a 12AU7 (2.75 W rating, Tung-Sol 1962) held to half its dissipation
  // may sit where Vpk·Ia ≤ 1.375 W. At Vpk = 205 V (a cell centre) that is Ia ≤ 6.71 mA.
  it('the dissipation edge lies where the hand calculation puts it, within one cell (invented targets, worked by hand)', () => {
    const r = feasibleRegion(au7, { maxDissipationFraction: 0.5 }, { nx: 40, ny: 40, extent: { vmax: 400, iaMax: 0.02 } });
    if (!r.ok) throw new Error(r.message);
    const i = r.va.findIndex((v) => Math.abs(v - 205) < 1e-9);
    expect(i).toBeGreaterThanOrEqual(0);
    const column = r.inside[i]!;
    const top = Math.max(...r.ia.filter((_, j) => column[j]));
    const cell = r.ia[1]! - r.ia[0]!;
    expect(Math.abs(top - 1.375 / 205)).toBeLessThanOrEqual(cell);
  });

  // Invented demo data, worked by hand: Ra ≥ 20 kΩ on 250 V at 5 mA puts the plate at most 250 − 100 = 150 V
  // to ground; the cathode sits a few volts up (Vpk = Va − Vk), so the edge is at Vpk just under 150 V.
  it('the Ra edge lies where Ohm\u2019s law puts it, within one cell (invented targets, worked by hand)', () => {
    const r = feasibleRegion(au7, { raRange: [20e3, 1e6] }, { nx: 50, ny: 40, extent: { vmax: 250, iaMax: 0.02 } });
    if (!r.ok) throw new Error(r.message);
    const j = r.ia.findIndex((x) => Math.abs(x - 0.00525) < 1e-9);
    expect(j).toBeGreaterThanOrEqual(0);
    const right = Math.max(...r.va.filter((_, i) => r.inside[i]![j]));
    const cell = r.va[1]! - r.va[0]!;
    const vk = 5; // a 12AU7 at about 5 mA and 140 V sits near −5 V grid (its curves; from memory)
    expect(Math.abs(right - (250 - 20e3 * 0.00525 - vk))).toBeLessThanOrEqual(cell + 2);
  });

  it('where no point holds it says which target excludes most, and how far the best point misses', () => {
    const r = feasibleRegion(au7, { minGain: 40, maxDissipationFraction: 0.9 }, { nx: 20, ny: 15 });
    if (!r.ok) throw new Error(r.message);
    expect(r.inside.flat().some(Boolean)).toBe(false);
    expect(r.excludesMost).toMatchObject({ target: 'minGain' });
    expect(r.best!.score).toBeLessThan(0);
    expect(r.best!.weakest).toBe('minGain');
    // A 12AU7's mu is about 17 to 20 (Tung-Sol 1962): a gain of 40 is out of reach, missed by about half.
    expect(r.best!.margins.minGain!).toBeGreaterThan(-0.75);
    expect(r.best!.margins.minGain!).toBeLessThan(-0.4);
  });

  it('bad targets and grids are typed failures naming the field', () => {
    expect(feasibleRegion(au7, { minGain: -3 })).toMatchObject({ ok: false, field: 'targets.minGain' });
    expect(feasibleRegion(au7, { maxThdAt: { outputRms: 2, thd: 5 } })).toMatchObject({ ok: false, field: 'targets.maxThdAt' });
    expect(feasibleRegion(au7, { raRange: [50e3, 10e3] })).toMatchObject({ ok: false, field: 'targets.raRange' });
    expect(feasibleRegion(au7, {}, { nx: 1, ny: 10 })).toMatchObject({ ok: false, field: 'grid' });
    expect(feasibleRegion({ ...au7, bplus: -5 }, {})).toMatchObject({ ok: false, field: 'bplus' });
  });
});

describe('tubes ranked against the targets', () => {
  const targets: Targets = { minGain: 30, minCleanOutputRms: 15, maxDissipationFraction: 0.7 };
  const stage = { bplus: 300, rl: 470e3, rsource: 1e3, bypassed: true };
  it('best first; the top tube\u2019s design meets every target by the full analysis; a tube that cannot reach the gain is ranked below', () => {
    const r = rankTubes(targets, stage);
    if (!r.ok) throw new Error(r.message);
    expect(r.ranks.length).toBeGreaterThan(10);
    for (let k = 1; k < r.ranks.length; k++) expect(r.ranks[k]!.score).toBeLessThanOrEqual(r.ranks[k - 1]!.score);
    const top = r.ranks[0]!;
    expect(top.score).toBeGreaterThanOrEqual(0);
    expect(meets({ ...stage, tube: findTube(top.tubeId)! }, targets, top.vpk, top.ia)).toBe(true);
    // A 12AU7 (mu about 17, Tung-Sol 1962) cannot give 30: below every tube that meets the targets.
    const au = r.ranks.find((x) => x.tubeId === '12AU7')!;
    expect(au.score).toBeLessThan(0);
    expect(r.ranks.indexOf(au)).toBeGreaterThan(r.ranks.findLastIndex((x) => x.score >= 0));
  });
});
