import { feasibleRegion, outputRegion, rankOutputTubes, rankTubes, type Targets } from '../src/index';
import {
  analyzeOutput, findOutputTube, type OutputDesign,
  cornersOf, curveSheet, distortionOf, findTube, fitTriode, korenPublishedSets, logFrequencies, plateCurrent,
  responseOf, solveStage, solvedStage, stageTransfer, swingOf, triode, type CurvePoint,
  solveAmplifier, globalFeedback, type ChainInput, solveOnSupply, solveSupply, type SupplyDesign, solvePushPull, pushPullAtDrive, analyzePushPull, type PushPullDesign,
} from '../src/index';
import { repeatedStats, RUNS, timeIt, type Stats } from './stats.mts';

/** The demo line stage with its signal parts: what the workbench analyses on every change. */
const STAGE = { tube: findTube('12AU7')!, bplus: 275, ra: 27e3, rk: 1200, rl: 220e3, rg: 1e6, rsource: 1e3, cin: 470e-9, ck: 100e-6, cout: 1e-6 };
const FREQS = logFrequencies(1, 1e6, 15);

/**
 * The target region's stage and a target of every kind, THD among them:
 * a 12AX7 line stage (invented demo targets), over its chart's window.
 */
const REGION_STAGE = { tube: findTube('12AX7')!, bplus: 300, rl: 470e3, rsource: 10e3, bypassed: true };
const REGION_TARGETS: Targets = { minGain: 40, minCleanOutputRms: 15, maxThdAt: { outputRms: 2, thd: 0.01 }, maxDissipationFraction: 0.7, maxZout: 80e3, raRange: [47e3, 470e3], rkRange: [470, 4.7e3], minGridHeadroom: 1, heaterCathodeWithinRating: true };
const region = (nx: number, ny: number) => feasibleRegion(REGION_STAGE, REGION_TARGETS, { nx, ny });

/** The whole one-stage analysis: operating point, small signal, swing, distortion at 2 V rms, response and corners. */
export function fullAnalysis(samples = 1024): void {
  const s = solvedStage(STAGE);
  if (!s.ok) throw new Error(s.message);
  const transfer = stageTransfer(s.checked, s.solution.op);
  const swing = swingOf(s, transfer);
  const d = distortionOf(s, { outputRms: 2 }, { samples }, { transfer, swing });
  if (!d.ok) throw new Error(d.message);
  responseOf(s, FREQS);
  cornersOf(s);
}

function fitPoints(n: number): CurvePoint[] {
  const m = triode(korenPublishedSets['12AU7']!);
  const pts: CurvePoint[] = [];
  const grids = [0, -2, -4, -6, -8, -10, -12, -14];
  for (let k = 0; pts.length < n; k++) {
    const vg = grids[k % grids.length]!;
    const va = 30 + ((k * 37) % 370);
    const ia = plateCurrent(m, va, vg);
    if (ia > 2e-5) pts.push({ va, vg, ia: ia * (1 + 0.01 * Math.sin(k)) });
  }
  return pts;
}

/** The bench's default output stage: an EL34 on a 43 % ultralinear tap (the same as the workbench offers first). */
const OUTPUT: OutputDesign = {
  tubeId: 'EL34', connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130,
  bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05,
};
const EL34 = findOutputTube('EL34')!;
const { tubeId: _tubeId, rg: _rg, ...OUTPUT_PARTS } = OUTPUT;

/** A four-stage amplifier of our own: input stage, second gain stage, direct-coupled follower, single-ended EL34. */
export const FOUR_STAGES: ChainInput = {
  source: { rsource: 1e3 },
  stages: [
    { kind: 'common-cathode', tube: findTube('12AX7')!, bplus: 290, ra: 100e3, rk: 1500, bypassed: true, ck: 47e-6, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    { kind: 'common-cathode', tube: findTube('12AU7')!, bplus: 290, ra: 33e3, rk: 3300, bypassed: false, coupling: { kind: 'capacitor', cc: 68e-9, rg: 470e3 } },
    { kind: 'follower', tube: findTube('12AU7')!, bplus: 290, rk: 33e3, coupling: { kind: 'direct' } },
    { ...OUTPUT_PARTS, kind: 'single-ended-output', tube: findOutputTube('EL34')!, ck: 220e-6, coupling: { kind: 'capacitor', cc: 220e-9, rg: 220e3 } },
  ],
};

/** The whole amplifier's analysis: every stage, the band, the clean limit, and sensitivity with THD at 1 W. */
export function fourStageAnalysis(): void {
  const r = solveAmplifier(FOUR_STAGES, { power: 1 });
  if (!r.ok) throw new Error(r.message);
  if (!r.atLevel?.ok) throw new Error('no figures at 1 W');
}

/** A supply of our own: 260 V a side, silicon full wave, 100 µF reservoir and three R–C sections. */
export const THREE_SECTION_SUPPLY: SupplyDesign = {
  mainsHz: 50, secondaryRms: 260, windingOhms: 35, rectifier: { kind: 'silicon-full-wave' }, input: { kind: 'capacitor', c: 100e-6 },
  sections: [{ kind: 'rc', r: 1000, c: 47e-6 }, { kind: 'rc', r: 4700, c: 47e-6 }, { kind: 'rc', r: 10e3, c: 22e-6 }],
  loads: [0.075, 0.004, 0.004, 0.001],
};

/** The four-stage amplifier on that supply: the output stage on the reservoir, the follower, second and first stages down the ladder. */
export function amplifierOnSupply(): void {
  const r = solveOnSupply({ amplifier: FOUR_STAGES, supply: { ...THREE_SECTION_SUPPLY, loads: [0, 0, 0, 0] }, feeds: [3, 2, 1, 0] });
  if (!r.ok) throw new Error(r.message);
}

/** The same, started from its own steady state after one drag frame's change (the first stage's Ra up 2 %): what runs while a stage is dragged. */
const ON_SUPPLY = { amplifier: FOUR_STAGES, supply: { ...THREE_SECTION_SUPPLY, loads: [0, 0, 0, 0] }, feeds: [3, 2, 1, 0] };
const SETTLED = solveOnSupply(ON_SUPPLY);
const NUDGED = { ...ON_SUPPLY, amplifier: { ...FOUR_STAGES, stages: FOUR_STAGES.stages.map((st, i) => (i === 0 && st.kind === 'common-cathode' ? { ...st, ra: st.ra * 1.02 } : st)) } };
export function amplifierOnSupplyWarm(): void {
  if (!SETTLED.ok) throw new Error(SETTLED.message);
  const r = solveOnSupply({ ...NUDGED, start: SETTLED.supply.nodes.map((n) => n.dc) });
  if (!r.ok) throw new Error(r.message);
}

/** The settled solve as the page asks for it after a change: with the supply's tangent for the drag that may follow. */
const SETTLED_WITH_TANGENT = solveOnSupply({ ...ON_SUPPLY, keepTangent: true });
let outputStep = 0;
let lastNodes: number[] | null = null;
/**
 * One drag frame as the page's worker solves it: the output stage's cathode
 * resistor a little different each time (its current, the largest on the
 * supply, moves every node; 40 frames sweep it 16 % and start again), the
 * supply taken along the settled solve's tangent, from the last answer's nodes.
 */
export function amplifierOnSupplyDragFrame(): void {
  if (!SETTLED_WITH_TANGENT.ok || !SETTLED_WITH_TANGENT.tangent) throw new Error('the settled solve answers its tangent');
  outputStep = (outputStep + 1) % 40;
  const stages = FOUR_STAGES.stages.map((st) => (st.kind === 'single-ended-output' ? { ...st, rk: st.rk * (1 - 0.004 * outputStep) } : st));
  const start = lastNodes ?? SETTLED_WITH_TANGENT.supply.nodes.map((n) => n.dc);
  const r = solveOnSupply({ ...ON_SUPPLY, amplifier: { ...FOUR_STAGES, stages }, start, around: SETTLED_WITH_TANGENT.tangent, keepTangent: true });
  if (!r.ok) throw new Error(r.message);
  lastNodes = r.supply.nodes.map((n) => n.dc);
  if (r.supplyBy !== 'tangent') throw new Error('a drag frame strayed from the tangent: the measure would time the transient solve');
}

/** A push-pull pair of our own: EL34s ultralinear at 430 V, fixed bias, 6.6 kΩ plate to plate. */
const PUSH_PULL = solvePushPull(findOutputTube('EL34')!, {
  tubeId: 'EL34', connection: 'ultralinear', bplus: 430, screenVolts: 430, ulTap: 0.43, raa: 6600, rPrimary: 200,
  bias: 'fixed', rk: 0, vg: -40, rg: 220e3, speakerOhms: 8, thdLimit: 0.05,
});

/** The same pair as the bench drags it: its analysis once in full, then the light pass each drag frame runs. */
const PAIR_DESIGN: PushPullDesign = {
  tubeId: 'EL34', connection: 'ultralinear', bplus: 430, screenVolts: 430, ulTap: 0.43, raa: 6600, rPrimary: 200,
  bias: 'fixed', rk: 0, vg: -40, rg: 220e3, speakerOhms: 8, thdLimit: 0.05,
};
const PAIR_FULL = analyzePushPull(EL34_PAIR_TUBE(), PAIR_DESIGN);
function EL34_PAIR_TUBE() {
  return findOutputTube('EL34')!;
}
let pairStep = 0;
/** One drag frame on the pair: the bias a little different each time, the last full pass as the cache. */
export function pushPullLightFrame(): void {
  pairStep = (pairStep + 1) % 40;
  const r = analyzePushPull(EL34_PAIR_TUBE(), { ...PAIR_DESIGN, vg: -40 + 0.05 * pairStep }, { light: true, previous: PAIR_FULL.ok ? PAIR_FULL : null });
  if (!r.ok) throw new Error(r.message);
}

/** A push-pull amplifier of our own: a 12AX7 input stage, a 12AU7 long-tailed pair, EL84s ultralinear. */
export const PUSH_PULL_AMPLIFIER: ChainInput = {
  source: { rsource: 600 },
  stages: [
    { kind: 'common-cathode', tube: findTube('12AX7')!, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    { kind: 'long-tailed-pair', tube: findTube('12AU7')!, bplus: 350, ra: 33e3, ra2: 36e3, rk: 470, rtail: 10e3, vbias: 60, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    {
      kind: 'push-pull-output', tube: findOutputTube('EL84')!, connection: 'ultralinear', bplus: 300, screenVolts: 300, ulTap: 0.4, raa: 8000, rPrimary: 240,
      bias: 'cathode', rk: 130, vg: 0, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 470e3 },
    },
  ],
};

/** The push-pull amplifier's whole analysis with sensitivity and THD at 1 W. */
export function pushPullAmplifier(): void {
  const r = solveAmplifier(PUSH_PULL_AMPLIFIER, { power: 1 });
  if (!r.ok) throw new Error(r.message);
  if (!r.atLevel?.ok) throw new Error('no figures at 1 W');
}

/**
 * The four-stage amplifier with global feedback (47 kΩ to its first cathode, left unbypassed) and an output transformer
 * of 15 H and 8 mH: the loop's figures a full pass adds when Rf is set (midband, band, margins, square waves, THD at 1 W).
 */
const FOUR_STAGES_LOOPED: ChainInput = {
  ...FOUR_STAGES,
  stages: FOUR_STAGES.stages.map((s, i) =>
    i === 0 && s.kind === 'common-cathode' ? { ...s, bypassed: false } : s.kind === 'single-ended-output' ? { ...s, primaryInductance: 15, leakageInductance: 8e-3 } : s,
  ),
};
export function loopFigures(): void {
  const r = globalFeedback(FOUR_STAGES_LOOPED, 47e3, { power: 1 });
  if (!r.ok) throw new Error(r.message);
}

export interface ModelResults {
  /** A push-pull pair's light analysis, what each drag frame on its bench runs (budget 2 ms median). */
  readonly pushPullLight: Stats;
  /** Input stage → long-tailed pair → push-pull EL84s, solved whole. */
  readonly pushPullAmplifier: Stats;
  /** A push-pull pair through one cycle at 128 points (composite characteristics, one root per point). */
  readonly pushPullCycle: Stats;
  /** A three-section supply to its steady state (budget 50 ms median). */
  readonly supplyThreeSections: Stats;
  /** The four-stage amplifier and the supply solved as one, from cold. */
  readonly amplifierOnSupply: Stats;
  /** The same after one drag frame's change, from the last steady state. */
  readonly amplifierOnSupplyWarm: Stats;
  /** One drag frame's solve of amplifier and supply, the supply along the settled solve's tangent (budget 8 ms p95). */
  readonly amplifierOnSupplyDragFrame: Stats;
  /** The four-stage amplifier, solved whole (budget 8 ms median). */
  readonly fourStageChain: Stats;
  /** Its global feedback's figures across the band, with a real transformer (no budget: a full pass's, never a frame's). */
  readonly loopFigures: Stats;
  readonly solveStage: Stats;
  readonly fullAnalysis: Stats;
  readonly plateFamily: Stats;
  readonly fit200: Stats;
  readonly fftScaling: Record<string, Stats>;
  /** Output stage: what runs per drag frame (point, lines, clean limit, full-drive figures). */
  readonly outputLight: Stats;
  /** Output stage: everything, with the power sweep and the primary-impedance sweep (after a drag). */
  readonly outputFull: Stats;
  /** The target region: the coarse first look (30 × 20) and the full grid (60 × 40), every target set. */
  readonly regionCoarse: Stats;
  readonly regionFull: Stats;
  /** One point of the region: the full grid's time over its 2,400 points (every target judged from one solve). */
  readonly regionPoint: Stats;
  /** Every library tube ranked against the same targets. */
  readonly rankLibrary: Stats;
  /** The output stage's region (the demo's single-ended EL34; an EL34 pair), coarse and full, power and dissipation targets; every output tube ranked. */
  readonly outputRegionCoarse: Stats;
  readonly outputRegionFull: Stats;
  readonly pairRegionCoarse: Stats;
  readonly pairRegionFull: Stats;
  readonly rankOutputs: Stats;
}

/** One measure: the call, the calls timed per block, the warm-up before its first block. */
type Measure = readonly [fn: () => unknown, perBlock: number, warmup: number];

/**
 * Times every measure in RUNS interleaved blocks (block 1 of each, then
 * block 2 of each, …), so a burst of load on the shared machine lands in one
 * block of several figures instead of all of one figure; each figure is the
 * median of its blocks, with each block's p95 kept as the spread.
 */
function interleaved<K extends string>(measures: Record<K, Measure>): Record<K, Stats> {
  const blocks = {} as Record<K, number[][]>;
  for (let run = 0; run < RUNS; run++) {
    for (const name of Object.keys(measures) as K[]) {
      const [fn, perBlock, warmup] = measures[name];
      (blocks[name] ??= []).push(timeIt(fn, perBlock, run === 0 ? warmup : 2));
    }
  }
  const out = {} as Record<K, Stats>;
  for (const name of Object.keys(blocks) as K[]) out[name] = repeatedStats(blocks[name]);
  return out;
}

/**
 * The output stage's targets (invented demo targets): at least 4 W within
 * 5 % THD, THD under 2 % at 1 W, at most 90 % of the rated dissipation, on
 * the demo's single-ended EL34; a pair of them at 15 W.
 */
const OUTPUT_TARGETS: Targets = { minPower: { power: 4, thd: 0.05 }, maxThdAtPower: { power: 1, thd: 0.02 }, maxDissipationFraction: 0.9 };
const OUTPUT_TARGET_STAGE = { pair: 'single-ended', tube: EL34, design: OUTPUT } as const;
const PAIR_TARGETS: Targets = { minPower: { power: 15, thd: 0.05 }, maxDissipationFraction: 0.9 };
const PAIR_TARGET_STAGE = { pair: 'push-pull', tube: EL34, design: { ...OUTPUT, raa: 7000, mismatch: 0 } } as const;

export function benchModel(): ModelResults {
  const pts = fitPoints(200);
  const m = interleaved({
    solveStage: [() => solveStage(STAGE), 700, 20],
    fourStageChain: [() => fourStageAnalysis(), 20, 5],
    loopFigures: [() => loopFigures(), 10, 3],
    supplyThreeSections: [() => solveSupply(THREE_SECTION_SUPPLY), 5, 2],
    pushPullCycle: [() => PUSH_PULL.ok && pushPullAtDrive(PUSH_PULL, 30), 20, 3],
    pushPullLight: [() => pushPullLightFrame(), 40, 10],
    pushPullAmplifier: [() => pushPullAmplifier(), 10, 3],
    amplifierOnSupply: [() => amplifierOnSupply(), 2, 1],
    amplifierOnSupplyWarm: [() => amplifierOnSupplyWarm(), 5, 2],
    amplifierOnSupplyDragFrame: [() => amplifierOnSupplyDragFrame(), 40, 10],
    fullAnalysis: [() => fullAnalysis(), 150, 20],
    regionCoarse: [() => region(30, 20), 5, 2],
    regionFull: [() => region(60, 40), 3, 1],
    rankLibrary: [() => rankTubes(REGION_TARGETS, { bplus: 300, rl: 470e3, rsource: 10e3, bypassed: true }), 2, 1],
    outputRegionCoarse: [() => outputRegion(OUTPUT_TARGET_STAGE, OUTPUT_TARGETS, { nx: 30, ny: 20 }), 5, 2],
    outputRegionFull: [() => outputRegion(OUTPUT_TARGET_STAGE, OUTPUT_TARGETS, { nx: 60, ny: 40 }), 3, 1],
    pairRegionCoarse: [() => outputRegion(PAIR_TARGET_STAGE, PAIR_TARGETS, { nx: 30, ny: 20 }), 3, 1],
    pairRegionFull: [() => outputRegion(PAIR_TARGET_STAGE, PAIR_TARGETS, { nx: 60, ny: 40 }), 2, 1],
    rankOutputs: [() => rankOutputTubes(OUTPUT_TARGETS, OUTPUT_TARGET_STAGE), 2, 1],
    plateFamily: [() => curveSheet(STAGE.tube, 275), 100, 20],
    fit200: [() => fitTriode(pts), 7, 2],
    outputLight: [() => analyzeOutput(EL34, OUTPUT, { light: true }), 70, 20],
    outputFull: [() => analyzeOutput(EL34, OUTPUT), 8, 3],
    fft1024: [() => fullAnalysis(1024), 20, 5],
    fft2048: [() => fullAnalysis(2048), 20, 5],
    fft4096: [() => fullAnalysis(4096), 20, 5],
    fft8192: [() => fullAnalysis(8192), 20, 5],
    fft16384: [() => fullAnalysis(16384), 20, 5],
  });
  const fftScaling: Record<string, Stats> = { 1024: m.fft1024, 2048: m.fft2048, 4096: m.fft4096, 8192: m.fft8192, 16384: m.fft16384 };
  const perPoint = (s: Stats): Stats => ({ ...s, median: s.median / 2400, p95: s.p95 / 2400, min: s.min / 2400, max: s.max / 2400, ...(s.p95Runs ? { p95Runs: s.p95Runs.map((x) => x / 2400) } : {}) });
  return { outputRegionCoarse: m.outputRegionCoarse, outputRegionFull: m.outputRegionFull, pairRegionCoarse: m.pairRegionCoarse, pairRegionFull: m.pairRegionFull, rankOutputs: m.rankOutputs, regionCoarse: m.regionCoarse, regionFull: m.regionFull, regionPoint: perPoint(m.regionFull), rankLibrary: m.rankLibrary, pushPullLight: m.pushPullLight, pushPullAmplifier: m.pushPullAmplifier, pushPullCycle: m.pushPullCycle, supplyThreeSections: m.supplyThreeSections, amplifierOnSupply: m.amplifierOnSupply, amplifierOnSupplyWarm: m.amplifierOnSupplyWarm, amplifierOnSupplyDragFrame: m.amplifierOnSupplyDragFrame, fourStageChain: m.fourStageChain, loopFigures: m.loopFigures, solveStage: m.solveStage, fullAnalysis: m.fullAnalysis, plateFamily: m.plateFamily, fit200: m.fit200, fftScaling, outputLight: m.outputLight, outputFull: m.outputFull };
}
