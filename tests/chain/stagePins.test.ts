import { describe, expect, it } from 'vitest';
import { findOutputTube, findTube, pushPullPins, singleEndedPins, solveChain, solveOutput, solvePushPull, type ChainInput, type ChainStage, type PushPullLink } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

// Our own amplifiers. The checks are Ohm's law on each stage's own resistors and what a wire or a winding at DC
// holds equal: the figures a builder's meter reads, chassis to each electrode, at first switch-on.
const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;
const el34 = findOutputTube('EL34')!;
const input: ChainStage = { kind: 'common-cathode', tube: ax7, bplus: 290, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } };
const driver: ChainStage = { kind: 'common-cathode', tube: au7, bplus: 290, ra: 33e3, rk: 3300, bypassed: false, coupling: { kind: 'capacitor', cc: 68e-9, rg: 470e3 } };
const follower: ChainStage = { kind: 'follower', tube: au7, bplus: 290, rk: 33e3, coupling: { kind: 'direct' } };
const singleEnded = (connection: 'ultralinear' | 'pentode' | 'triode'): ChainStage => ({
  kind: 'single-ended-output', tube: el34, connection, bplus: 330, screenVolts: 270, ulTap: 0.43, zPrimary: 3300, rPrimary: 120,
  bias: 'cathode', rk: 330, vg: 0, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 270e3 },
});
const pair: PushPullLink = {
  kind: 'push-pull-output', tube: findOutputTube('EL84')!, connection: 'ultralinear', bplus: 300, screenVolts: 300, ulTap: 0.4, raa: 8000, rPrimary: 240,
  bias: 'fixed', rk: 0, vg: -11, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 220e3 },
};
const ltpStage: ChainStage = { kind: 'long-tailed-pair', tube: au7, bplus: 350, ra: 33e3, ra2: 36e3, rk: 470, rtail: 10e3, vbias: 60, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } };
const solved = (c: ChainInput) => {
  const r = solveChain(c);
  if (!r.ok) throw new Error(r.message);
  return r;
};

describe("each stage's DC voltages to chassis at idle", () => {
  it('a gain stage: its plate at B+ less Ra·Ia, its cathode at Rk·Ia, its grid held near 0 V by its leak; a follower\'s grid on the plate before it and its plate on B+', () => {
    const r = solved({ source: { rsource: 1e3 }, stages: [input, driver, follower, singleEnded('ultralinear')] });
    r.stages.slice(0, 2).forEach((st, i) => {
      const s = [input, driver][i] as Extract<ChainStage, { kind: 'common-cathode' }>;
      expectClose(st.pins.plate, s.bplus - s.ra * st.op.ia, { rel: 1e-9 }, `stage ${i + 1} plate`);
      expectClose(st.pins.cathode, s.rk * st.op.ia, { rel: 1e-9 }, `stage ${i + 1} cathode`);
      // Only a grid-leak bias's nanoamps flow in the leak: well under 0.1 V.
      expect(Math.abs(st.pins.grid), `stage ${i + 1} grid`).toBeLessThan(0.1);
      expect(st.pins.screen).toBeNull();
      expect(st.pins.plate2).toBeNull();
      expect(st.pins.plate2Current).toBeNull();
    });
    const f = r.stages[2]!;
    expectClose(f.pins.grid, r.stages[1]!.pins.plate, { rel: 1e-9 }, "the follower's grid is the driver's plate (one wire)");
    expectClose(f.pins.plate, 290, { rel: 1e-12 }, "the follower's plate is on its B+");
    expectClose(f.pins.cathode, 33e3 * f.op.ia, { rel: 1e-9 }, "the follower's cathode");
  });

  it('a single-ended output stage: its cathode at Rk·Ik, its screen on the tap (at B+ at DC), at its own feed, or tied to the plate', () => {
    for (const connection of ['ultralinear', 'pentode', 'triode'] as const) {
      const st = solved({ source: { rsource: 1e3 }, stages: [input, singleEnded(connection)] }).stages[1]!;
      expectClose(st.pins.cathode, 330 * st.supplyCurrent, { rel: 1e-6 }, `${connection}: cathode`);
      expectClose(st.pins.grid, 0, { abs: 1e-9 }, `${connection}: grid on its leak to ground`);
      expect(st.pins.plate).toBeLessThan(330);
      const screen = connection === 'ultralinear' ? 330 : connection === 'pentode' ? 270 : st.pins.plate;
      expectClose(st.pins.screen!, screen, { rel: 1e-9 }, `${connection}: screen`);
    }
  });

  it('a long-tailed pair\'s second plate at B+ less Ra2 times its share of the tail; a fixed-bias pair\'s grids at the bias supply and its screens on the taps', () => {
    const r = solved({ source: { rsource: 600 }, stages: [input, ltpStage, pair] });
    const ltp = r.stages[1]!;
    const ia2 = ltp.supplyCurrent - ltp.op.ia;
    expect(ia2).toBeGreaterThan(0);
    expectClose(ltp.pins.plate2!, 350 - 36e3 * ia2, { rel: 1e-9 }, 'second plate');
    expectClose(ltp.pins.plate2Current!, ia2, { rel: 1e-9 }, 'second plate current: the tail\'s less the first\'s (Kirchhoff)');
    expectClose(ltp.pins.plate, 350 - 33e3 * ltp.op.ia, { rel: 1e-9 }, 'first plate');
    expectClose(ltp.pins.grid, 60, { rel: 1e-9 }, 'grid on its divider');
    const pp = r.stages[2]!;
    expectClose(pp.pins.grid, -11, { rel: 1e-12 }, 'grid at the bias supply');
    expectClose(pp.pins.cathode, 0, { abs: 1e-12 }, 'cathodes grounded');
    expectClose(pp.pins.screen!, 300, { rel: 1e-9 }, 'screens on the taps: at the centre tap at DC');
    expectClose(pp.pins.plate, 300 - 120 * pp.op.ia, { rel: 1e-6 }, 'each plate below the centre tap by its half of the primary');
  });

  it('an output stage on its own bench reads as it does at the end of the amplifier (one calculation for both)', () => {
    const se = singleEnded('ultralinear') as Extract<ChainStage, { kind: 'single-ended-output' }>;
    const inChain = solved({ source: { rsource: 1e3 }, stages: [input, se] }).stages[1]!.pins;
    const alone = solveOutput(el34, { ...se, tubeId: 'EL34', rg: 270e3 });
    if (!alone.ok) throw new Error(alone.message);
    expect(singleEndedPins(alone.op)).toEqual(inChain);
    const inChainPair = solved({ source: { rsource: 600 }, stages: [input, ltpStage, pair] }).stages[2]!.pins;
    const pairAlone = solvePushPull(findOutputTube('EL84')!, { ...pair, tubeId: 'EL84', rg: 220e3 });
    if (!pairAlone.ok) throw new Error(pairAlone.message);
    expect(pushPullPins(pairAlone)).toEqual(inChainPair);
  });
});
