import fc from 'fast-check';
import { describe, it } from 'vitest';
import * as Q from '../../src/index';
import { anything, finiteNumbers, keepsPromise, near, run, typedNear } from './promise';

// The model's promise (./promise.ts) for the exports the workbench calls on
// values it already holds: the pieces of a solve (findings, parts lists,
// overlays, curves, small-signal figures) and the small numeric helpers.
// Their input is typed (the solvers in everyExport.test.ts check raw input
// and hand these checked values), so each is fed input of its declared type
// with any finite finiteNumbers in it: its valid input with one to three finiteNumbers
// replaced by any finite double, extremes and signed zeros included.

const au7 = Q.findTube('12AU7')!;
const el34 = Q.findOutputTube('EL34')!;
const stage = { tube: au7, bplus: 275, ra: 27e3, rk: 1200, bypassed: true, rl: 220e3 };
const solved = Q.solvedStage(stage);
if (!solved.ok) throw new Error(solved.message);
const output: Q.OutputDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130, bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
const outSolved = Q.solveOutput(el34, output);
if (!outSolved.ok) throw new Error(outSolved.message);
const outAnalysis = Q.analyzeOutput(el34, output);
if (!outAnalysis.ok) throw new Error(outAnalysis.message);
const ppDesign: Q.PushPullDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 430, screenVolts: 430, ulTap: 0.43, raa: 6600, rPrimary: 200, bias: 'fixed', rk: 220, vg: -40, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
const ppSolved = Q.solvePushPull(el34, ppDesign);
if (!ppSolved.ok) throw new Error(ppSolved.message);
const ppAnalysis = Q.analyzePushPull(el34, ppDesign);
if (!ppAnalysis.ok) throw new Error(ppAnalysis.message);
const ppDrive = Q.pushPullAtDrive(ppSolved, 20, 64);
if (!ppDrive.ok) throw new Error(ppDrive.message);
const chainInput = {
  source: { rsource: 1e3 },
  stages: [
    { kind: 'common-cathode', tube: au7, bplus: 275, ra: 27e3, rk: 1200, bypassed: true, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    { kind: 'follower', tube: au7, bplus: 275, rk: 22e3, coupling: { kind: 'direct' } },
    { ...output, kind: 'single-ended-output', tube: el34, coupling: { kind: 'capacitor', cc: 220e-9, rg: 220e3 } },
  ],
} as unknown as Q.ChainInput;
const chainResult = Q.solveChain(chainInput);
if (!chainResult.ok) throw new Error(chainResult.message);
const supply = { mainsHz: 50, secondaryRms: 250, windingOhms: 40, rectifier: { kind: 'silicon-full-wave' }, input: { kind: 'capacitor', c: 47e-6 }, sections: [{ kind: 'rc', r: 1000, c: 47e-6 }], loads: [0.06, 0.01] } as unknown as Q.SupplyDesign;
const supplySolved = Q.solveSupply(supply);
if (!supplySolved.ok) throw new Error(supplySolved.message);

const tubes = fc.oneof(fc.constantFrom<unknown>(...Q.tubeLibrary), typedNear(au7), typedNear(au7.model));
const outTubes = fc.oneof(fc.constantFrom<unknown>(...Q.outputTubeLibrary), typedNear(el34));
const series = fc.oneof(fc.constantFrom('E12', 'E24', 'E96'));
const extents = typedNear({ vmax: 500, iaMax: 0.02 });
const count = fc.integer({ min: 0, max: 200 });
const targets = fc.oneof(typedNear({ minGain: 10, maxZout: 20e3, maxThdAt: { outputRms: 2, thd: 0.01 }, minGridHeadroom: 1, maxDissipationFraction: 0.6 }));
// An operating point is a solver's: within the voltages and currents a tube can have.
const point = fc.record({ va: fc.double({ min: -1e6, max: 1e6, noNaN: true }), vk: fc.double({ min: -1e6, max: 1e6, noNaN: true }), ia: fc.double({ min: -10, max: 10, noNaN: true }) });

/**
 * What a solver answers for its valid input or that input with a field or two
 * replaced by anything: the values these helpers are handed, as only the
 * model's solvers make them (the valid input's answer where the fuzzed one fails).
 */
function solvedBy<T>(base: object, solve: (design: never) => Q.Result<T>): fc.Arbitrary<T> {
  const valid = solve(base as never);
  if (!valid.ok) throw new Error(valid.message);
  return near(base).map((design) => {
    const r = solve(design as never);
    return r.ok ? r : valid;
  });
}
const solvedStages = solvedBy(stage, Q.solvedStage);
const solvedOutputs = solvedBy(output, (d: Q.OutputDesign) => Q.solveOutput(el34, d));
const outputAnalyses = fc.oneof(
  solvedBy(output, (d: Q.OutputDesign) => Q.analyzeOutput(el34, d)),
  solvedBy({ ...output, bias: 'fixed', vg: -28 }, (d: Q.OutputDesign) => Q.analyzeOutput(el34, d)),
);
const pairAnalyses = solvedBy(ppDesign, (d: Q.PushPullDesign) => Q.analyzePushPull(el34, d));
const cathodePairAnalyses = solvedBy({ ...ppDesign, bias: 'cathode' }, (d: Q.PushPullDesign) => Q.analyzePushPull(el34, d));
const solvedChains = solvedBy(chainInput, (c: Q.ChainInput) => {
  const r = Q.solveChain(c);
  return r.ok ? { ok: true as const, pair: [c, r] as const } : r;
}).map((r) => r.pair);

describe('every helper: no throw, no NaN or ±Infinity in an ok result', () => {
  // Numbers in, finiteNumbers out.
  run('preferredAround', fc.tuple(finiteNumbers, series), Q.preferredAround);
  run('loadLineExtent', fc.tuple(finiteNumbers, finiteNumbers, finiteNumbers), Q.loadLineExtent);
  run('feedbackPartsProblem', fc.tuple(finiteNumbers, fc.oneof(finiteNumbers, fc.constant(null))), Q.feedbackPartsProblem);

  // Tubes and their curves.
  run('triode', fc.tuple(fc.oneof(typedNear(au7.model.params)), fc.oneof(fc.constant(undefined), finiteNumbers)), (p: Q.KorenTriodeParams, rg?: number) => {
    const m = Q.triode(p, rg);
    return [m, Q.plateCurrent(m, 150, -2), Q.gridCurrent(m, 0.5)];
  });
  run('korenParamsProblem', fc.tuple(fc.oneof(typedNear(au7.model.params))), Q.korenParamsProblem);
  run('recordOf', fc.tuple(tubes), Q.recordOf);
  run('gridVoltageAt', fc.tuple(tubes, finiteNumbers, finiteNumbers), Q.gridVoltageAt);
  run('tubeSummary', fc.tuple(fc.oneof(fc.constantFrom<unknown>(...Q.tubeLibrary), typedNear(au7))), Q.tubeSummary);
  run('plateFamily', fc.tuple(tubes, fc.array(finiteNumbers, { maxLength: 4 }), finiteNumbers, count), Q.plateFamily, 150);
  run('curveSheet', fc.tuple(tubes, finiteNumbers, fc.oneof(fc.constant(undefined), extents), fc.oneof(fc.constant(undefined), count)), Q.curveSheet, 100);
  run('connectionsOf', fc.tuple(outTubes), Q.connectionsOf);
  run('parseCurveCsv', fc.tuple(fc.oneof(fc.string(), fc.constant('va,vg,ia\n200,-2,0.005\n'))), Q.parseCurveCsv);
  run('parseTypicalCsv', fc.tuple(fc.oneof(fc.string(), fc.constant('va,vg,ia,mu,rp\n250,-8.5,0.0105,17,7700\n'))), Q.parseTypicalCsv);

  // A voltage stage: its entry points take raw input; its pieces take what solvedStage answers.
  // Its answer is the caller's design, checked: an echo (a load of Infinity is "none"), held like everyExport's `checked`.
  run('normalizeStage', fc.tuple(near(stage)), (d: Q.StageDesign) => {
    const r = Q.normalizeStage(d);
    return r.ok ? { ok: true, checked: r } : r;
  });
  run('analyzeStage', fc.tuple(near(stage), fc.oneof(near({ second: null, levels: { levelRms: 2, thdLimit: 0.05 } }), anything), fc.constant(null)), Q.analyzeStage, 150);
  run('stageTransfer', fc.tuple(solvedStages), (s: Q.SolvedStage) => Q.stageTransfer(s.checked, s.solution.op), 150);
  run('stagePartsList', fc.tuple(solvedStages, series), (s: Q.SolvedStage, e: Q.PreferredSeries) => Q.stagePartsList(s.checked, s.solution, e));
  run('swingOf', fc.tuple(solvedStages), Q.swingOf, 150);
  run('distortionOf', fc.tuple(solvedStages, fc.oneof(typedNear({ outputRms: 2 }), typedNear({ inputRms: 0.1 })), fc.oneof(typedNear({ samples: 256 }), fc.constant(null))), Q.distortionOf, 150);
  run('responseOf', fc.tuple(solvedStages, fc.array(finiteNumbers, { maxLength: 8 })), Q.responseOf);
  run('cornersOf', fc.tuple(solvedStages), Q.cornersOf);
  run('productionSpread', fc.tuple(solvedStages, series, typedNear({ runs: 20, seed: 3, tubeSpread: 0.1 })), (st: Q.SolvedStage, e: Q.PreferredSeries, o: object) => Q.productionSpread(st.checked, st.solution, e, o), 60);
  run('splitterPlane', fc.tuple(tubes, typedNear({ kind: 'split-load', bplus: 330, ra: 22e3, rk: 22e3, rtail: 0, vgrid: 80 }), point, fc.oneof(fc.constant(undefined), point)), Q.splitterPlane);

  // Targets.
  run('activeTargets', fc.tuple(targets, fc.constantFrom('voltage', 'follower', 'output')), Q.activeTargets);
  run('rankFollowers', fc.tuple(fc.oneof(targets, anything), near({ bplus: 300, vgrid: 150, rl: 220e3 }), fc.constant([au7])), Q.rankFollowers, 30);

  // The output stage's pieces, from what its solvers answer.
  run('zPrimaryThrough', fc.tuple(solvedOutputs, finiteNumbers, finiteNumbers), Q.zPrimaryThrough);
  run('outputPartsList', fc.tuple(outputAnalyses, series), Q.outputPartsList, 100);
  run('pushPullPartsList', fc.tuple(pairAnalyses, series), Q.pushPullPartsList, 60);
  run('singleEndedPins', fc.tuple(solvedOutputs), (s: Q.OutputSolution) => Q.singleEndedPins(s.op));
  run('pushPullPins', fc.tuple(pairAnalyses), (a: Q.PushPullAnalysis) => Q.pushPullPins(a.solution), 60);

  // The amplifier and its supply.
  run('stagesInPlaceProblem', fc.tuple(fc.oneof(near(chainInput), anything)), Q.stagesInPlaceProblem, 60);
  run('solveAmplifier', fc.tuple(near(chainInput), fc.oneof(fc.constant(undefined), near({ outputRms: 2 }), near({ power: 1 }), anything)), Q.solveAmplifier, 60);
  run('amplifierFindings', fc.tuple(fc.array(typedNear({ name: 'Stage 1', findings: [] }), { maxLength: 3 })), Q.amplifierFindings);
  run('amplifierParts', fc.tuple(solvedChains, typedNear({ series: 'E24', loadCoupling: 1e-6 })), (c: [Q.ChainInput, Q.ChainResult], o: Q.AmplifierPartsOptions) => Q.amplifierParts(c[0], c[1], o), 60);
  run('envelopesOf', fc.tuple(fc.array(fc.oneof(fc.constantFrom<unknown>(...Q.tubeLibrary), typedNear(au7)), { maxLength: 4 })), Q.envelopesOf);
  run('checkSupply', fc.tuple(fc.oneof(typedNear(supply), anything)), Q.checkSupply);
  // A fixed-bias stage's grid supply, from the stage's analysis (a cathode-biased one is refused by name).
  const biasRail = { mainsHz: 50, secondaryRms: 50, windingOhms: 150, reservoir: 47e-6, r: 4700, c: 100e-6 };
  run('checkBiasSupply', fc.tuple(fc.oneof(typedNear(biasRail), anything)), Q.checkBiasSupply);
  run('outputBiasSupply', fc.tuple(outputAnalyses, fc.oneof(fc.constant(biasRail), typedNear(biasRail)), fc.oneof(fc.constant(undefined), fc.integer({ min: -1, max: 6 }), anything)), Q.outputBiasSupply, 30);
  run('mainsFuse', fc.tuple(fc.oneof(typedNear({ mainsVolts: 230, bplusVa: 90, bplusVaFull: 120, heaterVa: 40, biasVa: 0.5, htAmps: 0.2 }), anything)), Q.mainsFuse);
  run('htFuseCurrent', fc.tuple(fc.oneof(fc.constantFrom('silicon-full-wave', 'silicon-bridge', 'silicon-half-wave', 'tube'), anything), fc.oneof(finiteNumbers, anything), fc.oneof(finiteNumbers, anything)), Q.htFuseCurrent);
  run('bplusWindingLoad', fc.tuple(fc.oneof(fc.constantFrom('silicon-full-wave', 'silicon-bridge', 'tube'), anything), fc.oneof(typedNear({ secondaryVa: 60, rectifierRms: 0.18, secondaryRmsCurrent: 0.13 }), anything), fc.oneof(typedNear([0.08, 0.01]), anything), fc.oneof(fc.constant(null), typedNear([0.12, 0.01]), anything)), Q.bplusWindingLoad);
  run('fullPowerVa', fc.tuple(fc.oneof(finiteNumbers, anything), fc.oneof(typedNear([0.08, 0.01]), anything), fc.oneof(fc.constant(null), typedNear([0.12, 0.01]), anything)), Q.fullPowerVa);
  run('withBiasHum', fc.tuple(fc.oneof(typedNear({ volts: [1e-3, null], screens: [null, 2e-4], bound: 1e-3 }), anything), fc.oneof(fc.constant(null), finiteNumbers, anything)), Q.withBiasHum);
  run('pairBiasSupply', fc.tuple(fc.oneof(pairAnalyses, cathodePairAnalyses), fc.oneof(fc.constant(biasRail), typedNear(biasRail)), fc.oneof(fc.constant(undefined), fc.integer({ min: -1, max: 6 }), anything)), Q.pairBiasSupply, 30);
  run('findRectifierTube', fc.tuple(fc.oneof(fc.constantFrom('EZ81', '5AR4', 'GZ34'))), Q.findRectifierTube);
  // Found by fresh seeds when this run began (each failed before its fix).
  const sheetTube = Q.findTube('12AX7')!;
  const found: [string, () => unknown][] = [
    ['envelopesOf (a record with no sections)', () => Q.envelopesOf([{ ...au7, sections: 0 as never }])],
    ['gridVoltageAt (a plate past 1e154 V)', () => Q.gridVoltageAt(au7, 1.3407807929942597e154, 5e-324)],
    ['preferredAround (near the largest double)', () => Q.preferredAround(1.341640786499874e308, 'E12')],
    ['plateFamily (a span near the largest double)', () => Q.plateFamily(sheetTube, [0], 1.7e308, 2)],
    ['curveSheet (a window of a denormal)', () => Q.curveSheet(sheetTube, 0, { vmax: 5e-324, iaMax: 5e-324 }, 1)],
    ['analyzeStage (no options)', () => Q.analyzeStage({ ...stage }, null as never, null)],
    ['analyzeStage (no levels)', () => Q.analyzeStage({ ...stage }, { second: null } as never, null)],
    // Found at twenty times the count, at the end of this stop: a load line of 7e-307 Ω framed past the largest double.
    ['loadLineExtent (a denormal load)', () => Q.loadLineExtent(0, 6.953355807835005e-307, 0)],
  ];
  for (const [name, call] of found) it(`${name} keeps the promise`, () => keepsPromise(name, call, []));
  it('solveOnSupplyInRounds keeps the promise for a malformed supply', () => {
    for (const bad of [null, {}, { amplifier: chainInput, supply: null, feeds: [0] }, { amplifier: chainInput, supply, feeds: [9, 9, 9] }]) {
      keepsPromise('solveOnSupplyInRounds', () => {
        const rounds = Q.solveOnSupplyInRounds(bad as unknown as Q.AmplifierOnSupply);
        for (let k = 0; k < 100; k++) {
          const r = rounds.next();
          if (r.done) return r.value;
        }
        throw new Error('no answer in 100 rounds');
      }, []);
    }
  });
});
