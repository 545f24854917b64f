import { pairDefaults, type OutputPair, type OutputPlan, type SplitterPlan } from '../store/outputPlan';
import { findOutputTube, findTube, TABLE_THD, type Connection, type FollowerCoupling, type OutputDesign, type PreferredSeries } from '../../src/index';
import { DEMO_DESIGN } from '../store/demoDesign';
import { NO_TARGETS, type TargetPlan } from '../store/targetPlan';
import type { BenchDesign, Stage2Design } from '../store/analysis';
import { BENCH_STAGE, firstProblem, FOLLOWER_STAGE, GAIN_STAGE, HEATERS, JOIN, OUTPUT_STAGE, OUTPUT_READINGS, quote, READINGS, STAGE_KIND } from './designSchema';
import type { MeterPlan, OutputMeterPlan } from '../store/meterPlan';
import { readSupplyPlan } from './supplyInFile';
import { DEFAULT_HEATERS, type HeaterChoice } from '../store/heaterChoice';
import type { TubeRegistry } from '../store/tubeRegistry';
import { MAX_VOLTAGE_STAGES, normalized, type StagePlan } from '../store/stagePlans';

/**
 * Quiescent's design file: our own JSON format, versioned.
 *
 *   { "format": "quiescent-design", "version": 2, "title": "…", "savedAt": "ISO 8601",
 *     "design": { tubeId, bplus, ra, rk, bypassed, rl, series, snap, rsource, cin, rg, ck, cout, levelRms, stage2,
 *                 stageKind, output: { tubeId, connection, bplus, screenVolts, ulTap, zPrimary, rPrimary,
 *                                      bias, rk, vg, rg, speakerOhms, thdLimit, pair, raa, mismatch, idleMismatch,
 *                                      primaryInductance, leakageInductance,
 *                                      splitter: { kind, tubeId, bplus, ra, ra2, rk, rtail, vgrid, rg, cc, coupling, rstopper? } }, drivesOutput,
 *                 supply: { on, mainsHz, mainsVolts?, secondaryRms, windingOhms, rectifier, input, sections, feeds,
 *                           channels, secondaryAmps, humRms, bias? },
 *                 heaters: { voltageStages: "ac" | "dc", dcVolts, wiring: { tubeId: wiring }, elevationVolts? }, feedbackRf, feedbackCf,
 *                 before: [stage…], after: [stage…], readings?, outputReadings? } }
 *
 * Version 3 holds the whole chain of voltage stages: the design's own
 * fields are the stage on the bench (and `stage2` its follower), `before`
 * and `after` the stages either side of it, input first (stagePlans.ts). A
 * stage is { kind: "common-cathode", tubeId, bplus, ra, rk, bypassed, ck, cc, rg, rstopper?, volume?, node? }
 * (cc null: direct from the source, first stage only) or
 * { kind: "follower", tubeId, rk, coupling?, rstopper? } (direct-coupled to the gain stage
 * before it; with coupling { cc, rg, vbias }, through a capacitor into its own
 * grid leak, the grid held at vbias; `stage2` carries the same).
 * Versions 1 and 2 open as a chain of their one or two voltage stages.
 * The output stage's `pair` ("single-ended" or "push-pull"), `raa` (the
 * pair's plate-to-plate load, Ω), `mismatch` (the second tube's gm, a
 * fraction) and `idleMismatch` (its idle current after the bias; absent,
 * equal to `mismatch`) came later within
 * version 3: a file without them opens single-ended, as it was written;
 * so did `splitter` (the phase splitter before a driven pair; absent, the
 * bench's default).
 *
 * `drivesOutput` (true: the voltage stages drive the output stage, one
 * amplifier; RL is then the output grid resistor) came later within
 * version 2: a file without it opens as it always did, the stages apart.
 * So did `supply` (the B+ supply, see supplyInFile.ts): a file without it
 * opens on the bench's default supply, its own values unchanged; and the
 * supply's `bias` (a fixed-bias output stage's grid supply: { secondaryRms,
 * windingOhms, reservoir, r, c }): absent, the bench's default; its
 * `mainsVolts` (the nominal mains, V): absent, 230 V; and
 * `heaters` (how the small tubes are lit, heaterChoice.ts): absent, the
 * bench's default (on the AC heater winding), and its `elevationVolts`
 * (the heaters held above ground, V): absent, at ground; `feedbackRf` (global
 * feedback's resistor, Ω, or null) and `feedbackCf` (a capacitor across
 * it, F, or null): absent, none; `rstopper` (a gain stage's, a
 * follower's or a splitter's grid stopper, Ω, 0 for none; the
 * bench's, its follower's, the splitter's and each such stage's): absent,
 * none; `volume`
 * (a volume control in Rg's place, its setting in dB below full, or null
 * for a fixed Rg; the bench's and each gain stage's): absent, none; `node`
 * (the supply node feeding a gain stage, 0 the reservoir; the bench's and
 * each gain stage's): absent, the voltage stages' node (supply.feeds.voltage),
 * as every such file was designed; and the output
 * transformer's `primaryInductance` and `leakageInductance` (H, or null):
 * absent, the ideal transformer; `readings` (the builder's meter
 * readings, [{ stage, tubeId, plate, cathode, supply?, plate2? }], see meterPlan.ts) and
 * `outputReadings` (on the output tubes, [{ tube, tubeId, pair, bias, plate,
 * screen, grid, cathode }]): absent, none.
 * Version 1 files (before output stages) open with the bench's default
 * output stage and the voltage stage shown.
 * SI units throughout. JSON has no Infinity, so an absent load (rl) and an
 * ideal capacitor (cin, ck, cout) are written as null. Opening validates
 * every field; nothing of a file that fails is applied.
 */
export const DESIGN_FORMAT = 'quiescent-design';
export const DESIGN_FORMAT_VERSION = 3;
/** Largest design file accepted, in bytes. */
export const MAX_DESIGN_FILE_BYTES = 1_000_000;
/** Longest design title, in characters: in files, in the store and in the title box. */
export const MAX_TITLE_CHARS = 120;

export interface DesignDocument {
  readonly title: string;
  readonly design: BenchDesign;
}

export type ReadResult = { ok: true; doc: DesignDocument } | { ok: false; message: string };

export function writeDesignFile(doc: DesignDocument, savedAt = new Date()): string {
  const d = doc.design;
  const file = {
    format: DESIGN_FORMAT,
    version: DESIGN_FORMAT_VERSION,
    title: doc.title,
    savedAt: savedAt.toISOString(),
    design: { ...d, rl: Number.isFinite(d.rl) ? d.rl : null },
  };
  return JSON.stringify(file, null, 2);
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** One side of the chain (`before` or `after`): each stage checked by its kind's schema, and the order a chain can have. */
function readPlans(v: unknown, side: 'before' | 'after', firstIsInput: boolean, afterGain: boolean, nodes: number): { ok: true; plans: StagePlan[] } | { ok: false; message: string } {
  if (v === undefined) return { ok: true, plans: [] };
  if (!Array.isArray(v)) return { ok: false, message: `design.${side} must be a list of stages (found ${quote(v)}). Nothing was opened.` };
  const plans: StagePlan[] = [];
  let prevIsGain = afterGain;
  for (const [i, raw] of v.entries()) {
    const at = `design.${side}[${i}]`;
    if (!isRecord(raw)) return { ok: false, message: `${at} must be a stage (found ${quote(raw)}). Nothing was opened.` };
    const problem = firstProblem(STAGE_KIND, raw, at) ?? firstProblem(raw.kind === 'follower' ? FOLLOWER_STAGE : GAIN_STAGE, raw, at);
    if (problem) return { ok: false, message: problem };
    if (raw.kind === 'follower') {
      if (!prevIsGain) return { ok: false, message: `${at} is a cathode follower with no gain stage right before it to be coupled to. Nothing was opened.` };
      const coupling = raw.coupling as FollowerCoupling | undefined;
      plans.push({ kind: 'follower', tubeId: knownId(raw.tubeId as string), rk: raw.rk as number, ...(coupling ? { coupling: { cc: coupling.cc, rg: coupling.rg, vbias: coupling.vbias } } : {}), ...(raw.rstopper ? { rstopper: raw.rstopper as number } : {}) });
    } else {
      const first = firstIsInput && i === 0;
      if (!first && raw.cc === null) return { ok: false, message: `${at}.cc must be a coupling capacitor: only the first stage may be direct-coupled (to the source). Nothing was opened.` };
      const nodeProblem = nodeInSupply(raw.node, nodes, at);
      if (nodeProblem) return { ok: false, message: nodeProblem };
      plans.push({
        kind: 'common-cathode', tubeId: knownId(raw.tubeId as string), bplus: raw.bplus as number, ra: raw.ra as number, rk: raw.rk as number,
        bypassed: raw.bypassed as boolean, ck: raw.ck as number | null, cc: raw.cc as number | null, rg: raw.rg as number,
        ...(raw.rstopper ? { rstopper: raw.rstopper as number } : {}),
        ...(typeof raw.volume === 'number' ? { volume: raw.volume } : {}),
        ...(typeof raw.node === 'number' ? { node: raw.node } : {}),
      });
    }
    prevIsGain = raw.kind !== 'follower';
  }
  return { ok: true, plans };
}

/** Reads a design file's text: the design, or a message saying exactly what is wrong. */
export function readDesignFile(text: string, byteLength = new TextEncoder().encode(text).length): ReadResult {
  if (byteLength > MAX_DESIGN_FILE_BYTES) {
    return { ok: false, message: `The file is ${(byteLength / 1e6).toFixed(1)} MB; a design file is at most 1 MB. Nothing was opened.` };
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (e) {
    return { ok: false, message: `The file is not complete JSON (cut short or damaged): ${(e as Error).message}. Nothing was opened.` };
  }
  if (!isRecord(raw) || raw.format !== DESIGN_FORMAT) return { ok: false, message: 'This is not a Quiescent design file (its "format" is not "quiescent-design"). Nothing was opened.' };
  if (typeof raw.version !== 'number' || !Number.isInteger(raw.version) || raw.version < 1) return { ok: false, message: 'The file has no valid format version. Nothing was opened.' };
  if (raw.version > DESIGN_FORMAT_VERSION) {
    return { ok: false, message: `The file was written by a newer Quiescent (format version ${raw.version}); this one reads up to version ${DESIGN_FORMAT_VERSION}. Nothing was opened.` };
  }
  if (typeof raw.title !== 'string' || raw.title.length > MAX_TITLE_CHARS) return { ok: false, message: `"title" must be text of at most ${MAX_TITLE_CHARS} characters. Nothing was opened.` };
  const d = raw.design;
  if (!isRecord(d)) return { ok: false, message: 'The file has no "design" section. Nothing was opened.' };
  const benchProblem = firstProblem(BENCH_STAGE, d, 'design');
  if (benchProblem) return { ok: false, message: benchProblem };
  const s2 = d.stage2 as Record<string, unknown>;
  let output: OutputPlan = DEMO_DESIGN.output;
  let stageKind: BenchDesign['stageKind'] = 'voltage';
  if (raw.version >= 2) {
    const outputProblem = firstProblem(OUTPUT_STAGE, d, 'design');
    if (outputProblem) return { ok: false, message: outputProblem };
    stageKind = d.stageKind as BenchDesign['stageKind'];
    const o = d.output as Record<string, unknown>;
    output = {
      tubeId: findOutputTube(o.tubeId as string)!.id,
      connection: o.connection as Connection,
      bplus: o.bplus as number,
      screenVolts: o.screenVolts as number,
      ulTap: o.ulTap as number,
      zPrimary: o.zPrimary as number,
      rPrimary: o.rPrimary as number,
      bias: o.bias as OutputDesign['bias'],
      rk: o.rk as number,
      vg: o.vg as number,
      rg: o.rg as number,
      speakerOhms: o.speakerOhms as number,
      thdLimit: o.thdLimit as number,
      ...pairDefaults(o.zPrimary as number),
      ...(o.pair !== undefined ? { pair: o.pair as OutputPair } : {}),
      ...(o.primaryInductance != null ? { primaryInductance: o.primaryInductance as number } : {}),
      ...(o.leakageInductance != null ? { leakageInductance: o.leakageInductance as number } : {}),
      ...(o.raa !== undefined ? { raa: o.raa as number } : {}),
      ...(o.mismatch !== undefined ? { mismatch: o.mismatch as number } : {}),
      // Written before the two parts were told apart, a mismatch moved the idle current with the gm.
      ...(o.idleMismatch !== undefined ? { idleMismatch: o.idleMismatch as number } : o.mismatch !== undefined ? { idleMismatch: o.mismatch as number } : {}),
      // A splitter written before its coupling could be chosen was capacitor-coupled.
      ...(o.splitter !== undefined ? { splitter: { ...(o.splitter as SplitterPlan), coupling: (o.splitter as Partial<SplitterPlan>).coupling ?? 'capacitor', tubeId: knownId((o.splitter as SplitterPlan).tubeId) } } : {}),
    };
  }
  const joinProblem = firstProblem(JOIN, d, 'design');
  if (joinProblem) return { ok: false, message: joinProblem };
  const drivesOutput = d.drivesOutput === true;
  const pairDriven = output.pair === 'push-pull';
  const leak = pairDriven ? (output.splitter.coupling === 'direct' ? Infinity : output.splitter.rg) : output.rg;
  if (drivesOutput && (d.rl === null ? Infinity : d.rl) !== leak) {
    if (leak === Infinity) return { ok: false, message: `design.rl must be null when the voltage stages drive a direct-coupled splitter (found ${quote(d.rl)}). Nothing was opened.` };
    const path = pairDriven ? 'design.output.splitter.rg' : 'design.output.rg';
    return { ok: false, message: `design.rl must equal ${path} when the voltage stages drive the output stage (found ${quote(d.rl)} and ${quote(leak)}). Nothing was opened.` };
  }
  const supply = readSupplyPlan(d.supply);
  if (!supply.ok) return supply;
  const heatersProblem = firstProblem(HEATERS, d, 'design');
  if (heatersProblem) return { ok: false, message: heatersProblem };
  const readingsProblem = firstProblem(READINGS, d, 'design');
  if (readingsProblem) return { ok: false, message: readingsProblem };
  const readings = ((d.readings as MeterPlan[] | undefined) ?? []).map((r) => ({ stage: r.stage, tubeId: knownId(r.tubeId), plate: r.plate, cathode: r.cathode, ...(r.supply === undefined ? {} : { supply: r.supply }), ...(r.plate2 === undefined ? {} : { plate2: r.plate2 }) }));
  const outputReadingsProblem = firstProblem(OUTPUT_READINGS, d, 'design');
  if (outputReadingsProblem) return { ok: false, message: outputReadingsProblem };
  const outputReadings = ((d.outputReadings as OutputMeterPlan[] | undefined) ?? []).map((r) => ({ ...r, tubeId: findOutputTube(r.tubeId)?.id ?? r.tubeId }));
  // Versions 1 and 2 hold no stages beyond the bench's: their chain is its stage and its second stage.
  const nodes = supply.plan.sections.length + 1;
  const benchNode = nodeInSupply(d.node, nodes, 'design');
  if (benchNode) return { ok: false, message: benchNode };
  const before = readPlans(raw.version >= 3 ? d.before : undefined, 'before', true, false, nodes);
  if (!before.ok) return before;
  if (before.plans.length > 0 && d.cin === null) return { ok: false, message: 'design.cin must be a coupling capacitor: only the first stage may be direct-coupled (to the source). Nothing was opened.' };
  const after = readPlans(raw.version >= 3 ? d.after : undefined, 'after', false, s2.kind === 'none' || s2.kind === 'common-cathode', nodes);
  if (!after.ok) return after;
  const count = before.plans.length + 1 + (s2.kind === 'none' ? 0 : 1) + after.plans.length;
  if (count > MAX_VOLTAGE_STAGES) return { ok: false, message: `The file holds ${count} voltage stages; an amplifier here has at most ${MAX_VOLTAGE_STAGES}. Nothing was opened.` };
  const design: BenchDesign = {
    tubeId: knownId(d.tubeId as string),
    bplus: d.bplus as number,
    ra: d.ra as number,
    rk: d.rk as number,
    bypassed: d.bypassed as boolean,
    rl: d.rl === null ? Infinity : (d.rl as number),
    series: d.series as PreferredSeries,
    snap: d.snap as boolean,
    rsource: d.rsource as number,
    cin: d.cin as number | null,
    rg: d.rg as number,
    rstopper: (d.rstopper as number | undefined) ?? 0,
    volume: (d.volume as number | null | undefined) ?? null,
    ...(typeof d.node === 'number' ? { node: d.node } : {}),
    ck: d.ck as number | null,
    cout: d.cout as number | null,
    levelRms: d.levelRms as number,
    thdLimit: (d.thdLimit as number | undefined) ?? TABLE_THD,
    targets: { ...NO_TARGETS, ...(d.targets as Partial<TargetPlan> | undefined) },
    followerTargets: { ...NO_TARGETS, ...(d.followerTargets as Partial<TargetPlan> | undefined) },
    outputTargets: { ...NO_TARGETS, ...(d.outputTargets as Partial<TargetPlan> | undefined) },
    stage2: {
      kind: s2.kind as Stage2Design['kind'],
      tubeId: knownId(s2.tubeId as string),
      ra: s2.ra as number,
      rk: s2.rk as number,
      rg: s2.rg as number,
      ...(s2.kind === 'follower' && s2.coupling ? { coupling: { ...(s2.coupling as FollowerCoupling) } } : {}),
      ...(s2.kind === 'follower' && s2.rstopper ? { rstopper: s2.rstopper as number } : {}),
    },
    before: before.plans,
    after: after.plans,
    stageKind,
    output,
    drivesOutput,
    supply: supply.plan,
    feedbackRf: (d.feedbackRf as number | null | undefined) ?? null,
    feedbackCf: (d.feedbackCf as number | null | undefined) ?? null,
    heaters: d.heaters === undefined ? DEFAULT_HEATERS : { ...(d.heaters as HeaterChoice), wiring: { ...(d.heaters as HeaterChoice).wiring } },
    ...(readings.length > 0 ? { readings } : {}),
    ...(outputReadings.length > 0 ? { outputReadings } : {}),
  };
  return { ok: true, doc: { title: raw.title, design: normalized(design) } };
}

/** A gain stage's supply node (schema-checked as a whole number) against the supply's count of nodes; absent is the voltage stages' node. */
function nodeInSupply(node: unknown, nodes: number, at: string): string | null {
  return typeof node === 'number' && node >= nodes ? `${at}.node must be a node of the supply, 0 (the reservoir) to ${nodes - 1} (found ${quote(node)}). Nothing was opened.` : null;
}

/** A library tube's id as the library spells it; any other name as written (a user's tube is named by its id). */
const knownId = (name: string) => findTube(name)?.id ?? name;

/**
 * A design whose tubes this browser does not know (a user tube from another
 * browser, or since removed) opens with the demo's tube in each such place
 * and every other value as saved, and a note naming the missing tube and
 * what to do. Never the demo in its place.
 */
export function withKnownTubes(doc: DesignDocument, registry: TubeRegistry): { doc: DesignDocument; note: string | null } {
  const d = doc.design;
  const others = [...d.before, ...d.after].map((p) => p.tubeId);
  const missing = [...new Set([d.tubeId, ...(d.stage2.kind !== 'none' ? [d.stage2.tubeId] : []), ...others, d.output.splitter.tubeId].filter((id) => !registry.lookup(id)))];
  if (missing.length === 0) return { doc, note: null };
  const stand = DEMO_DESIGN.tubeId;
  const swap = (id: string) => (registry.lookup(id) ? id : stand);
  const swapAll = (list: readonly StagePlan[]) => list.map((p) => ({ ...p, tubeId: swap(p.tubeId) }));
  const output = { ...d.output, splitter: { ...d.output.splitter, tubeId: swap(d.output.splitter.tubeId) } };
  const design: BenchDesign = { ...d, tubeId: swap(d.tubeId), stage2: { ...d.stage2, tubeId: swap(d.stage2.tubeId) }, before: swapAll(d.before), after: swapAll(d.after), output };
  const names = missing.map((m) => `“${m}”`).join(' and ');
  return {
    doc: { ...doc, design },
    note: `The design uses ${names}, which is neither in the library nor among your tubes in this browser: it opened with the ${stand} in its place and every other value as saved. Import the tube (A tube of your own → Import tubes) and choose it again.`,
  };
}
