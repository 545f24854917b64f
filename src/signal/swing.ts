import { CUTOFF_FRACTION } from '../tube/koren';
import { GRID_CURRENT_ONSET } from '../tube/gridCurrent';
import type { StageDesign } from '../stage/stageDesign';
import type { Result } from '../result';
import { solvedStage, type SolvedStage } from './analysisInput';
import { sineLevel, type Level } from './levels';
import { stageTransfer, type StageTransfer } from './stageTransfer';

/** What ends a stage's clean swing: the grid reaching the onset of grid current (GRID_CURRENT_ONSET), or the plate current falling to cutoff. */
export type SwingLimit = 'grid-current' | 'cutoff';

export interface SwingResult {
  /** Largest clean input (sine) peak, V, and its level. */
  readonly inputPeak: number;
  readonly input: Level;
  /** Output peak at that input (half the peak-to-peak excursion), V, and its level. */
  readonly outputPeak: number;
  readonly output: Level;
  readonly limitedBy: SwingLimit;
  /** Input peaks at which each limit is reached on its own half-cycle, V (positive numbers). */
  readonly toGridCurrent: number;
  readonly toCutoff: number;
}

const BISECTIONS = 60;

/** Smallest positive x with pred(x) true, given pred(0) false and pred monotone; bisection with an expanding upper end. */
function firstTrue(pred: (x: number) => boolean, start: number, bisections: number): number {
  let hi = Math.max(start, 1e-6);
  for (let k = 0; k < 60 && !pred(hi); k++) hi *= 2;
  let lo = 0;
  for (let k = 0; k < bisections; k++) {
    const mid = 0.5 * (lo + hi);
    if (pred(mid)) hi = mid;
    else lo = mid;
  }
  return hi;
}

/**
 * The clean swing of a solved stage on its transfer curve: the positive input
 * half-cycle ends where the grid, as the source would swing it, reaches the
 * onset of grid current (about −0.7 V to the cathode, see gridCurrent), the negative one where
 * Ia falls to 1 % of its quiescent value (this project's cutoff convention).
 * A symmetric sine is clean up to the smaller of the two.
 */
export function swingOf(s: SolvedStage, transfer: StageTransfer = stageTransfer(s.checked, s.solution.op), bisections = BISECTIONS): SwingResult {
  const { op } = s.solution;
  // The open-circuit grid (the loaded one plus the grid current's drop on the source) against the onset;
  // a grid biased past the onset already draws current and has no clean swing.
  const toGridCurrent = op.vgk >= GRID_CURRENT_ONSET ? 0 : firstTrue((v) => { const x = transfer.at(v); return x.vgk + x.gridDrop >= GRID_CURRENT_ONSET; }, GRID_CURRENT_ONSET - op.vgk, bisections);
  const cutoffIa = CUTOFF_FRACTION * op.ia;
  const toCutoff = firstTrue((v) => transfer.at(-v).ia <= cutoffIa, -op.vgk, bisections);
  const input = sineLevel(Math.min(toGridCurrent, toCutoff));
  // A grid with no bias has no clean swing at all: exactly 0, not a bisection's last 1e-24 V.
  const output = sineLevel(input.peak > 0 ? Math.abs(transfer.at(input.peak).vout - transfer.at(-input.peak).vout) / 2 : 0);
  return {
    inputPeak: input.peak,
    input,
    outputPeak: output.peak,
    output,
    limitedBy: toGridCurrent <= toCutoff ? 'grid-current' : 'cutoff',
    toGridCurrent: sineLevel(toGridCurrent).peak,
    toCutoff: sineLevel(toCutoff).peak,
  };
}

/** The largest clean input and output peaks of a stage, and what limits them. */
export function swing(design: StageDesign): Result<SwingResult> {
  const s = solvedStage(design);
  if (!s.ok) return s;
  return { ok: true, ...swingOf(s) };
}
