import { outputIdleAmps } from './outputAnalysis';
import {
  amplifierParts, envelopesOf, capacitorsForCorner, decouplingFilter, droppingResistor, heaterElevation, heaterTotals, normalizeStage, productionSpread, recordOf,
  solveStage, stagePartsList, type CapacitorForCorner, type ChainInput, type ChainResult, type DecouplingResult, type DroppingResistor,
  type Failure, type HeaterOption, type HeaterPlan, type Spread, type StageParts, type TubeRecord,
} from '../../src/index';
import { stageDesignOf } from './analysis';
import { elevationPlanOf, type ElevationPlan } from './elevationPlan';
import { outputSharesSmallWinding } from './heaterSharing';
import { drivesPair } from './outputPlan';
import { benchIndex, IDEAL_CC, voltageStages } from './stagePlans';
import type { WorkbenchState } from './workbenchStore';

/** The builder's own inputs for the build sheet. */
export interface BuildInputs {
  readonly cornerHz: number;
  /** The rail ahead of the decoupling filter, V; null follows the design's B+ until the user sets one. */
  readonly railVolts: number | null;
  readonly filterR: number;
  readonly filterC: number;
  readonly showSpread: boolean;
}

export const DEFAULT_BUILD: BuildInputs = { cornerHz: 5, railVolts: null, filterR: 4.7e3, filterC: 47e-6, showSpread: true };

/** One stage's parts on the sheet, and whether it is the stage on the bench. */
export interface SheetStage extends StageParts {
  /** In the bench's block: its gain stage, and the follower riding with it (their figures are the bench's own). */
  readonly onBench: boolean;
  /** The stage whose chart the bench shows. */
  readonly shown: boolean;
}

export interface BuildSheet {
  /** Every voltage stage and the phase splitter, in chain order, parts numbered by place; the output stage's come from its own analysis. */
  readonly stages: readonly SheetStage[];
  /** Why only the bench's stage is listed (the rest of the amplifier does not solve), or null. */
  readonly partial: string | null;
  readonly forCorner: ({ ok: true; cin: CapacitorForCorner | null; cout: CapacitorForCorner | null; ck: CapacitorForCorner | null }) | Failure;
  /**
   * What each capacitor sized for the corner is on the parts list, and the
   * box that holds it: the bench's own Cc and Ck; its output capacitor is the
   * amplifier's Cout when the bench is the last voltage stage, else the next
   * stage's Cc, which no box on this bench holds (null).
   */
  readonly cornerParts: { readonly cin: string; readonly ck: string; readonly cout: { readonly ref: string; readonly box: 'cout' | null } };
  readonly spread: ({ ok: true } & Spread) | Failure;
  readonly tubes: readonly { tube: TubeRecord; options: readonly HeaterOption[]; chosen: HeaterOption; sectionsUsed: number; envelopes: number }[];
  readonly heaters: ({ ok: true } & HeaterPlan) | Failure;
  /** The DC heater supply's dropping resistor; null with the heaters on the AC winding. */
  readonly dropper: ({ ok: true } & DroppingResistor) | Failure | null;
  readonly elevation: { ok: true; lo: number | null; hi: number | null; suggested: number; groundedOk: boolean } | Failure;
  /**
   * The divider holding the heaters at the design's elevation, from the
   * lowest voltage stage's B+ (the best-filtered node a gain stage uses),
   * named by that stage; null with the heaters at ground.
   */
  readonly elevationDivider: ElevationPlan | null;
  readonly filter: ({ ok: true } & DecouplingResult) | Failure;
  /** Where the bench's stage then sits, with the filter's B+. */
  readonly filteredOp: { va: number; ia: number } | null;
  readonly totalBplusAmps: number;
  /** The driven output stage's cathode current (plate and screen), drawn from the rail ahead of the filter, A; 0 when the stages are apart. */
  readonly outputBplusAmps: number;
}

const cache = new WeakMap<object, { inputs: BuildInputs; design: WorkbenchState['design']; outputBench: WorkbenchState['outputBench']; amplifier: WorkbenchState['amplifier']; sheet: BuildSheet }>();
/** The last sheet per store (keyed by its stable commit action), served while a drag or typing is under way. */
const lastSheet = new WeakMap<object, BuildSheet>();

/** The rail the decoupling filter hangs from: the user's, or the design's B+. */
export const railOf = (s: WorkbenchState) => s.buildInputs.railVolts ?? s.design.bplus;

/**
 * The build sheet of the current design, computed by the model once per
 * (analysis, inputs, amplifier) and remembered, so panels can read it freely.
 */
export function buildSheetOf(s: WorkbenchState): BuildSheet {
  const hit = cache.get(s.analysis);
  // The output stage's current and the design's other stages are on the sheet too: an output-only change is a new sheet.
  // Every stage's parts are the solved amplifier's: a new amplifier is a new sheet.
  if (hit && hit.inputs === s.buildInputs && hit.design === s.design && hit.outputBench === s.outputBench && hit.amplifier === s.amplifier) return hit.sheet;
  // Like the signal views, the sheet is redone when the drag or the typing pauses, not on every frame.
  const last = lastSheet.get(s.commit);
  // (With the output stage on the bench the voltage stage's signal pass waits, so its staleness says nothing about this sheet.)
  if (last && (s.dragging || s.amplifier?.stale || (s.design.stageKind === 'voltage' && s.analysis.signal.stale))) return last;
  const sheet = compute(s);
  cache.set(s.analysis, { inputs: s.buildInputs, design: s.design, outputBench: s.outputBench, amplifier: s.amplifier, sheet });
  lastSheet.set(s.commit, sheet);
  return sheet;
}

function compute(s: WorkbenchState): BuildSheet {
  const inp = s.buildInputs;
  const d = s.design;
  const tube1 = s.analysis.tube;
  const stage = stageDesignOf(d, tube1, s.registry);
  const checked = normalizeStage(stage);
  if (!checked.ok) throw new Error(checked.message);
  const sol = s.analysis.solution;
  const link = s.analysis.signal.chain?.ok ? s.analysis.signal.chain.links[1] : undefined;
  const list = voltageStages(d);
  const bench = benchIndex(d);
  // The bench's block: its stage and the follower riding with it (their currents are the bench's own, solved live).
  const block = new Set(d.stage2.kind !== 'none' ? [bench, bench + 1] : [bench]);
  const inBlock = (i: number) => d.stageKind !== 'output' && block.has(i);
  const shown = (i: number) => (d.stageKind === 'voltage' && i === bench) || (d.stageKind === 'follower' && i === bench + 1);
  const view = s.amplifier;
  const amp = view?.result.ok ? view.result : null;
  // Without an output stage, Cout couples the last voltage stage into RL (or is there with none, to order).
  const intoLoad = !d.drivesOutput && (Number.isFinite(d.rl) || d.cout !== null) ? { loadCoupling: d.cout } : {};
  const stages: SheetStage[] = amp && view
    ? amplifierParts(view.input, amp, { series: d.series, ...intoLoad, unsized: { cc: IDEAL_CC, cornerHz: inp.cornerHz } }).map((p) => ({ ...p, onBench: inBlock(p.index), shown: shown(p.index) }))
    : [{ index: bench, title: `Stage ${bench + 1}, ${d.tubeId} gain stage`, onBench: true, shown: true, ...stagePartsList(checked, sol, d.series) }];
  // Every voltage stage's tube, and the splitter's sections, for the heaters (envelopes counted across the whole amplifier).
  const pair = drivesPair(d);
  const splitterTube = pair ? s.registry.lookup(d.output.splitter.tubeId) : undefined;
  const splitterSections = splitterTube ? Array.from({ length: d.output.splitter.kind === 'long-tailed-pair' ? 2 : 1 }, () => splitterTube) : [];
  const stageTubes = [...list.flatMap((p) => s.registry.lookup(p.tubeId) ?? []), ...splitterSections];
  const tubes = envelopesOf(stageTubes).map(({ tube, sectionsUsed, envelopes }) => {
    const chosen = tube.heaters.find((h) => h.wiring === d.heaters.wiring[tube.id]) ?? tube.heaters[0]!;
    return { tube, options: tube.heaters, chosen, sectionsUsed, envelopes };
  });
  // One heater per envelope, counted explicitly: two stages on one twin triode light one heater.
  const heaters = heaterTotals(tubes.flatMap((t) => Array.from({ length: t.envelopes }, () => t.chosen)));
  // A dropping resistor only where the heaters run from the DC supply: on the AC winding they take its voltage.
  const dropper = heaters.ok && d.heaters.voltageStages === 'dc' ? droppingResistor(heaters, d.heaters.dcVolts, d.series) : null;
  const splitterStage = pair && amp ? amp.stages[list.length] : undefined;
  const otherAmps = amp ? amp.stages.reduce((sum, st, i) => ((i < list.length && !block.has(i)) || st === splitterStage ? sum + st.supplyCurrent : sum), 0) : 0;
  const totalBplusAmps = sol.op.ia + (link?.op.ia ?? 0) + otherAmps;
  const filter = decouplingFilter(railOf(s), inp.filterR, inp.filterC, (b) => {
    const r = solveStage({ ...stage, bplus: b });
    return r.ok ? r.op.ia + (link?.op.ia ?? 0) + otherAmps : null;
  });
  const at = filter.ok ? solveStage({ ...stage, bplus: filter.stageBplus }) : null;
  return {
    stages,
    partial: view && !view.result.ok ? view.result.message : null,
    filteredOp: at?.ok ? { va: at.op.va, ia: at.op.ia } : null,
    forCorner: capacitorsForCorner(checked, sol, inp.cornerHz, 'E12'),
    cornerParts: { cin: `Cc${bench + 1}`, ck: `Ck${bench + 1}`, cout: d.after.length > 0 ? { ref: `Cc${bench + 2}`, box: null } : { ref: 'Cout', box: 'cout' } },
    spread: productionSpread(checked, sol, d.series, { seed: 1, runs: 160 }),
    tubes,
    heaters,
    dropper,
    elevation: heaterElevation(amp && view ? elevationStages(view.input, amp, outputSharesSmallWinding(d, s.registry)) : [{ name: `stage ${bench + 1}`, vk: sol.op.vk, ...hk(tube1) }]),
    elevationDivider: elevationPlanOf(d),
    filter,
    totalBplusAmps,
    outputBplusAmps: d.drivesOutput ? outputIdleAmps(s.outputBench) : 0,
  };
}

/** A tube's heater–cathode ratings as the elevation check takes them (a directly heated tube's filament is its cathode: none). */
function hk(tube: { readonly directlyHeated?: boolean; readonly ratings: { readonly maxHeaterCathodeVoltage: number | null; readonly maxHeaterCathodeVoltageCathodeNegative?: number } }) {
  return {
    maxVhk: tube.directlyHeated ? null : tube.ratings.maxHeaterCathodeVoltage,
    ...(tube.ratings.maxHeaterCathodeVoltageCathodeNegative !== undefined ? { maxVhkCathodeNegative: tube.ratings.maxHeaterCathodeVoltageCathodeNegative } : {}),
  };
}

/**
 * Every voltage stage's and the splitter's cathode, on the heater supply they
 * share, and the output stage's when its tubes' heaters are on that winding
 * too (`withOutput`; else they have their own).
 */
function elevationStages(input: ChainInput, amp: ChainResult, withOutput: boolean) {
  return input.stages.flatMap((st, i) => {
    if (st.kind === 'single-ended-output' || st.kind === 'push-pull-output') {
      const solved = amp.stages[i];
      return withOutput && solved ? [{ name: 'the output stage', vk: solved.op.vk, ...hk(st.tube) }] : [];
    }
    const tube = recordOf(st.tube);
    const solved = amp.stages[i];
    if (!tube || !solved) return [];
    return [{ name: st.kind === 'split-load' || st.kind === 'long-tailed-pair' ? 'the phase splitter' : `stage ${i + 1}`, vk: solved.op.vk, ...hk(tube) }];
  });
}
