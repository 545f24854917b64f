import { describe, expect, it } from 'vitest';
import { amplifierOnSupplyNetlist, analyzePushPull, findOutputTube, findTube, globalFeedback, humOnSupply, pairBiasSupply, solveOnSupply, type AmplifierOnSupply, type BiasSupplyDesign, type ChainInput, type PushPullLink, type SupplyDesign } from '../../src/index';
import type { NetlistBias } from '../../src/netlist/biasCircuit';
import { placedOnSupply } from '../../src/chain/solveOnSupply';
import { settlingNote } from '../../src/netlist/benchSupply';
import { expectClose } from '../helpers/expectClose';
import { fourierTable, ngspiceGate, runNgspiceFull } from './ngspice';
import { el34Pair, pushPullInput } from './pushPullAmplifiers';
import { DEMO_DESIGN } from '../../app/store/demoDesign';
import { onSupplyInputOf } from '../../app/store/supplyPlan';
import { LIBRARY_TUBES } from '../../app/store/tubeRegistry';

// The netlist a builder exports with the amplifier's own supply in it, run as written by ngspice (the outside
// reference), the only change a `quit 0` so a batch run exits. Asked of it: the operating point at every plate,
// cathode and supply node within 0.5 % of the model's amplifier on its supply (solveOnSupply), which the start path
// holds; after ten mains cycles on the rectifier alone, every node's mean over the last cycle within 0.5 % of the
// model's and the ripple within 5 % where it is 50 mV or more and the file's head does not call its node unsettled, the rectifier's peak current within 5 %; and the
// output's 1 kHz row of the Fourier analysis (whose window holds whole cycles of the hum, so the hum's rows stand
// apart) within 1 % of the model's midband gain, or of the closed loop's with feedback; and the hum in those rows
// against the model's (humOnSupply) where one settled stage carries it. The designs are our own.
const run = ngspiceGate();

const at7 = findTube('12AT7')!;
const au7 = findTube('12AU7')!;

const seTriode: ChainInput = {
  source: { rsource: 600 },
  stages: [
    { kind: 'common-cathode', tube: at7, bplus: 300, ra: 56e3, rk: 820, bypassed: true, ck: 100e-6, coupling: { kind: 'capacitor', cc: 220e-9, rg: 680e3 } },
    { kind: 'follower', tube: au7, bplus: 300, rk: 27e3, coupling: { kind: 'direct' } },
    {
      kind: 'single-ended-output', tube: findOutputTube('300B')!, connection: 'triode', bplus: 400, screenVolts: 400, ulTap: 0.4, zPrimary: 3500, rPrimary: 120, primaryInductance: 20,
      bias: 'cathode', rk: 1200, vg: -70, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 1e-6, rg: 220e3 },
    },
  ],
};

const seUltralinear: ChainInput = {
  source: { rsource: 600 },
  stages: [
    { kind: 'common-cathode', tube: at7, bplus: 300, ra: 56e3, rk: 820, bypassed: false, coupling: { kind: 'capacitor', cc: 470e-9, rg: 680e3 } },
    { kind: 'follower', tube: au7, bplus: 300, rk: 27e3, coupling: { kind: 'direct' } },
    {
      kind: 'single-ended-output', tube: findOutputTube('EL34')!, connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3300, rPrimary: 120,
      bias: 'cathode', rk: 330, ck: 220e-6, vg: -20, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 330e-9, rg: 270e3 },
    },
  ],
};

const pushPullPentode: ChainInput = {
  source: { rsource: 600 },
  stages: [
    pushPullInput,
    { kind: 'long-tailed-pair', tube: au7, bplus: 400, ra: 47e3, ra2: 51e3, rk: 470, rtail: 15e3, vbias: 80, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    el34Pair,
  ],
};

const supply = (over: Partial<SupplyDesign>): SupplyDesign => ({
  mainsHz: 50, secondaryRms: 330, windingOhms: 40, rectifier: { kind: 'silicon-full-wave' }, input: { kind: 'capacitor', c: 100e-6 }, sections: [], loads: [], ...over,
});

/** The pair behind a 5AR4 into a choke input: the input stage on the last node, the splitter one up, the screens on node 2. */
const pairOnChoke: AmplifierOnSupply = {
  amplifier: pushPullPentode,
  supply: supply({ secondaryRms: 480, windingOhms: 60, rectifier: { kind: 'tube', tubeId: '5AR4' }, input: { kind: 'choke', l: 10, rdc: 100, c: 47e-6 }, sections: [{ kind: 'rc', r: 1e3, c: 47e-6 }, { kind: 'rc', r: 4.7e3, c: 22e-6 }, { kind: 'rc', r: 22e3, c: 22e-6 }], loads: [0, 0, 0, 0] }),
  feeds: [3, 2, 0],
  screenFeeds: [null, null, 1],
};

/** The pair's grid supply as the workbench solves it for the pair at its nodes (pairBiasSupply): a 60 V tap, half wave. */
const gridSupply: BiasSupplyDesign = { mainsHz: 50, secondaryRms: 60, windingOhms: 100, reservoir: 100e-6, r: 10e3, c: 47e-6 };
function pairBias(on: AmplifierOnSupply): NetlistBias {
  const solved = solveOnSupply(on);
  if (!solved.ok) throw new Error(solved.message);
  const stage = placedOnSupply(on.amplifier, solved.bplus, solved.screenVolts).stages[2] as PushPullLink;
  const { kind: _k, tube, coupling, ...parts } = stage;
  const analysis = analyzePushPull(tube, { ...parts, tubeId: tube.id, rg: coupling.kind === 'capacitor' ? coupling.rg : 220e3 });
  if (!analysis.ok) throw new Error(analysis.message);
  const bias = pairBiasSupply(analysis, gridSupply);
  if (!bias.ok) throw new Error(bias.message);
  return { design: gridSupply, solved: bias };
}

/** The amplifier on its supply with the output stage's leak raised by `ohms`, solved. */
function withLeak(on: AmplifierOnSupply, ohms: number) {
  const stages = on.amplifier.stages.map((s) => (s.kind === 'push-pull-output' && s.coupling.kind === 'capacitor' ? { ...s, coupling: { ...s.coupling, rg: s.coupling.rg + ohms } } : s));
  const solved = solveOnSupply({ ...on, amplifier: { ...on.amplifier, stages } });
  if (!solved.ok) throw new Error(solved.message);
  return solved;
}

const cases: { label: string; on: AmplifierOnSupply; feedback?: number; bias?: (on: AmplifierOnSupply) => NetlistBias; check?: { hum: boolean } }[] = [
  {
    label: 'two channels of common cathode → follower → single-ended 300B, silicon full wave, two R–C sections, a 47 kΩ bleeder',
    on: { amplifier: seTriode, supply: supply({ sections: [{ kind: 'rc', r: 1e3, c: 47e-6 }, { kind: 'rc', r: 8.2e3, c: 22e-6 }], loads: [0, 0, 0] }), feeds: [2, 2, 0], channels: 2, bleederOhms: 47e3 },
    check: { hum: true },
  },
  {
    label: 'the same, its 300B on the first R–C section\u2019s node (a fortieth of the hum there: the quieter node)',
    on: { amplifier: seTriode, supply: supply({ sections: [{ kind: 'rc', r: 1e3, c: 47e-6 }, { kind: 'rc', r: 8.2e3, c: 22e-6 }], loads: [0, 0, 0] }), feeds: [2, 2, 1], channels: 2 },
    check: { hum: true },
  },
  {
    label: 'common cathode → long-tailed pair → push-pull EL34 (pentode, fixed bias, screens on a node of their own), 5AR4 into a choke input',
    on: pairOnChoke,
  },
  {
    label: 'the same pair with its grid supply in the circuit: a 60 V tap, half wave, each grid on its adjustment\u2019s wiper',
    on: pairOnChoke,
    bias: pairBias,
  },
  {
    label: 'common cathode → follower → single-ended EL34 (ultralinear) with 22 kΩ of feedback, a silicon bridge at 60 Hz, an L–C and an R–C section, 10 mA drawn by something else',
    on: { amplifier: seUltralinear, supply: supply({ mainsHz: 60, secondaryRms: 250, windingOhms: 20, rectifier: { kind: 'silicon-bridge' }, sections: [{ kind: 'lc', l: 5, rdc: 120, c: 100e-6 }, { kind: 'rc', r: 4.7e3, c: 47e-6 }], loads: [0.01, 0, 0] }), feeds: [2, 2, 1] },
    feedback: 22e3,
  },
  // The workbench's own demo, as its export writes it.
  { label: 'the demo amplifier on its own supply', on: onSupplyInputOf(DEMO_DESIGN, LIBRARY_TUBES)!.input },
];

/** ngspice's `meas` lines: "sn0_avg = 4.31e+02 from= … to= …". */
function measured(output: string): Record<string, number> {
  const out: Record<string, number> = {};
  for (const m of output.matchAll(/^(sn\d+_avg|sn\d+_pp|rect_peak|brail_avg|brail_pp|bw\d+_avg)\s*=\s*([-+]?\d[\d.]*(?:e[-+]?\d+)?)/gim)) out[m[1]!.toLowerCase()] = Number(m[2]);
  return out;
}

describe.runIf(run)('the exported netlist with its supply, run by ngspice as written', () => {
  it.each(cases.map((c) => [c.label, c] as const))('%s', (_label, c) => {
    const model = solveOnSupply(c.on);
    if (!model.ok) throw new Error(model.message);
    // A hundredth of the clean limit's input: the stages stay at idle, where the supply was solved. Driven harder, a
    // pair's screens (and a class AB pair's plates) draw more on average and the supply sags toward where
    // atFullPower puts it: at a tenth, the EL34 pair's screens drew 2 mA more and the gain read 1.6 % low.
    const peak = 0.01 * model.amplifier.inputPeak;
    const bias = c.bias?.(c.on) ?? null;
    const net = amplifierOnSupplyNetlist(c.on, { title: 'on its supply', inputPeak: peak, feedback: c.feedback ? { rf: c.feedback, cf: null } : null }, bias);
    if (!net.ok) throw new Error(net.message);
    expect(net.text).not.toMatch(/NaN|Infinity|undefined/);
    // Every stage's B+ is drawn from its node; no stage keeps a DC source of its own. A bleeder is the resistor it is.
    expect(net.text).not.toMatch(/^VB\d+ \S+ 0 DC/m);
    if (c.on.bleederOhms !== undefined) expect(net.text).toMatch(/^RBLEED sn0 0 /m);
    const r = runNgspiceFull(net.text.replace(/^\.endc$/m, 'quit 0\n.endc'));
    const open = c.feedback ? globalFeedback(placedOnSupply(c.on.amplifier, model.bplus, model.screenVolts), c.feedback) : null;
    if (open && !open.ok) throw new Error(open.message);
    // With feedback, Rf's DC path joins the first cathode's resistor: the operating point is the open loop's.
    const stages = open?.ok ? open.open.stages : model.amplifier.stages;
    stages.forEach((st, i) => {
      expectClose(st.pins.plate, r.values[`p${i}`]!, { rel: 0.005 }, `stage ${i + 1} plate`);
      expectClose(st.pins.cathode, r.values[`k${i}`]!, { rel: 0.005 }, `stage ${i + 1} cathode`);
    });
    const sim = measured(r.output);
    // The ripple is held only where the file's head does not say its node is still settling (settlingNote).
    const settled = settlingNote(c.on.supply, 10 / c.on.supply.mainsHz);
    expect(settled.note === null || net.text.includes(settled.note)).toBe(true);
    model.supply.nodes.forEach((n, k) => {
      expectClose(n.dc, r.values[`sn${k}`]!, { rel: 0.005 }, `node ${k} at the operating point`);
      expectClose(n.dc, sim[`sn${k}_avg`]!, { rel: 0.005 }, `node ${k}'s mean on the rectifier`);
      if (n.ripplePp >= 0.05 && (settled.from === null || k < settled.from)) expectClose(n.ripplePp, sim[`sn${k}_pp`]!, { rel: 0.05 }, `node ${k}'s ripple`);
    });
    expectClose(model.supply.rectifierPeak, sim.rect_peak!, { rel: 0.05 }, 'rectifier peak current');
    if (bias) {
      // The grids sit at the wipers, set for the law's own tube; the rail where the model puts it, at idle and on its rectifier.
      expect(net.text).not.toMatch(/^VGB2 /m);
      const nominal = -bias.solved.taps[0]!.nominal;
      for (const grid of ['g2', 'g2b']) expectClose(nominal, r.values[grid]!, { rel: 0.005 }, `${grid} at the operating point`);
      expectClose(-bias.solved.rail, r.values.brail!, { rel: 0.005 }, 'bias rail at the operating point');
      expectClose(-bias.solved.rail, sim.brail_avg!, { rel: 0.005 }, 'bias rail on its rectifier');
      expectClose(nominal, sim.bw0_avg!, { rel: 0.005 }, 'first wiper on the rectifier');
    }
    const base = c.on.supply.mainsHz === 60 ? 20 : 50;
    const fundamental = fourierTable(r.output).get(1000 / base)!.magnitude;
    // On the bias supply each leak returns through its wiper's resistance (the rail's capacitor its AC ground), which
    // the chain's figures leave out: the model is given that leak, Rg plus the wiper's, for the gain (left at Rg
    // alone, ngspice's reads 1.05 % high).
    const gain = bias ? Math.abs(withLeak(c.on, bias.solved.taps[0]!.sourceOhms).amplifier.gain) : open?.ok ? open.closedGain : Math.abs(model.amplifier.gain);
    expectClose(gain, fundamental / peak, { rel: 0.01 }, 'gain at 1 kHz');
    // The hum: the Fourier rows below 1 kHz (whole cycles of the ripple in the window) against the model's bound, the
    // stages' shares added as if in phase (humOnSupply), where one stage carries nearly all of it from a node the head
    // does not call unsettled: within 2 %. (Where a node still settles, its slow swing leaks into those rows: the demo's
    // read 4 % over the bound, the pair's twenty times its near-nothing.)
    const hum = humOnSupply(c.on, model);
    if (!hum.ok) throw new Error(hum.message);
    expect(net.text).toContain(`the hum at the output, at most ${hum.bound.toPrecision(3)} V rms`);
    const rows = [...fourierTable(r.output)].filter(([k]) => k > 0 && k * base < 1000);
    const simulatedHum = Math.sqrt(rows.reduce((a, [, row]) => a + row.magnitude ** 2 / 2, 0));
    const shares = hum.volts.map((v) => v ?? 0);
    const main = shares.indexOf(Math.max(...shares));
    if (c.check?.hum) {
      expect(shares[main]!).toBeGreaterThanOrEqual(0.95 * hum.bound);
      expect(settled.from === null || c.on.feeds[main]! < settled.from).toBe(true);
      expectClose(hum.bound, simulatedHum, { rel: 0.02 }, 'hum at the output');
    }
  }, 180_000);
});
