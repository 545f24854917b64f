import { describe, expect, it } from 'vitest';
import { biasForPoint, findOutputTube, judgeOutput, outputRegion, pairBiasForPoint, pushPullFigures, rankOutputTubes, solveOutput, solvePushPull, type OutputDesign, type OutputRegion, type PushPullDesign, type Targets } from '../../src/index';
import { atDrive } from '../../src/output/outputSignal';
import { powerAtDistortion } from '../../src/output/powerSweep';

/**
 * An output stage's targets over its plate plane. Each inside point is
 * checked again with the bench's own calls at full precision (the direct
 * solve at 128 samples per cycle, power within a THD by powerAtDistortion,
 * THD at a power by bisection on the drive): the region must agree with
 * them off its boundary.
 */
const el34 = findOutputTube('EL34')!;
const se: OutputDesign = { tubeId: 'EL34', connection: 'pentode', bplus: 350, screenVolts: 250, ulTap: 0.43, zPrimary: 3000, rPrimary: 150, bias: 'cathode', rk: 220, vg: -20, rg: 470e3, speakerOhms: 8, thdLimit: 0.05 };
const extent = { vmax: 600, iaMax: 0.16 };

/** THD at a power, the drive found by bisection on the direct solve; null past the grid's 0 V. */
function thdAtPower(s: Extract<ReturnType<typeof solveOutput>, { ok: true }>, power: number): number | null {
  let lo = 0;
  let hi = -s.op.vgk;
  if (atDrive(s, hi, s.design.zPrimary, 128).power < power) return null;
  for (let k = 0; k < 30; k++) {
    const mid = 0.5 * (lo + hi);
    if (atDrive(s, mid, s.design.zPrimary, 128).power < power) lo = mid;
    else hi = mid;
  }
  return atDrive(s, hi, s.design.zPrimary, 128).thd;
}

/** The single-ended stage at a point, target by target with the direct calls. */
function meets(d: OutputDesign, t: Targets, vpk: number, ip: number): boolean | 'unreachable' {
  const b = biasForPoint(el34, d, vpk, ip);
  if (!b.ok) return 'unreachable';
  const s = solveOutput(el34, d.bias === 'cathode' ? { ...d, bplus: b.bplus, rk: b.rk } : { ...d, bplus: b.bplus, vg: b.vgk });
  if (!s.ok) return 'unreachable';
  if (t.maxDissipationFraction !== undefined && s.op.pa > t.maxDissipationFraction * el34.ratings.maxPlateDissipation) return false;
  if (t.minPower && powerAtDistortion(s, t.minPower.thd).power < t.minPower.power) return false;
  if (t.maxThdAtPower) {
    const thd = thdAtPower(s, t.maxThdAtPower.power);
    if (thd === null || thd > t.maxThdAtPower.thd) return false;
  }
  if (t.rkRange && (s.design.rk < t.rkRange[0] || s.design.rk > t.rkRange[1])) return false;
  if (t.bplusRange && (b.bplus < t.bplusRange[0] || b.bplus > t.bplusRange[1])) return false;
  if (t.heaterCathodeWithinRating && s.op.vk > el34.ratings.maxHeaterCathodeVoltage!) return false;
  return true;
}

/** Points whose eight neighbours share their verdict: off the boundary by more than a cell. */
function interior(r: OutputRegion, i: number, j: number): boolean {
  for (let a = -1; a <= 1; a++) for (let b = -1; b <= 1; b++) {
    const n = r.inside[i + a]?.[j + b];
    if (n === undefined || n !== r.inside[i]![j]) return false;
    if ((r.failing[i + a]![j + b]![0] === 'unreachable') !== (r.failing[i]![j]![0] === 'unreachable')) return false;
  }
  return true;
}

describe('where an output stage meets its targets', () => {
  const cases: [string, OutputDesign, Targets][] = [
    ['pentode, cathode bias: power within 10 %, THD at 1 W, dissipation', se, { minPower: { power: 4, thd: 0.1 }, maxThdAtPower: { power: 1, thd: 0.05 }, maxDissipationFraction: 0.9 }],
    ['ultralinear, fixed bias: power within 5 % and dissipation', { ...se, connection: 'ultralinear', screenVolts: 350, bias: 'fixed' }, { minPower: { power: 2.5, thd: 0.05 }, maxDissipationFraction: 0.9 }],
    ['pentode: Rk range and heater–cathode', se, { rkRange: [150, 330], heaterCathodeWithinRating: true, maxDissipationFraction: 1 }],
    ['pentode: what a 260–400 V supply gives, power within 10 % and dissipation', se, { bplusRange: [260, 400], minPower: { power: 3, thd: 0.1 }, maxDissipationFraction: 0.9 }],
  ];
  it.each(cases)('%s: every point off the boundary is what the direct calls say, inside or out', (_name, design, targets) => {
    // Over the stretch of the plane where these regions lie.
    const r = outputRegion({ pair: 'single-ended', tube: el34, design }, targets, { nx: 24, ny: 20, extent: { vmax: 450, iaMax: 0.12 } });
    if (!r.ok) throw new Error(r.message);
    let inside = 0;
    let outside = 0;
    for (let i = 0; i < r.va.length; i++) {
      for (let j = 0; j < r.ia.length; j++) {
        if (!interior(r, i, j) || r.failing[i]![j]![0] === 'unreachable') continue;
        const want = meets(design, targets, r.va[i]!, r.ia[j]!);
        expect(want, `at ${r.va[i]} V, ${r.ia[j]} A`).toBe(r.inside[i]![j]);
        if (want) inside++;
        else outside++;
      }
    }
    // Both verdicts tested: a region all in or all out would say nothing.
    expect(inside).toBeGreaterThan(3);
    expect(outside).toBeGreaterThan(3);
  });

  it('puts the dissipation edge where Pa = Vpk × Ip crosses the share of the rating (a hand calculation; invented target)', () => {
    // Pentode connection: the charted current is the plate's, so the plate dissipates Vpk × Ip exactly.
    // 70 % of the EL34's 25 W is 17.5 W: at 250 V the edge is at 70 mA, at 400 V at 43.75 mA.
    const r = outputRegion({ pair: 'single-ended', tube: el34, design: se }, { maxDissipationFraction: 0.7 }, { nx: 24, ny: 32, extent });
    if (!r.ok) throw new Error(r.message);
    const cellI = extent.iaMax / 32;
    for (const [vpk, edge] of [[250, 0.07], [400, 0.04375]] as const) {
      const i = r.va.findIndex((v) => Math.abs(v - vpk) <= extent.vmax / 48);
      const column = r.failing[i]!;
      const firstFailing = column.findIndex((f) => f.includes('maxDissipationFraction'));
      expect(Math.abs(r.ia[firstFailing]! - (17.5 / r.va[i]!))).toBeLessThanOrEqual(cellI);
      expect(Math.abs(17.5 / r.va[i]! - edge)).toBeLessThan(0.01);
    }
  });

  it('names the target that shuts the plane out and how near the best point comes', () => {
    const r = outputRegion({ pair: 'single-ended', tube: el34, design: se }, { minPower: { power: 40, thd: 0.05 } }, { nx: 16, ny: 12, extent });
    if (!r.ok) throw new Error(r.message);
    expect(r.inside.flat().some(Boolean)).toBe(false);
    expect(r.excludesMost?.target).toBe('minPower');
    expect(r.best!.score).toBeLessThan(0);
    expect(r.best!.weakest).toBe('minPower');
  });

  it('judges the bench\'s own stage with the bench\'s figures', () => {
    const s = solveOutput(el34, se);
    if (!s.ok) throw new Error(s.message);
    const v = judgeOutput({ pair: 'single-ended', tube: el34, design: se }, { minPower: { power: 5, thd: 0.05 }, maxDissipationFraction: 0.9, maxZout: 20 });
    if (!v.ok) throw new Error(v.message);
    expect(v.values.minPower! / powerAtDistortion(s, 0.05).power).toBeCloseTo(1, 2);
    expect(v.values.maxDissipationFraction).toBeCloseTo(s.op.pa / 25, 10);
    // At the speaker: (rp + Rpri) through the turns ratio squared (Zpri / Zspeaker).
    expect(v.values.maxZout).toBeCloseTo(((s.op.rp + 150) * 8) / 3000, 8);
  });

  it('a pair whose grids already sit at 0 V gives no clean power, a figure of nothing (found by the robustness run: NaN)', () => {
    const pp: PushPullDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 430, screenVolts: 430, ulTap: 0.43, raa: 6600, rPrimary: 200, bias: 'fixed', rk: 220, vg: 0, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
    const v = judgeOutput({ pair: 'push-pull', tube: el34, design: pp }, { minPower: { power: 5, thd: 0.05 }, maxThdAtPower: { power: 1, thd: 0.02 } });
    if (!v.ok) throw new Error(v.message);
    expect(v.values.minPower).toBe(0);
    expect(v.failing).toContain('minPower');
  });

  it('a push-pull pair: inside points meet the power target by the pair\'s own figures, outside ones fail', () => {
    const pp: PushPullDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 430, screenVolts: 430, ulTap: 0.43, raa: 6600, rPrimary: 200, bias: 'fixed', rk: 220, vg: -38, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
    const targets: Targets = { minPower: { power: 30, thd: 0.05 }, maxDissipationFraction: 0.8 };
    const r = outputRegion({ pair: 'push-pull', tube: el34, design: pp }, targets, { nx: 14, ny: 12, extent: { vmax: 900, iaMax: 0.12 } });
    if (!r.ok) throw new Error(r.message);
    let checked = 0;
    for (let i = 0; i < r.va.length; i++) {
      for (let j = 0; j < r.ia.length; j++) {
        if (!interior(r as OutputRegion, i, j) || r.failing[i]![j]![0] === 'unreachable') continue;
        const b = pairBiasForPoint(el34, pp, r.va[i]!, r.ia[j]!);
        if (!b.ok) continue;
        const s = solvePushPull(el34, { ...pp, bplus: b.bplus, vg: b.vgk, thdLimit: 0.05 });
        if (!s.ok) continue;
        const f = pushPullFigures(s);
        if (!f.ok) continue;
        const power = f.overThdEverywhere ? 0 : (f.atThdLimit ?? f.atZeroGrid).power;
        const ok = power >= 30 && s.idle[0].pa <= 0.8 * 25;
        expect(ok, `at ${r.va[i]} V, ${r.ia[j]} A: ${power} W`).toBe(r.inside[i]![j]);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(10);
    expect(r.inside.flat().some(Boolean)).toBe(true);
  });

  it('ranks every output tube in the socket, the best first; the top one meets every target', () => {
    const targets: Targets = { minPower: { power: 6, thd: 0.05 }, maxDissipationFraction: 0.85 };
    const r = rankOutputTubes(targets, { pair: 'single-ended', design: se });
    if (!r.ok) throw new Error(r.message);
    expect(r.ranks.length).toBeGreaterThanOrEqual(6);
    for (let k = 1; k < r.ranks.length; k++) expect(r.ranks[k - 1]!.score).toBeGreaterThanOrEqual(r.ranks[k]!.score);
    const top = r.ranks[0]!;
    expect(top.score).toBeGreaterThanOrEqual(0);
    const tube = findOutputTube(top.tubeId)!;
    const design = { ...se, tubeId: top.tubeId, connection: tube.law.kind === 'triode' ? ('triode' as const) : se.connection, bplus: top.parts.bplus, rk: top.parts.rk };
    const s = solveOutput(tube, design);
    if (!s.ok) throw new Error(s.message);
    expect(powerAtDistortion(s, 0.05).power).toBeGreaterThanOrEqual(6 * 0.99);
    expect(s.op.pa).toBeLessThanOrEqual(0.85 * tube.ratings.maxPlateDissipation * 1.001);
  });

  it('ranks within the B+ the supply can give: every tube that meets its targets idles on a B+ inside the range, and a narrow window is not missed', () => {
    // The demo's ultralinear EL34 on a 3.5 kΩ primary, a supply of 300 to 360 V (invented targets).
    const design: OutputDesign = { ...se, connection: 'ultralinear', screenVolts: 300, zPrimary: 3500, rPrimary: 130 };
    const targets: Targets = { minPower: { power: 4, thd: 0.05 }, maxDissipationFraction: 0.9, bplusRange: [300, 360] };
    const r = rankOutputTubes(targets, { pair: 'single-ended', design });
    if (!r.ok) throw new Error(r.message);
    const meeting = r.ranks.filter((x) => x.score >= 0);
    expect(meeting.length).toBeGreaterThan(0);
    for (const x of meeting) {
      expect(x.parts.bplus).toBeGreaterThanOrEqual(300);
      expect(x.parts.bplus).toBeLessThanOrEqual(360);
    }
    // The EL34's own full region holds inside the window; the ranking's coarse look must find it too.
    const own = outputRegion({ pair: 'single-ended', tube: el34, design }, targets, { nx: 60, ny: 40 });
    if (!own.ok) throw new Error(own.message);
    expect(own.inside.flat().some(Boolean)).toBe(true);
    expect(meeting.map((x) => x.tubeId)).toContain('EL34');
  });

  it('refuses malformed targets and stages with a typed failure', () => {
    const bad = outputRegion({ pair: 'single-ended', tube: el34, design: se }, { minPower: { power: -1, thd: 0.05 } });
    expect(bad.ok).toBe(false);
    expect(!bad.ok && bad.field).toBe('targets.minPower');
    const noPair = outputRegion({ pair: 'both', tube: el34, design: se } as never, {});
    expect(!noPair.ok && noPair.field).toBe('pair');
    const noTubes = rankOutputTubes({}, { pair: 'single-ended', design: se }, 'EL34' as never);
    expect(noTubes.ok).toBe(false);
  });

  // Found by the robustness run (tests/robustness/everyExport.test.ts): a fixed grid a few hundred orders of
  // magnitude from 0 V left a span whose spline step squared to 0, and the power within a THD came back NaN.
  it('a fixed grid a hair from 0 V judges like one at 0 V: no swing, every figure a number', () => {
    const targets: Targets = { minPower: { power: 5, thd: 0.05 }, maxThdAtPower: { power: 1, thd: 0.02 }, minGridHeadroom: 5 };
    const tiny = [-5e-324, -1e-310, -1e-300].map((vg) => judgeOutput({ pair: 'single-ended', tube: el34, design: { ...se, bias: 'fixed', vg } }, targets));
    for (const j of tiny) {
      if (!j.ok) throw new Error(j.message);
      expect(j.failing).toEqual(['minPower', 'maxThdAtPower', 'minGridHeadroom']);
      for (const v of Object.values(j.values)) expect(v === null || Number.isFinite(v)).toBe(true);
    }
  });
});

