import { describe, expect, it } from 'vitest';
import { analyzeOutput, analyzePushPull, findOutputTube, outputPartsList, pushPullPartsList, screenFeedPlan, type OutputDesign } from '../../src/index';
import { emptyCurrents, stageCurrentsInto } from '../../src/output/electrodes';
import { screenSagFinding } from '../../src/output/screenFeed';
import { pairScreensAtFull } from '../../src/pushpull/pushPullParts';
import { expectClose } from '../helpers/expectClose';
import { EL34_SCREEN_DROPPED, PAIR_6L6GC_AB1 } from '../helpers/outputDesigns';

// Our own designs: an EL34 pentode with its screens 30 V under the plate's B+, and a 6L6GC pair at the RCA sheet's
// class AB1 voltages (450 V plates, 400 V screens; from memory, as in dataSheetPushPull.test.ts).
const el34 = EL34_SCREEN_DROPPED;
const pair6l6 = PAIR_6L6GC_AB1;
const single = (d: OutputDesign) => {
  const a = analyzeOutput(findOutputTube(d.tubeId)!, d, { light: true });
  if (!a.ok) throw new Error(a.message);
  return a;
};

describe('the screens\' feed on a pentode-connected output stage', () => {
  // Ohm's law: the dropper from B+ drops B+ − Vg2 at the screens' idle current.
  it('a screen under B+ gets a dropping resistor R = (B+ − Vg2)/Ig2 and a bypass; at B+ or when wired otherwise, none', () => {
    const a = single(el34);
    const parts = outputPartsList(a, 'E24');
    const rs = parts.resistors.find((r) => r.ref === 'Rs')!;
    expectClose(rs.value, (330 - 300) / a.solution.op.ig2, { rel: 1e-12 }, 'Rs');
    // Joule's law on the idle current, rated at twice the worst case (common practice, as every resistor).
    expectClose(rs.watts, a.solution.op.ig2 ** 2 * rs.preferred, { rel: 1e-9 }, 'Rs watts');
    expect(rs.ratingWatts).toBeGreaterThanOrEqual(2 * rs.wattsWorst);
    // The bypass: its reactance at 10 Hz at most what it shunts, Rs in parallel with the screen's own dIg2/dVg2
    // (Horowitz and Hill, 3rd ed., §1.7: the corner 1/(2πRC)); cold, the screens draw nothing and it sees all of B+.
    const cs = parts.capacitors.find((c) => c.ref === 'Cs')!;
    const c = emptyCurrents();
    const ig2 = (v: number) => (stageCurrentsInto(a.solution.tube, { kind: 'fixed', vg2k: v }, a.solution.op.vpk, a.solution.op.vgk, c, 0), c.ig2);
    const g = (ig2(a.solution.op.vg2k + 0.01) - ig2(a.solution.op.vg2k - 0.01)) / 0.02;
    expect(g).toBeGreaterThan(0);
    const shunted = 1 / (1 / rs.preferred + g);
    expect(1 / (2 * Math.PI * cs.value! * shunted)).toBeLessThanOrEqual(10);
    expect(cs.voltsAtSwitchOn).toBe(330);
    expect(cs.volts).toBe(300);
    // Rated as the supply's filter capacitors are: B+ with the mains 10 % high (IEC 60038), 363 V, up to 400 V.
    expect(cs.ratingVolts).toBe(400);

    for (const d of [{ ...el34, screenVolts: 330 }, { ...el34, connection: 'ultralinear' as const }, { ...el34, connection: 'triode' as const }]) {
      const p = outputPartsList(single(d), 'E24');
      expect(p.resistors.some((r) => r.ref === 'Rs'), d.connection).toBe(false);
      expect(p.capacitors.some((x) => x.ref === 'Cs'), d.connection).toBe(false);
    }
  });

  // Ohm's law again: at full drive the screens' average current (checked against ngspice in screenCurrent.spice.test.ts)
  // through the dropper drops more than at idle; the figures hold the screen, so past 5 % of it (our threshold) a warning.
  it('warns how far a dropper lets the screens sag at full drive, and rates it for that current', () => {
    const a = analyzeOutput(findOutputTube('EL34')!, el34);
    if (!a.ok) throw new Error(a.message);
    const idle = a.solution.op.ig2;
    const full = a.screenAtFull!;
    expect(full).toBeGreaterThan(2 * idle);
    const sag = a.findings.find((f) => f.kind === 'screen-supply')!;
    expect(sag.severity).toBe('warning');
    expectClose(sag.value, ((330 - 300) / idle) * (full - idle), { rel: 1e-9 }, 'sag');
    expect(sag.message).toMatch(/^At full drive the screens draw 18\.\d mA on average \(5\.1 mA at idle\): through a 5\.92 kΩ dropper from B\+ they would sag about \d+ V below 300 V/);
    const rs = outputPartsList(a, 'E24').resistors.find((r) => r.ref === 'Rs')!;
    expectClose(rs.watts, full ** 2 * rs.preferred, { rel: 1e-9 }, 'Rs at full drive');
    expect(rs.ratingWatts).toBeGreaterThanOrEqual(2 * rs.wattsWorst);
    // A small rise stays quiet; so does a screen fed straight from B+.
    expect(screenSagFinding({ kind: 'dropper', ohms: 6000, amps: 0.005 }, 300, 0.0052)).toBeNull();
    const atBplus = analyzeOutput(findOutputTube('EL34')!, { ...el34, screenVolts: 330 });
    if (!atBplus.ok) throw new Error(atBplus.message);
    expect(atBplus.findings.some((f) => f.kind === 'screen-supply')).toBe(false);
  });

  it('a pair\'s screens share one dropper carrying both idle currents', () => {
    const a = analyzePushPull(findOutputTube('6L6GC')!, pair6l6, { light: true });
    if (!a.ok) throw new Error(a.message);
    const rs = pushPullPartsList(a, 'E24').resistors.find((r) => r.ref === 'Rs')!;
    const idle = a.solution.idle[0].ig2 + a.solution.idle[1].ig2;
    expectClose(rs.value, (450 - 400) / idle, { rel: 1e-12 }, 'Rs');
    // Its sag at full drive, both screens' average current through it (Ohm's law), is warned like a single tube's.
    const full = pairScreensAtFull(a)!;
    const sag = a.findings.find((f) => f.kind === 'screen-supply')!;
    expectClose(sag.value, rs.value * (full - idle), { rel: 1e-9 }, 'sag');
    expectClose(rs.watts, full ** 2 * rs.preferred, { rel: 1e-9 }, 'Rs at full drive');
  });

  it('a screen above B+ needs a node of its own: no dropper, a note that says so (single-ended and pair)', () => {
    const a = single({ ...el34, screenVolts: 360 });
    expect(outputPartsList(a, 'E24').resistors.some((r) => r.ref === 'Rs')).toBe(false);
    expect(a.findings.find((f) => f.kind === 'screen-supply')?.message).toMatch(/^The screens at 360 V sit above B\+ \(330 V\): feed them from a supply node of their own/);
    expect(single(el34).findings.some((f) => f.kind === 'screen-supply')).toBe(false);
    const p = analyzePushPull(findOutputTube('6L6GC')!, { ...pair6l6, bplus: 380 }, { light: true });
    if (!p.ok) throw new Error(p.message);
    expect(p.findings.some((f) => f.kind === 'screen-supply')).toBe(true);
  });

  it('plans from the numbers alone: within a volt of B+ straight from it, a dropper below, its own node above', () => {
    expect(screenFeedPlan(330, 329.5, 0.005)).toEqual({ kind: 'from-bplus' });
    expect(screenFeedPlan(330, 300, 0.005)).toEqual({ kind: 'dropper', ohms: 6000, amps: 0.005 });
    expect(screenFeedPlan(330, 340, 0.005)).toEqual({ kind: 'own-node' });
    // A screen drawing nothing cannot be dropped to: it needs its own node too.
    expect(screenFeedPlan(330, 300, 0)).toEqual({ kind: 'own-node' });
  });
});
