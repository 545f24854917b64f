import { bleederForSupply, checkBiasSupply, checkSupply, MAX_CHANNELS, type AmplifierOnSupply, type BiasSupplyDesign, type FilterSection, type Rectifier, type SupplyDesign, type Failure } from '../../src/index';
import { chainInputOf, type ChainCardName } from './amplifierChain';
import { screensOnNode } from './outputPlan';
import type { BenchDesign } from './analysis';
import type { TubeRegistry } from './tubeRegistry';
import { nodeOfStage, voltageStages } from './stagePlans';
import { elevationPlanOf } from './elevationPlan';

/**
 * The B+ supply as the bench holds it: the transformer, rectifier and filter
 * (the model's SupplyDesign without the loads, which the amplifier's stages
 * draw), which node feeds which stage, and what the parts are rated for.
 */
export interface SupplyPlan {
  /** Solve the amplifier on this supply: every stage at the voltage its node delivers. */
  readonly on: boolean;
  readonly mainsHz: number;
  /** The nominal mains voltage, V rms: what the primary's current and fuse are worked out at. */
  readonly mainsVolts: number;
  /** Secondary rms voltage (each half of a centre-tapped winding), V. */
  readonly secondaryRms: number;
  readonly windingOhms: number;
  readonly rectifier: Rectifier;
  readonly input: SupplyDesign['input'];
  readonly sections: readonly FilterSection[];
  /**
   * The node (0 the reservoir, then one per section) feeding the output stage, the one feeding the voltage stages, the
   * one feeding a driven pair's phase splitter (absent: the voltage stages' node, as before the splitter had its own),
   * and the one feeding a pentode-connected output stage's screens straight (absent: its plates' node, through a
   * dropper when they sit lower).
   */
  readonly feeds: { readonly output: number; readonly voltage: number; readonly splitter?: number; readonly screens?: number };
  /** Identical channels on the supply (2 for stereo). */
  readonly channels: number;
  /** The stages' B+ follow what their nodes deliver (set after each solve); false: the B+ are typed, and shown beside the nodes'. */
  readonly follow: boolean;
  /** The secondary's rated current, A (each half of a centre-tapped winding): its voltage is stated at it, and its current is checked against it; null when not known. */
  readonly secondaryAmps: number | null;
  /** The winding's regulation (a fraction), in place of its resistance; needs the rated current; null to give the resistance. */
  readonly regulation: number | null;
  /** The most ripple (rms) the voltage stages' node may carry, V; null for no budget. */
  readonly humRms: number | null;
  /** A fixed-bias output stage's grid supply (its winding, one diode, reservoir and one R–C section); used only while the output stage is fixed-bias. */
  readonly bias: BiasPlan;
}

/** The bias supply as the bench holds it: the model's BiasSupplyDesign on the plan's own mains. */
export type BiasPlan = Omit<BiasSupplyDesign, 'mainsHz'>;

/**
 * The bias supply a plan opens with, of our own: a 50 V winding (or tap) of
 * 150 Ω into 47 µF, then 4.7 kΩ into 100 µF. Two 1 mA strings leave a rail
 * near −57 V, enough for the library's pentodes at their fixed-bias
 * examples, and under 1 mV rms of ripple on it.
 */
export const DEMO_BIAS: BiasPlan = { secondaryRms: 50, windingOhms: 150, reservoir: 47e-6, r: 4700, c: 100e-6 };

/** The model's bias supply for a plan: its bias values on the plan's mains. */
export const biasDesignOf = (p: SupplyPlan): BiasSupplyDesign => ({ ...p.bias, mainsHz: p.mainsHz });

/**
 * The supply the bench opens on, of our own: 248 V a side at 200 mA, full wave with
 * silicon diodes into a 100 µF reservoir; a 5 H, 100 Ω choke and 100 µF feed the
 * single-ended output stage (its primary carries the ripple to the speaker: on the
 * reservoir alone the demo hummed at about 120 mV, with the choke under 1 mV;
 * common practice for a single-ended stage), then 1 kΩ (the splitter's node when a
 * pair is chosen) and 9.1 kΩ sections, 47 µF and then 220 µF, down to the voltage
 * stages, chosen so the nodes deliver the demo's own B+ (330 V and 275 V, each
 * within a volt, with the bleeder's 10 mA drawn too); the voltage stages' 220 µF keeps the loop through the supply
 * 10 dB from oscillating (at 47 µF it had under 3.5 dB, and with a real 20 H
 * primary it motorboated: supplyLowEnd, held to ngspice); a
 * 200 mA winding, and a hum budget of 5 mV rms on the input stage's node (common
 * practice for a quiet first stage).
 */
export const DEMO_SUPPLY: SupplyPlan = {
  on: true,
  mainsHz: 50,
  mainsVolts: 230,
  secondaryRms: 248,
  windingOhms: 35,
  rectifier: { kind: 'silicon-full-wave' },
  input: { kind: 'capacitor', c: 100e-6 },
  sections: [{ kind: 'lc', l: 5, rdc: 100, c: 100e-6 }, { kind: 'rc', r: 1000, c: 47e-6 }, { kind: 'rc', r: 9.1e3, c: 220e-6 }],
  feeds: { output: 1, voltage: 3 },
  channels: 1,
  follow: false,
  secondaryAmps: 0.2,
  regulation: null,
  humRms: 0.005,
  bias: DEMO_BIAS,
};

/** The model's supply for a plan, drawing nothing of its own (the stages' currents are added when it is solved); the hum budget is held at `humNode` (the first stage's). */
export function supplyDesignOf(p: SupplyPlan, humNode = p.feeds.voltage): SupplyDesign {
  const nodes = p.sections.length + 1;
  const ratings = {
    ...(p.secondaryAmps !== null ? { secondaryAmps: p.secondaryAmps } : {}),
    ...(p.humRms !== null ? { hum: { node: humNode, maxRippleRms: p.humRms } } : {}),
  };
  return {
    mainsHz: p.mainsHz,
    secondaryRms: p.secondaryRms,
    windingOhms: p.windingOhms,
    ...(p.secondaryAmps !== null ? { ratedAmps: p.secondaryAmps } : {}),
    ...(p.regulation !== null ? { regulation: p.regulation } : {}),
    rectifier: p.rectifier,
    input: p.input,
    sections: p.sections,
    loads: new Array<number>(nodes).fill(0),
    ...(Object.keys(ratings).length > 0 ? { ratings } : {}),
  };
}

/** The plan's first problem (the model's check, then the feeds and channels), or null. */
export function checkPlan(p: SupplyPlan): Failure | null {
  const problem = checkSupply(supplyDesignOf(p));
  if (problem) return problem;
  if (!(typeof p.mainsVolts === 'number' && p.mainsVolts >= 50 && p.mainsVolts <= 300)) return { ok: false, reason: 'invalid-input', message: 'The mains voltage must be from 50 V to 300 V', field: 'mainsVolts' };
  const bias = checkBiasSupply(biasDesignOf(p));
  if (bias) return { ...bias, field: `bias.${bias.field}` };
  const nodes = p.sections.length + 1;
  for (const which of ['output', 'voltage', 'splitter', 'screens'] as const) {
    const k = p.feeds[which];
    if (k === undefined && (which === 'splitter' || which === 'screens')) continue;
    const name = which === 'splitter' ? 'phase splitter' : which === 'screens' ? 'output stage\'s screens' : `${which} stage`;
    if (!Number.isInteger(k) || k! < 0 || k! >= nodes) return { ok: false, reason: 'invalid-input', message: `The ${name}'s node must be 1 to ${nodes}`, field: `feeds.${which}` };
  }
  if (!Number.isInteger(p.channels) || p.channels < 1 || p.channels > MAX_CHANNELS) {
    return { ok: false, reason: 'invalid-input', message: `Channels must be a whole number from 1 to ${MAX_CHANNELS}`, field: 'channels' };
  }
  return null;
}

/** A gain stage fed from a node the supply does not have, named by its place (a file's, or a plan whose sections went); null when every one is there. */
export function checkStageNodes(d: BenchDesign): Failure | null {
  const nodes = d.supply.sections.length + 1;
  const list = voltageStages(d);
  for (const [i, p] of list.entries()) {
    if (p.kind !== 'common-cathode' || p.node === undefined) continue;
    if (!Number.isInteger(p.node) || p.node < 0 || p.node >= nodes) return { ok: false, reason: 'invalid-input', message: `Stage ${i + 1}'s node must be 1 to ${nodes}`, field: `feeds.stage.${i}` };
  }
  return null;
}

/** Which node feeds a stage of the amplifier: the output stage's, the splitter's, or the voltage stages' (each gain stage may have its own: nodeOfStage). */
export const nodeOf = (p: SupplyPlan, role: 'voltage' | 'splitter' | 'output') =>
  role === 'output' ? p.feeds.output : role === 'splitter' ? (p.feeds.splitter ?? p.feeds.voltage) : p.feeds.voltage;

/**
 * The plan with a node for a splitter that has none yet: the node before the
 * voltage stages', when there is one after the output stage's (common
 * practice: the splitter hangs from the decoupling between the output's node
 * and the input stages', so it sees more of the B+ than they do and its
 * current does not pass through their last filter resistor); else theirs.
 */
export function withSplitterFed(p: SupplyPlan): SupplyPlan {
  if (p.feeds.splitter !== undefined) return p;
  const before = p.feeds.voltage - 1;
  return { ...p, feeds: { ...p.feeds, splitter: before > p.feeds.output ? before : p.feeds.voltage } };
}

/** The heater elevation divider as a load on the supply: its node (the gain stage's it hangs from) and its current, A; null with none. */
export function elevationLoadOf(d: BenchDesign): { node: number; amps: number } | null {
  const plan = elevationPlanOf(d);
  return plan?.divider.ok ? { node: nodeOfStage(d, voltageStages(d), plan.stage), amps: plan.divider.amps } : null;
}

/** The amplifier as the chain strip shows it, on the plan's supply: each stage fed from its node, and the output stage's screens from theirs. */
export function onSupplyInputOf(d: BenchDesign, registry: TubeRegistry): { input: AmplifierOnSupply; names: readonly ChainCardName[] } | null {
  const chain = chainInputOf(d, registry);
  if (!chain) return null;
  const p = d.supply;
  const list = voltageStages(d);
  const feeds = chain.names.map((n) => (n.role === 'voltage' && n.voltageIndex !== null ? nodeOfStage(d, list, n.voltageIndex) : nodeOf(p, n.role)));
  // The hum budget is the first stage's: the one whose ripple every stage after it amplifies.
  const first = chain.names.findIndex((n) => n.role === 'voltage');
  const screens = screensOnNode(d) ? { screenFeeds: chain.names.map((n) => (n.role === 'output' ? p.feeds.screens! : null)) } : {};
  const planned = supplyDesignOf(p, first < 0 ? p.feeds.voltage : feeds[first]!);
  // The heater elevation's divider draws its fraction of a milliamp from its gain stage's node: one of the supply's own loads.
  const held = elevationLoadOf(d);
  const supply = held ? { ...planned, loads: planned.loads.map((a, k) => (k === held.node ? a + held.amps : a)) } : planned;
  // The bleeder the capacitors need is known from the design: the solve carries its current at the reservoir.
  const bleeder = bleederForSupply(supply);
  const bleederOhms = bleeder.ok && bleeder.needed ? { bleederOhms: bleeder.ohms } : {};
  return { input: { amplifier: chain.input, supply, feeds, ...screens, channels: p.channels, ...bleederOhms }, names: chain.names };
}
