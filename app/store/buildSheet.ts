import { outputIdleAmps } from './outputAnalysis';
import {
  bypassResistance, capacitorForCorner, envelopesOf, capacitorLine, capacitorsForCorner, decouplingFilter, resistorLine, droppingResistor, heaterElevation, heaterTotals, normalizeStage, productionSpread,
  followerCouplingParts, solveStage, stagePartsList, type CapacitorForCorner, type CapacitorLine, type DecouplingResult, type DroppingResistor,
  type Failure, type HeaterOption, type HeaterPlan, type ResistorLine, type Spread, type StageParts, type TubeRecord,
} from '../../src/index';
import { stageDesignOf } from './analysis';
import { offBenchParts } from './chainParts';
import { drivesPair, splitterDirect } from './outputPlan';
import { benchIndex, voltageStages } from './stagePlans';
import type { WorkbenchState } from './workbenchStore';

/** The builder's own inputs for the build sheet. */
export interface BuildInputs {
  readonly cornerHz: number;
  readonly heaterSupplyVolts: number;
  /** Heater wiring chosen per tube type (by id); default the first option. */
  readonly heaterWiring: Readonly<Record<string, string>>;
  /** The rail ahead of the decoupling filter, V; null follows the design's B+ until the user sets one. */
  readonly railVolts: number | null;
  readonly filterR: number;
  readonly filterC: number;
  readonly showSpread: boolean;
}

export const DEFAULT_BUILD: BuildInputs = { cornerHz: 5, heaterSupplyVolts: 12.6, heaterWiring: {}, railVolts: null, filterR: 4.7e3, filterC: 47e-6, showSpread: true };

export interface BuildSheet {
  readonly resistors: readonly ResistorLine[];
  readonly capacitors: readonly CapacitorLine[];
  readonly forCorner: ({ ok: true; cin: CapacitorForCorner | null; cout: CapacitorForCorner | null; ck: CapacitorForCorner | null }) | Failure;
  readonly spread: ({ ok: true } & Spread) | Failure;
  readonly tubes: readonly { tube: TubeRecord; options: readonly HeaterOption[]; chosen: HeaterOption; sectionsUsed: number; envelopes: number }[];
  readonly heaters: ({ ok: true } & HeaterPlan) | Failure;
  readonly dropper: ({ ok: true } & DroppingResistor) | Failure | null;
  readonly elevation: { ok: true; lo: number | null; hi: number | null; suggested: number; groundedOk: boolean } | Failure;
  readonly filter: ({ ok: true } & DecouplingResult) | Failure;
  /** Where stage 1 then sits, with the filter's B+. */
  readonly filteredOp: { va: number; ia: number } | null;
  readonly totalBplusAmps: number;
  /** The voltage stages not on the bench, each with its own parts. */
  readonly otherStages: readonly StageParts[];
  /** The bench stage's place, for the parts table's heading (e.g. "Stage 2, 12AX7"). */
  readonly benchTitle: string;
  /** The driven output stage's cathode current (plate and screen), drawn from the rail ahead of the filter, A; 0 when the stages are apart. */
  readonly outputBplusAmps: number;
}

const cache = new WeakMap<object, { inputs: BuildInputs; design: WorkbenchState['design']; outputBench: WorkbenchState['outputBench']; sheet: BuildSheet }>();
/** The last sheet per store (keyed by its stable commit action), served while a drag or typing is under way. */
const lastSheet = new WeakMap<object, BuildSheet>();

/**
 * The build sheet of the current design, computed by the model once per
 * (analysis, inputs) pair and remembered, so panels can read it freely.
 */
/** The rail the decoupling filter hangs from: the user's, or the design's B+. */
export const railOf = (s: WorkbenchState) => s.buildInputs.railVolts ?? s.design.bplus;

export function buildSheetOf(s: WorkbenchState): BuildSheet {
  const hit = cache.get(s.analysis);
  // The output stage's current and the design's other stages are on the sheet too: an output-only change is a new sheet.
  if (hit && hit.inputs === s.buildInputs && hit.design === s.design && hit.outputBench === s.outputBench) return hit.sheet;
  // Like the signal views, the sheet is redone when the drag or the typing pauses, not on every frame.
  const last = lastSheet.get(s.commit);
  // (With the output stage on the bench the voltage stage's signal pass waits, so its staleness says nothing about this sheet.)
  if (last && (s.dragging || (s.design.stageKind === 'voltage' && s.analysis.signal.stale))) return last;
  const sheet = compute(s);
  cache.set(s.analysis, { inputs: s.buildInputs, design: s.design, outputBench: s.outputBench, sheet });
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
  const parts = stagePartsList(checked, sol, d.series);
  const resistors = [...parts.resistors];
  const capacitors = [...parts.capacitors];
  const link = s.analysis.signal.chain?.ok ? s.analysis.signal.chain.links[1] : undefined;
  if (link) {
    // Each stage's capacitors with that stage's own voltages; values the design does not hold are sized for the wanted corner.
    const ia2 = link.op.ia;
    const forCorner = (r: number) => capacitorForCorner(r, inp.cornerHz, 'E12').preferred;
    if (link.kind === 'common-cathode') {
      resistors.push(resistorLine('Ra2', 'stage 2 plate load', d.stage2.ra, ia2, d.series));
      resistors.push(resistorLine('Rg2', 'stage 2 grid leak', d.stage2.rg, 0, d.series));
      capacitors.push(capacitorLine('Cc', 'between the stages', forCorner(sol.zout + d.stage2.rg), sol.op.va, d.bplus, '+ to stage 1\'s plate'));
      const rLoad2 = Number.isFinite(d.rl) ? (d.stage2.ra * d.rl) / (d.stage2.ra + d.rl) : d.stage2.ra;
      capacitors.push(capacitorLine('Ck2', 'stage 2 cathode bypass', forCorner(bypassResistance(d.stage2.rk, link.mu, link.rp, rLoad2)), link.op.vk, 0, '+ to the cathode'));
      if (!splitterDirect(d) && (d.cout !== null || Number.isFinite(d.rl))) capacitors.push(capacitorLine('Cout', d.drivesOutput ? (drivesPair(d) ? 'coupling into the splitter\'s grid' : 'coupling into the output grid') : 'output coupling from stage 2', d.cout, link.op.va - (drivesPair(d) ? d.output.splitter.vgrid : 0), d.bplus, '+ to stage 2\'s plate'));
    } else {
      const c = d.stage2.coupling;
      if (c) {
        const own = followerCouplingParts(c, 2, sol.op.va, d.bplus, d.series);
        resistors.push(...own.resistors);
        capacitors.push(...own.capacitors);
      }
      // Cold, the follower passes no current; as it warms its cathode rises toward its grid: stage 1's plate (at B+ cold), or its own divider's voltage.
      if (d.cout !== null || Number.isFinite(d.rl)) capacitors.push(capacitorLine('Cout', 'output coupling from the follower\'s cathode', d.cout, link.op.vk, c ? c.vbias : d.bplus, '+ to the cathode'));
    }
    resistors.push(resistorLine('Rk2', link.kind === 'follower' ? 'follower cathode load' : 'stage 2 cathode bias', d.stage2.rk, ia2, d.series));
  }
  // Every voltage stage's tube, for the heaters (envelopes counted across the whole chain).
  const list = voltageStages(d);
  const bench = benchIndex(d);
  const onBench = new Set(d.stage2.kind !== 'none' ? [bench, bench + 1] : [bench]);
  // The splitter before a driven pair hangs from the voltage stages' node and lights its sections beside theirs.
  const pair = drivesPair(d);
  const splitterTube = pair ? s.registry.lookup(d.output.splitter.tubeId) : undefined;
  const splitterSections = splitterTube ? Array.from({ length: d.output.splitter.kind === 'long-tailed-pair' ? 2 : 1 }, () => splitterTube) : [];
  const stageTubes = [...list.flatMap((p) => s.registry.lookup(p.tubeId) ?? []), ...splitterSections];
  const amp = s.amplifier?.result.ok ? s.amplifier.result : null;
  const splitterStage = pair && amp ? amp.stages[list.length] : undefined;
  const otherStages = s.amplifier ? offBenchParts(s.amplifier, onBench, d.series) : [];
  const otherAmps = amp ? amp.stages.reduce((sum, st, i) => ((i < list.length && !onBench.has(i)) || st === splitterStage ? sum + st.supplyCurrent : sum), 0) : 0;
  const tubes = envelopesOf(stageTubes).map(({ tube, sectionsUsed, envelopes }) => {
    const chosen = tube.heaters.find((h) => h.wiring === inp.heaterWiring[tube.id]) ?? tube.heaters[0]!;
    return { tube, options: tube.heaters, chosen, sectionsUsed, envelopes };
  });
  // One heater per envelope, counted explicitly: two stages on one twin triode light one heater.
  const heaters = heaterTotals(tubes.flatMap((t) => Array.from({ length: t.envelopes }, () => t.chosen)));
  const dropper = heaters.ok ? droppingResistor(heaters, inp.heaterSupplyVolts, d.series) : null;
  const hk = (tube: TubeRecord) => ({
    maxVhk: tube.directlyHeated ? null : tube.ratings.maxHeaterCathodeVoltage,
    ...(tube.ratings.maxHeaterCathodeVoltageCathodeNegative !== undefined ? { maxVhkCathodeNegative: tube.ratings.maxHeaterCathodeVoltageCathodeNegative } : {}),
  });
  const stages = [{ name: 'stage 1', vk: sol.op.vk, ...hk(tube1) }];
  if (link) stages.push({ name: 'stage 2', vk: link.op.vk, ...hk(s.registry.lookup(d.stage2.tubeId)!) });
  const totalBplusAmps = sol.op.ia + (link?.op.ia ?? 0) + otherAmps;
  const filter = decouplingFilter(railOf(s), inp.filterR, inp.filterC, (b) => {
    const r = solveStage({ ...stage, bplus: b });
    return r.ok ? r.op.ia + (link?.op.ia ?? 0) + otherAmps : null;
  });
  const at = filter.ok ? solveStage({ ...stage, bplus: filter.stageBplus }) : null;
  return {
    filteredOp: at?.ok ? { va: at.op.va, ia: at.op.ia } : null,
    resistors,
    capacitors,
    forCorner: capacitorsForCorner(checked, sol, inp.cornerHz, 'E12'),
    spread: productionSpread(checked, sol, d.series, { seed: 1, runs: 160 }),
    tubes,
    heaters,
    dropper,
    elevation: heaterElevation(stages),
    filter,
    totalBplusAmps,
    otherStages,
    benchTitle: `Stage ${bench + 1}, ${d.tubeId}${d.stage2.kind !== 'none' ? ` and its follower (stage ${bench + 2})` : ''}`,
    outputBplusAmps: d.drivesOutput ? outputIdleAmps(s.outputBench) : 0,
  };
}
