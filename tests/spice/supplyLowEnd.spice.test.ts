import { describe, expect, it } from 'vitest';
import { findOutputTube, findTube, solveOnSupply, supplyLowEnd, type AmplifierOnSupply, type ChainInput, type SupplyDesign } from '../../src/index';
import { ladderOf } from '../../src/chain/supplyLowEnd';
import { placedOnSupply } from '../../src/chain/solveOnSupply';
import { expectClose } from '../helpers/expectClose';
import { chainNetlist, ladderSupply } from '../../src/netlist/chainNetlist';
import { ngspiceGate, runNgspiceFull } from './ngspice';
import { simulatedCorners } from './simulatedCorners';
import { DEMO_DESIGN } from '../../app/store/demoDesign';
import { onSupplyInputOf } from '../../app/store/supplyPlan';
import { LIBRARY_TUBES } from '../../app/store/tubeRegistry';

// Outside reference: ngspice (Debian's package), AC analysis of the whole amplifier with its supply's filter ladder in
// the circuit: each stage's plate load returned to its node, the nodes fed through the source resistance the model
// takes, every node's capacitor and each section's resistor or choke as given. Asked: the low −3 dB point against
// 1 kHz within 3 % and the rise above midband below the band within 0.5 dB; and whether the loop through the supply
// is stable, against ngspice's transient of the same circuit kicked at its input. The amplifiers and supplies are our own.
const run = ngspiceGate();

const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;
const at7 = findTube('12AT7')!;
const b300 = findOutputTube('300B')!;

// A real primary (20 or 30 H): an ideal transformer down to DC would pass sub-audio gain no real one has.
const toTriode300B = (cc: number, primaryInductance: number) => ({
  kind: 'single-ended-output' as const, tube: b300, connection: 'triode' as const, bplus: 400, screenVolts: 400, ulTap: 0.4, zPrimary: 3500, rPrimary: 120, primaryInductance,
  bias: 'cathode' as const, rk: 1200, vg: -70, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor' as const, cc, rg: 220e3 },
});

/** A bypassed gain stage at 300 V (the supply puts it where its node is), capacitor-coupled into its leak. */
const gain = (tube: typeof ax7, ra: number, rk: number, ck: number, cc: number, rg: number) =>
  ({ kind: 'common-cathode' as const, tube, bplus: 300, ra, rk, bypassed: true, ck, coupling: { kind: 'capacitor' as const, cc, rg } });

const threeStages: ChainInput = {
  source: { rsource: 1e3 },
  stages: [gain(ax7, 100e3, 1500, 47e-6, 100e-9, 1e6), gain(au7, 33e3, 1000, 100e-6, 220e-9, 470e3), toTriode300B(470e-9, 20)],
};

/** Two 12AX7 stages and a 12AU7 driving the 300B: gain enough for the supply's loop to matter. */
const fourStages: ChainInput = {
  source: { rsource: 1e3 },
  stages: [gain(ax7, 100e3, 1500, 220e-6, 100e-9, 1e6), gain(ax7, 100e3, 1500, 220e-6, 100e-9, 470e3), gain(au7, 33e3, 1000, 220e-6, 100e-9, 470e3), toTriode300B(100e-9, 30)],
};

const followerDriven: ChainInput = {
  source: { rsource: 600 },
  stages: [
    gain(at7, 56e3, 820, 100e-6, 220e-9, 680e3),
    { kind: 'follower', tube: au7, bplus: 300, rk: 27e3, coupling: { kind: 'direct' } },
    toTriode300B(1e-6, 20),
  ],
};

const supplyOf = (input: SupplyDesign['input'], sections: SupplyDesign['sections']): SupplyDesign => ({
  mainsHz: 50, secondaryRms: 330, windingOhms: 40, rectifier: { kind: 'silicon-full-wave' }, input, sections, loads: new Array<number>(sections.length + 1).fill(0),
});

/** `oscillates`: the loop through the supply is unstable (the model's verdict, and ngspice's transient keeps swinging after a kick). */
/** `moves`: the ladder moves the low corner more than 3 % from the amplifier's own (so the check is not one an ideal supply passes). */
const cases: { label: string; on: AmplifierOnSupply; oscillates: boolean; moves?: false }[] = [
  {
    label: 'a decoupling ladder, each stage on its own node (12AX7 on the last, 12AU7 one up, the 300B after the choke)',
    on: { amplifier: threeStages, supply: supplyOf({ kind: 'capacitor', c: 100e-6 }, [{ kind: 'lc', l: 5, rdc: 100, c: 100e-6 }, { kind: 'rc', r: 2.2e3, c: 47e-6 }, { kind: 'rc', r: 10e3, c: 22e-6 }]), feeds: [3, 2, 1] },
    oscillates: false,
  },
  {
    label: 'four stages: the two 12AX7s on one node behind 4.7 kΩ and 10 µF, the 12AU7 one up, the 300B on the reservoir (it motorboats)',
    on: { amplifier: fourStages, supply: supplyOf({ kind: 'capacitor', c: 100e-6 }, [{ kind: 'rc', r: 470, c: 47e-6 }, { kind: 'rc', r: 4.7e3, c: 10e-6 }]), feeds: [2, 2, 1, 0] },
    oscillates: true,
  },
  {
    label: 'four stages all on one node (no decoupling: the supply sets the low end near 500 Hz, and it motorboats)',
    on: { amplifier: fourStages, supply: supplyOf({ kind: 'capacitor', c: 100e-6 }, [{ kind: 'rc', r: 1e3, c: 47e-6 }]), feeds: [1, 1, 1, 1] },
    oscillates: true,
  },
  {
    label: 'four stages on a ladder of three sections, the first stage on the last',
    on: { amplifier: fourStages, supply: supplyOf({ kind: 'capacitor', c: 100e-6 }, [{ kind: 'rc', r: 1e3, c: 47e-6 }, { kind: 'rc', r: 10e3, c: 47e-6 }, { kind: 'rc', r: 22e3, c: 22e-6 }]), feeds: [3, 2, 1, 0] },
    oscillates: false,
    moves: false,
  },
  {
    label: 'a choke input, a follower direct-coupled between the gain stage and the 300B',
    on: { amplifier: followerDriven, supply: supplyOf({ kind: 'choke', l: 10, rdc: 150, c: 47e-6 }, [{ kind: 'rc', r: 1e3, c: 22e-6 }, { kind: 'rc', r: 8.2e3, c: 4.7e-6 }]), feeds: [2, 2, 0] },
    oscillates: false,
  },
];

/** The largest swing of the output about its mean over [a, b) seconds of ngspice's transient. */
function swingBetween(data: string, a: number, b: number): number {
  const xs = data.trim().split('\n').map((l) => l.trim().split(/\s+/).map(Number)).filter((r) => r[0]! >= a && r[0]! < b).map((r) => r[1]!);
  const mean = xs.reduce((p, q) => p + q, 0) / xs.length;
  return Math.max(...xs.map((x) => Math.abs(x - mean)));
}

/** ngspice's rise above its 1 kHz response below the band, dB: the largest sample, refined by a parabola in log f. */
function simulatedPeak(data: string): number {
  const rows = data.trim().split('\n').map((l) => l.trim().split(/\s+/).map(Number)).map((c) => ({ f: c[0]!, m: c[1]! }));
  const ref = rows.reduce((best, r) => (Math.abs(Math.log(r.f / 1000)) < Math.abs(Math.log(best.f / 1000)) ? r : best)).m;
  let k = 0;
  rows.forEach((r, i) => {
    if (r.f < 1000 && r.m > rows[k]!.m) k = i;
  });
  if (k === 0 || rows[k]!.m <= ref) return 0;
  const [a, b, c] = [rows[k - 1]!, rows[k]!, rows[k + 1]!].map((r) => 20 * Math.log10(r.m / ref));
  return b! + ((a! - c!) ** 2) / (8 * (2 * b! - a! - c!));
}

/**
 * The model's low end for an amplifier on its supply, and ngspice's runs of the same circuit with the ladder in it
 * (each stage's B+ an ammeter to its node; the nodes fed from the reservoir's DC plus the drop in the source
 * resistance the model takes): the AC sweep, and the transient kicked at the input, 8 s.
 */
function bothWays(on: AmplifierOnSupply) {
  const r = solveOnSupply(on);
  if (!r.ok) throw new Error(r.message);
  const low = supplyLowEnd(on, r);
  if (!low.ok) throw new Error(low.message);
  const ladder = ladderOf(on, r);
  const v0 = r.supply.nodes[0]!.dc + r.loads.reduce((a, x) => a + x, 0) * ladder.sourceOhms;
  const placed = placedOnSupply(on.amplifier, r.bplus, r.screenVolts);
  return {
    low,
    // A pentode's screens fed straight from a node hang from it in ngspice's circuit, as built.
    sweep: () => runNgspiceFull(chainNetlist(placed, { kind: 'sweep' }, { ...ladderSupply({ ladder, v0 }), screenFeeds: on.screenFeeds })).data,
    kick: () => runNgspiceFull(chainNetlist(placed, { kind: 'kick', seconds: 8 }, { ...ladderSupply({ ladder, v0 }), screenFeeds: on.screenFeeds })).data,
  };
}

describe.runIf(run)('the amplifier\'s low end through its supply, against ngspice', () => {
  it.each(cases)('$label', ({ on, oscillates, moves }) => {
    const { low, sweep, kick } = bothWays(on);
    const data = sweep();
    const sim = simulatedCorners(data, 1000);
    expectClose(low.lowHz!, sim.low!, { rel: 0.03 }, 'low −3 dB point with the ladder');
    expect(Math.abs(low.peakDb - simulatedPeak(data))).toBeLessThan(0.5);
    // Where the ladder matters, the amplifier's own corner (every node at signal ground) misses ngspice's by more.
    if (moves !== false) expect(Math.abs(low.idealLowHz! / sim.low! - 1)).toBeGreaterThan(0.03);
    // Stability: ngspice's transient after a 20 ms kick at the input, 8 s long. A stable loop's swing dies away (by
    // ten times from the second second to the eighth); an unstable one grows to a limit and keeps swinging.
    const kicked = kick();
    const early = swingBetween(kicked, 1, 2);
    const late = swingBetween(kicked, 7, 8);
    expect(low.unstablePoles! > 0).toBe(oscillates);
    if (oscillates) {
      expect(late).toBeGreaterThan(1);
      expect(late).toBeGreaterThan(0.5 * early);
      expect(low.findings.map((f) => [f.kind, f.severity])).toEqual([['supply-coupling', 'danger']]);
    } else {
      expect(late).toBeLessThan(0.1 * early);
      expect(low.findings.filter((f) => f.severity === 'danger')).toEqual([]);
    }
  });

  // The workbench's own demo (a single-ended ultralinear EL34). Its screen sits on the primary's tap, which moves with
  // the plate's supply node: the network takes the screen's voltage from the node and the plate, the plate current's
  // pull by it, and the screen's current not coupled through the tap's turns drawn from the node (LinearStage.screen).
  // Held as the triode amplifiers are, within 3 %, the verdict exactly. With the screen's current taken at signal
  // ground the 2000 H corner read 15.2 % low (a listed miss); with that current alone drawn from the node, 9.1 % low,
  // and the loop with node 4 at 47 µF and a 2000 H primary, stable and thin by ngspice's kick (its swing dies away some
  // 28 times from the second second to the eighth), read unstable: that case stands here to catch half a model.
  // Pentode-connected with the screen fed straight from node 3, ngspice hangs the screen on that node, as built, and
  // so does the network; on a dropper, the screen is at signal ground behind its bypass in both (ngspice holds it on a
  // DC source; giving the network the screen's slopes there too moved the corner by 0.001 %, so it has none).
  it.each([
    // As it opens its transformer is ideal; ngspice's stands in with 10 kH, not ideal at a few hertz: both take 2000 H here.
    { key: 'ideal-ish', label: 'the demo (220 µF on the voltage stages\' node 4), its primary 2000 H, as near ideal as its box allows: stable, if thin', lp: 2000, node4: null, oscillates: false, thin: true },
    { key: '20H', label: 'the demo with a 20 H primary: stable, thin', lp: 20, node4: null, oscillates: false, thin: true },
    { key: '20H-47u', label: 'the same with 47 µF on node 4: it motorboats', lp: 20, node4: 47e-6, oscillates: true, thin: null },
    { key: '2000H-47u', label: 'the demo with node 4 at the 47 µF it first had, its primary 2000 H: stable, thin', lp: 2000, node4: 47e-6, oscillates: false, thin: true },
    { key: '200H-47u', label: 'the same with a 200 H primary: it motorboats', lp: 200, node4: 47e-6, oscillates: true, thin: null },
    { key: '20H-100u', label: 'the demo with a 20 H primary and 100 µF on node 4: it motorboats', lp: 20, node4: 100e-6, oscillates: true, thin: null },
    { key: 'pentode-dropper', label: 'the demo\'s EL34 pentode-connected, its screen on a dropper from the plates\' node (at signal ground behind its bypass; ngspice\'s on a DC source), a 20 H primary: stable, thin', lp: 20, node4: null, oscillates: false, thin: true, pentode: true },
    { key: 'pentode', label: 'the demo\'s EL34 pentode-connected, its screen fed straight from node 3, a 20 H primary: stable, thin', lp: 20, node4: null, oscillates: false, thin: true, screensFrom: 2 },
  ])('$label', ({ key, lp, node4, oscillates, thin, screensFrom, pentode }: { key: string; lp: number; node4: number | null; oscillates: boolean; thin: boolean | null; screensFrom?: number; pentode?: boolean }) => {
    const sections = DEMO_DESIGN.supply.sections.map((x, k) => (k === 2 && node4 !== null ? { ...x, c: node4 } : x));
    const supply = { ...DEMO_DESIGN.supply, sections, ...(screensFrom === undefined ? {} : { feeds: { ...DEMO_DESIGN.supply.feeds, screens: screensFrom } }) };
    const output = { ...DEMO_DESIGN.output, primaryInductance: lp, ...(screensFrom === undefined && !pentode ? {} : { connection: 'pentode' as const }) };
    const design = { ...DEMO_DESIGN, supply, output };
    const on = onSupplyInputOf(design, LIBRARY_TUBES)!.input;
    const { low, sweep, kick } = bothWays(on);
    const sim = simulatedCorners(sweep(), 1000);
    // The case is what it says: the screens on node 3 where it names them, else on the tap.
    expect(on.screenFeeds?.at(-1) ?? null).toBe(screensFrom ?? null);
    expectClose(low.lowHz!, sim.low!, { rel: 0.03 }, `low −3 dB point (${key})`);
    expect(low.unstablePoles! > 0).toBe(oscillates);
    // Under 10 dB of gain margin round the loop (the model's own reading, the same count with the loop's gain raised).
    expect(low.thinLoop).toBe(thin);
    const kicked = kick();
    const [early, late] = [swingBetween(kicked, 1, 2), swingBetween(kicked, 7, 8)];
    if (oscillates) expect(late).toBeGreaterThan(early);
    else expect(late).toBeLessThan(0.1 * early);
  });
});
