import { biasForPoint } from '../output/outputBias';
import { CUTOFF_SHARE } from '../output/outputSignal';
import { cycleForPower, driveToFloor, highestWithin, powerWithin, singleEndedTransfer, type GridTransfer } from '../output/gridTransfer';
import type { OutputDesign } from '../output/outputDesign';
import type { OutputTube } from '../output/outputTube';
import { outputSolutionAt, solveOutput, type OutputSolution } from '../output/solveOutput';
import { pairBiasForPoint } from '../pushpull/pairBias';
import { pairTransfer } from '../pushpull/pairTransfer';
import type { PushPullDesign } from '../pushpull/pushPullDesign';
import { plateToPlateImpedance } from '../pushpull/pushPullFigures';
import { solvePushPull, type PushPullSolution } from '../pushpull/solvePushPull';
import type { CostlyPart } from './refinePlane';
import type { TargetName, Targets } from './targets';
import { sharedMargin, withinRange, type RatedLimits, type SharedFigures } from './verdict';

/**
 * One output stage against its targets: one tube (single-ended) or a pair
 * (push-pull), its design as the bench holds it.
 */
export type OutputTargetStage =
  | { readonly pair: 'single-ended'; readonly tube: OutputTube; readonly design: OutputDesign }
  | { readonly pair: 'push-pull'; readonly tube: OutputTube; readonly design: PushPullDesign };

/** The bias and B+ that put the stage's tube (each tube of a pair) at a point of the plane. */
export interface OutputParts {
  readonly bplus: number;
  /** Cathode bias: the cathode resistor, Ω (the shared one for a pair). Fixed bias: 0. */
  readonly rk: number;
  /** Fixed bias: the grid supply, V. Cathode bias: the grid's voltage to its cathode, V. */
  readonly vg: number;
}

/** The targets an output stage answers from its large signal: each needs the stage's transfer. */
export const COSTLY_TARGETS: readonly TargetName[] = ['minPower', 'maxThdAtPower', 'minGridHeadroom'];

/** A stage solved at its idle point: the figures at hand, and the large-signal ones from a transfer built on first asking. */
export interface SolvedOutput {
  readonly shared: SharedFigures;
  /** The supply at the primary's B+ end (the centre tap for a pair), V. */
  readonly bplus: number;
  /** The clean grid swing to grid current or cutoff, V peak. */
  readonly headroom: () => number;
  /** The most power within a THD, W. */
  readonly powerWithin: (thd: number) => number;
  /** THD at a power (null past what the grid reaches before grid current), and the most power it reaches. */
  readonly thdAtPower: (power: number) => { readonly thd: number | null; readonly most: number };
}

export const limitsOf = (tube: OutputTube): RatedLimits => ({
  plateDissipation: tube.ratings.maxPlateDissipation,
  heaterCathode: tube.ratings.maxHeaterCathodeVoltage,
  heaterCathodeNegative: tube.ratings.maxHeaterCathodeVoltageCathodeNegative ?? tube.ratings.maxHeaterCathodeVoltage,
});

function thdAt(t: GridTransfer, power: number) {
  const r = cycleForPower(t, power);
  return { thd: r.at?.thd ?? null, most: r.most };
}

/** A single-ended stage's figures; output impedance at the speaker: the plate's source impedance (rp and the primary's resistance) through the turns ratio. */
export function singleEndedFigures(s: OutputSolution): SolvedOutput {
  const { op, design } = s;
  let transfer: GridTransfer | null = null;
  const t = () => (transfer ??= singleEndedTransfer(s));
  return {
    shared: { pa: op.pa, zout: ((op.rp + design.rPrimary) * design.speakerOhms) / design.zPrimary, rk: design.bias === 'cathode' ? design.rk : 0, vhk: op.vk - (design.heaterVolts ?? 0) },
    bplus: design.bplus,
    headroom: () => driveToFloor(t(), CUTOFF_SHARE * op.ip) ?? t().span,
    powerWithin: (thd) => powerWithin(t(), thd).power,
    thdAtPower: (power) => thdAt(t(), power),
  };
}

/** A pair's figures: each tube's idle dissipation (the hotter), the plate-to-plate source impedance at the speaker, the grids' swing to grid current. */
export function pairFigures(s: PushPullSolution): SolvedOutput {
  const d = s.design;
  let transfer: GridTransfer | null = null;
  const t = () => (transfer ??= pairTransfer(s));
  const zpp = plateToPlateImpedance(s);
  return {
    shared: { pa: Math.max(s.idle[0].pa, s.idle[1].pa), zout: zpp === null ? Infinity : (zpp * d.speakerOhms) / d.raa, rk: d.bias === 'cathode' ? d.rk : 0, vhk: s.vk - (d.heaterVolts ?? 0) },
    bplus: d.bplus,
    headroom: () => Math.max(0, Math.min(-s.vgk, -s.vgk2)),
    powerWithin: (thd) => highestWithin(t(), thd)?.power ?? 0,
    thdAtPower: (power) => thdAt(t(), power),
  };
}

/** The stage as designed, solved: its figures, or null when it does not solve. */
export function solveOutputStage(stage: OutputTargetStage): SolvedOutput | null {
  if (stage.pair === 'single-ended') {
    const s = solveOutput(stage.tube, stage.design);
    return s.ok ? singleEndedFigures(s) : null;
  }
  const s = solvePushPull(stage.tube, stage.design);
  return s.ok ? pairFigures(s) : null;
}

/**
 * The stage moved to a point of the plane: the bias and B+ that put the
 * tube there (as a drag finds them), solved there; null where it cannot
 * idle there. A single tube is built at the point without solving its loops
 * again (outputSolutionAt).
 */
export function placeOutput(stage: OutputTargetStage, vpk: number, ip: number): { readonly parts: OutputParts; readonly solved: SolvedOutput } | null {
  const cathode = stage.design.bias === 'cathode';
  if (stage.pair === 'single-ended') {
    const b = biasForPoint(stage.tube, stage.design, vpk, ip);
    if (!b.ok) return null;
    const design: OutputDesign = cathode ? { ...stage.design, bplus: b.bplus, rk: b.rk } : { ...stage.design, bplus: b.bplus, vg: b.vgk };
    const s = outputSolutionAt(stage.tube, design, vpk, b.vgk);
    return s.ok ? { parts: { bplus: b.bplus, rk: cathode ? b.rk : 0, vg: b.vgk }, solved: singleEndedFigures(s) } : null;
  }
  const b = pairBiasForPoint(stage.tube, stage.design, vpk, ip);
  if (!b.ok) return null;
  const s = solvePushPull(stage.tube, cathode ? { ...stage.design, bplus: b.bplus, rk: b.rk } : { ...stage.design, bplus: b.bplus, vg: b.vgk });
  return s.ok ? { parts: { bplus: b.bplus, rk: cathode ? b.rk : 0, vg: b.vgk }, solved: pairFigures(s) } : null;
}

/** The targets answered from the figures at hand (dissipation, output impedance, Rk, B+, heater–cathode). */
export function plainPart(active: readonly TargetName[], targets: Targets, s: SolvedOutput, limits: RatedLimits): Pick<CostlyPart, 'margins' | 'values'> {
  const margins: Partial<Record<TargetName, number>> = {};
  const values: Partial<Record<TargetName, number | null>> = {};
  for (const k of active) {
    if (k === 'bplusRange') {
      values.bplusRange = s.bplus;
      margins.bplusRange = withinRange(s.bplus, targets.bplusRange!);
      continue;
    }
    const m = sharedMargin(k, s.shared, limits, targets);
    if (m) {
      values[k] = m.value;
      margins[k] = m.margin;
    }
  }
  return { margins, values };
}

/** The targets answered from the large signal (power within a THD, THD at a power, the grid's swing): one transfer serves them all. */
export function costlyPart(active: readonly TargetName[], targets: Targets, s: SolvedOutput): CostlyPart {
  const margins: Partial<Record<TargetName, number>> = {};
  const values: Partial<Record<TargetName, number | null>> = {};
  for (const k of active) {
    if (k === 'minPower') {
      const p = s.powerWithin(targets.minPower!.thd);
      values.minPower = p;
      margins.minPower = p / targets.minPower!.power - 1;
    } else if (k === 'maxThdAtPower') {
      // Held below grid current: a working power the grid cannot reach fails, by how far short the most it gives is.
      const want = targets.maxThdAtPower!;
      const r = s.thdAtPower(want.power);
      values.maxThdAtPower = r.thd;
      margins.maxThdAtPower = r.thd === null ? r.most / want.power - 1 : 1 - r.thd / want.thd;
    } else if (k === 'minGridHeadroom') {
      values.minGridHeadroom = s.headroom();
      margins.minGridHeadroom = s.headroom() / targets.minGridHeadroom! - 1;
    }
  }
  return { margins, values, exact: true };
}
