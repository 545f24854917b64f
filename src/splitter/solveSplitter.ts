import { fail, type Failure, type Result } from '../result';
import type { Finding } from '../stage/findings';
import type { OperatingPoint } from '../stage/solveStage';
import type { TubeLike } from '../tube/types';
import { solveCathodyne } from './cathodyne';
import { bothTriodesFindings, solveLongTailedPair } from './longTailedPair';
import type { BalancePoint } from './splitterOutputs';

/** Either phase splitter, as the push-pull stage after it loads it. SI units. */
export type SplitterDesign =
  | { readonly kind: 'split-load'; readonly tube: TubeLike; readonly bplus: number; readonly ra: number; readonly rk: number; readonly vgrid: number; readonly rl: number; readonly cl?: number; readonly heaterVolts?: number }
  | {
      readonly kind: 'long-tailed-pair'; readonly tube: TubeLike; readonly bplus: number; readonly ra: number; readonly ra2?: number; readonly rk: number; readonly rtail: number;
      readonly vgrid: number; readonly rl: number; readonly cl?: number; readonly heaterVolts?: number;
    };

export interface SplitterOutput {
  /** Gain from the grid to this output with both loaded, signed. */
  readonly gain: number;
  /** Its output impedance with the other output loaded, Ω. */
  readonly zout: number;
  /** Its peak at the splitter's own clean limit, V. */
  readonly swingPeak: number;
}

export interface SplitterResult {
  /** The inverted output first (the split-load's plate, the first plate of a pair), then the in-phase one. */
  readonly outputs: readonly [SplitterOutput, SplitterOutput];
  /** The in-phase output's size over the inverted one's at midband. */
  readonly balance: number;
  /** The balance against frequency with the loads' capacitance. */
  readonly balanceAt: readonly BalancePoint[];
  /** The grid's clean peak and what ends it. */
  readonly inputPeak: number;
  readonly limitedBy: 'grid-current' | 'cutoff';
  /** Each triode's operating point (one for the split-load). */
  readonly op: readonly OperatingPoint[];
  /** A long-tailed pair's tail: its current and the voltage at its top; null for the split-load. */
  readonly tail: { readonly current: number; readonly volts: number } | null;
  readonly findings: readonly Finding[];
}

const named = (f: Failure): Failure => (f.field === 'grid.volts' ? { ...f, field: 'vgrid' } : f.field === 'tail.rt' ? { ...f, field: 'rtail' } : f.field === 'ra1' ? { ...f, field: 'ra' } : f);

/**
 * Either splitter's figures in one shape: each output's gain, impedance and
 * clean peak, the balance (and against frequency, with the next grids'
 * capacitance), each triode's point, a pair's tail, and the findings.
 */
export function solveSplitter(design: SplitterDesign): Result<SplitterResult> {
  if (typeof design !== 'object' || design === null) return fail('invalid-input', 'No phase-splitter design given');
  const d = design;
  const loads = { rl: d.rl, ...(d.cl !== undefined ? { cl: d.cl } : {}), ...(d.heaterVolts !== undefined ? { heaterVolts: d.heaterVolts } : {}) };
  if (d.kind === 'split-load') {
    const r = solveCathodyne({ tube: d.tube, bplus: d.bplus, ra: d.ra, rk: d.rk, rb: 0, grid: { kind: 'fixed', volts: d.vgrid }, ...loads });
    if (!r.ok) return named(r);
    return {
      ok: true,
      outputs: [
        { gain: r.gainPlate, zout: r.zPlate, swingPeak: r.swing.platePeak },
        { gain: r.gainCathode, zout: r.zCathode, swingPeak: r.swing.cathodePeak },
      ],
      balance: r.balance,
      balanceAt: r.balanceAt,
      inputPeak: r.swing.inputPeak,
      limitedBy: r.swing.limitedBy,
      op: [r.op],
      tail: null,
      findings: r.findings,
    };
  }
  if (d.kind !== 'long-tailed-pair') return fail('invalid-input', 'Choose a split-load or long-tailed pair splitter', 'kind');
  const r = solveLongTailedPair({ tube: d.tube, bplus: d.bplus, ra1: d.ra, ra2: d.ra2 ?? d.ra, rk: d.rk, tail: { kind: 'resistor', rt: d.rtail }, grid: { kind: 'fixed', volts: d.vgrid }, ...loads });
  if (!r.ok) return named(r);
  return {
    ok: true,
    outputs: [
      { gain: r.gain1, zout: r.zout[0], swingPeak: r.swing.peaks[0] },
      { gain: r.gain2, zout: r.zout[1], swingPeak: r.swing.peaks[1] },
    ],
    balance: r.balance,
    balanceAt: r.balanceAt,
    inputPeak: r.swing.inputPeak,
    limitedBy: r.swing.limitedBy,
    op: r.ops,
    tail: { current: r.tailCurrent, volts: r.tailVolts },
    findings: bothTriodesFindings(r.findings),
  };
}

/**
 * A grid's input capacitance with the Miller effect, F: Cgk plus Cgp times
 * one plus the grid-to-plate voltage gain (Miller, 1920).
 */
export function millerInputCapacitance(caps: { readonly cgk: number; readonly cgp: number }, plateGain: number): number {
  // A record without capacitances (a user's tube may have none) adds none; beyond a microfarad or a gain of a
  // million nothing is a tube's, and holding them there keeps the answer finite for any finite input.
  const part = (x: unknown) => (typeof x === 'number' && Number.isFinite(x) && x > 0 ? Math.min(x, 1e-6) : 0);
  const c = (typeof caps === 'object' && caps !== null ? caps : {}) as { cgk?: unknown; cgp?: unknown };
  const gain = Number.isNaN(plateGain) ? plateGain : Math.min(Math.abs(plateGain), 1e6);
  return part(c.cgk) + part(c.cgp) * (1 + gain);
}
