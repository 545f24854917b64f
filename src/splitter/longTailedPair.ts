import { bracketedRoot } from '../numeric/bracketedRoot';
import { fail, type Result } from '../result';
import { checkNumber, checkTube, LIMITS } from '../stage/checkInput';
import { ratingsFindings, type Finding } from '../stage/findings';
import { parallel } from '../stage/parallel';
import { CUTOFF_CURRENT_A, type OperatingPoint } from '../stage/solveStage';
import { korenPlateCurrent } from '../tube/koren';
import { smallSignalAt } from '../tube/triode';
import { modelOf, type TubeLike } from '../tube/types';
import { balancePoint, BALANCE_HZ, checkSplitterLoads, type BalancePoint, type SplitterLoads } from './splitterOutputs';
import { solveComplex, type Complex } from './complexSolve';

/**
 * The long-tailed pair (cathode-coupled) phase splitter: two triodes with
 * plate resistors Ra1 and Ra2 (unequal to trim the balance), their cathodes
 * joined into a shared bias resistor Rk and a tail: a resistor Rt to ground
 * or a negative supply, or a constant current. Grid 1 takes the signal and
 * grid 2 is held at signal ground by a capacitor; both grids sit at one DC
 * voltage (fixed: direct-coupled or a divider), or return through their
 * leaks to the Rk–tail junction ("tap"). Each output drives the next grid's
 * resistor and capacitance through coupling capacitors (short at signal
 * frequencies). SI units.
 */
export interface LongTailedPairDesign extends SplitterLoads {
  readonly tube: TubeLike;
  readonly bplus: number;
  readonly ra1: number;
  readonly ra2: number;
  /** Shared cathode bias resistor, from the cathodes to the top of the tail, Ω; 0 for none. */
  readonly rk: number;
  readonly tail: { readonly kind: 'resistor'; readonly rt: number; readonly vee?: number } | { readonly kind: 'current'; readonly amps: number };
  readonly grid: { readonly kind: 'fixed'; readonly volts: number } | { readonly kind: 'tap' };
}

export interface LongTailedPairResult {
  readonly ops: readonly [OperatingPoint, OperatingPoint];
  readonly mu: readonly [number, number];
  readonly rp: readonly [number, number];
  readonly gm: readonly [number, number];
  /** Gain from grid 1 to each plate with both loaded, signed: plate 1 inverts, plate 2 follows. */
  readonly gain1: number;
  readonly gain2: number;
  /** The joined cathodes' swing over grid 1's, at midband (about a half with a long tail: the second triode's grid-to-cathode drive). */
  readonly gainCathode: number;
  /** Plate 2's output over plate 1's, in magnitude (below 1 with equal plate resistors and a finite tail). */
  readonly balance: number;
  /** Each plate's output impedance with the grids at signal ground and the other plate loaded, Ω. */
  readonly zout: readonly [number, number];
  /** Balance against frequency with the loads' capacitance. */
  readonly balanceAt: readonly BalancePoint[];
  /** The tail: its current (the pair's common-mode current), and the voltage at the cathodes and at its top, V. */
  readonly tailCurrent: number;
  readonly cathodeVolts: number;
  readonly tailVolts: number;
  /** The clean swing of a sine on grid 1: its peak, each plate's peak, and what ends it on which tube. */
  readonly swing: { readonly inputPeak: number; readonly peaks: readonly [number, number]; readonly limitedBy: 'grid-current' | 'cutoff'; readonly tube: 1 | 2 };
  readonly findings: readonly [readonly Finding[], readonly Finding[]];
}

const TOL = 1e-12;

/** One tube's current where its plate load (DC drop at idle, `rAc` for the signal beyond it) and its grid–cathode voltage agree. */
export function tubeCurrent(p: Parameters<typeof korenPlateCurrent>[0], topVolts: number, i0: number, rAc: number, vk: number, vgk: number): number {
  // va = topVolts − (i − i0)·rAc, where topVolts is the plate's idle voltage; the residual rises with i.
  const hi = Math.max((topVolts - vk) / rAc + i0, 1e-9);
  const f = (i: number) => i - korenPlateCurrent(p, topVolts - (i - i0) * rAc - vk, vgk);
  if (f(0) >= 0) return 0;
  return bracketedRoot(f, 0, hi, TOL * (1 + hi)).x;
}

export function solveLongTailedPair(design: LongTailedPairDesign): Result<LongTailedPairResult> {
  if (typeof design !== 'object' || design === null) return fail('invalid-input', 'No phase-splitter design given');
  const d = design;
  const tail = d.tail as { kind?: unknown; rt?: unknown; vee?: unknown; amps?: unknown } | undefined;
  const grid = d.grid as { kind?: unknown; volts?: unknown } | undefined;
  const problem =
    checkTube(d.tube) ??
    checkNumber('bplus', 'B+', d.bplus, 'V', 1, LIMITS.maxVolts) ??
    checkNumber('ra1', 'Ra (first plate)', d.ra1, 'Ω', 1, LIMITS.maxOhms) ??
    checkNumber('ra2', 'Ra (second plate)', d.ra2, 'Ω', 1, LIMITS.maxOhms) ??
    checkNumber('rk', 'Rk', d.rk, 'Ω', 0, LIMITS.maxOhms) ??
    (typeof tail !== 'object' || tail === null || (tail.kind !== 'resistor' && tail.kind !== 'current') ? fail('invalid-input', 'Give the tail a resistor or a constant current', 'tail') : null) ??
    (tail?.kind === 'resistor' ? checkNumber('tail.rt', 'Tail resistor', tail.rt, 'Ω', 1, LIMITS.maxOhms) ?? (tail.vee === undefined ? null : checkNumber('tail.vee', 'Tail supply', tail.vee, 'V', -LIMITS.maxVolts, 0)) : null) ??
    (tail?.kind === 'current' ? checkNumber('tail.amps', 'Tail current', tail.amps, 'A', 1e-6, 1) : null) ??
    (typeof grid !== 'object' || grid === null || (grid.kind !== 'tap' && grid.kind !== 'fixed') ? fail('invalid-input', 'Give the grids a fixed voltage or return them to the tail', 'grid') : null) ??
    (grid?.kind === 'fixed' ? checkNumber('grid.volts', 'Grid voltage', grid.volts, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) : null) ??
    checkSplitterLoads(d);
  if (problem) return problem;
  if (d.tail.kind === 'current' && d.grid.kind === 'tap') return fail('invalid-input', 'A constant-current tail has no junction to return the grids to: give them a fixed voltage', 'grid');
  const p = modelOf(d.tube).params;
  const ra = [d.ra1, d.ra2] as const;
  const rl = d.rl ?? Infinity;
  const cl = d.cl ?? 0;
  const heaterVolts = d.heaterVolts ?? 0;
  const vee = d.tail.kind === 'resistor' ? (d.tail.vee ?? 0) : 0;

  // DC: at a cathode voltage vk, each tube's current; the tail then asks for its own current; one vk satisfies both.
  const gridAt = (vk: number, sum: number): number => {
    if (d.grid.kind === 'fixed') return d.grid.volts;
    return vk - sum * d.rk; // the grids at the tail's top
  };
  const currentsAt = (vk: number, vg: number) => [0, 1].map((i) => tubeCurrent(p, d.bplus, 0, ra[i]!, vk, vg - vk)) as [number, number];
  let vk: number;
  let currents: [number, number];
  if (d.tail.kind === 'current') {
    const want = d.tail.amps;
    const vg = (d.grid as { volts: number }).volts;
    const excess = (x: number) => currentsAt(x, vg).reduce((a, b) => a + b, 0) - want;
    if (excess(vg) < 0) return fail('grid-current', `The pair cannot pass ${(want * 1e3).toFixed(1)} mA without its grids going positive: lower the tail current or raise B+`, 'tail.amps');
    vk = bracketedRoot(excess, vg, vg + d.bplus, TOL * d.bplus).x;
    currents = currentsAt(vk, vg);
  } else {
    const rt = d.tail.rt;
    // The sum S sets the cathode (vee + S·(rt + rk)) and, for a tap, the grids; the tubes answer with their own sum.
    const cathodeOf = (s: number) => vee + s * (rt + d.rk);
    const excess = (s: number) => {
      const x = cathodeOf(s);
      const c = currentsAt(x, gridAt(x, s));
      return c[0] + c[1] - s;
    };
    const top = (d.bplus - vee) / (rt + d.rk);
    const s = bracketedRoot(excess, 0, top, TOL * (1 + top)).x;
    vk = cathodeOf(s);
    currents = currentsAt(vk, gridAt(vk, s));
  }
  const sum = currents[0] + currents[1];
  const vg = gridAt(vk, sum);
  const vgk = vg - vk;
  if (vgk > 0) return fail('grid-current', `The grids would sit ${vgk.toFixed(2)} V positive to the cathodes and draw current: ${d.grid.kind === 'fixed' ? 'lower the grid voltage or raise the tail' : 'raise Rk'}.`, d.grid.kind === 'fixed' ? 'grid.volts' : 'rk');
  if (currents[0] < CUTOFF_CURRENT_A || currents[1] < CUTOFF_CURRENT_A) return fail('cutoff', 'A tube of the pair is cut off: raise the grids or the tail current', d.grid.kind === 'fixed' ? 'grid.volts' : 'rk');
  const ops = currents.map((ia, i) => {
    const va = d.bplus - ia * ra[i]!;
    return { va, vk, ia, vgk, vpk: va - vk, pa: (va - vk) * ia };
  }) as [OperatingPoint, OperatingPoint];
  const ss = ops.map((o) => smallSignalAt(d.tube, o.vpk, o.vgk));
  const gm = [ss[0]!.gm, ss[1]!.gm] as const;
  const rp = [ss[0]!.rp, ss[1]!.rp] as const;
  // The tail as the signal sees it: the resistors to signal ground, or an ideal current source (open).
  const yTail = d.tail.kind === 'resistor' ? 1 / (d.tail.rt + d.rk) : 0;
  const network = (hz: number, drive: 'grid' | 1 | 2) => {
    const w = 2 * Math.PI * hz;
    const yl: Complex = [Number.isFinite(rl) ? 1 / rl : 0, w * cl];
    const ya = ra.map((r) => [1 / r + yl[0], yl[1]] as Complex);
    const g1 = 1 / rp[0];
    const g2 = 1 / rp[1];
    // Unknowns va1, va2, vk. Tube i's current plate→cathode: gm_i·(vg_i − vk) + (va_i − vk)/rp_i, vg1 = 1 (driven) or 0, vg2 = 0.
    const vg1 = drive === 'grid' ? 1 : 0;
    const a: Complex[][] = [
      [[ya[0]![0] + g1, ya[0]![1]], [0, 0], [-(gm[0] + g1), 0]],
      [[0, 0], [ya[1]![0] + g2, ya[1]![1]], [-(gm[1] + g2), 0]],
      [[-g1, 0], [-g2, 0], [yTail + gm[0] + gm[1] + g1 + g2, 0]],
    ];
    const b: Complex[] = [[-gm[0] * vg1 + (drive === 1 ? 1 : 0), 0], [drive === 2 ? 1 : 0, 0], [gm[0] * vg1, 0]];
    return solveComplex(a, b);
  };
  const mid = network(1e3, 'grid');
  if (!mid) return fail('no-convergence', 'The pair\'s small-signal network could not be solved', 'tail');
  const gain1 = mid[0]![0];
  const gain2 = mid[1]![0];
  const z1 = network(1e3, 1);
  const z2 = network(1e3, 2);
  // The injected 1 A sees the output's impedance in parallel with its own load: take the load back out.
  const unload = (z: number) => (Number.isFinite(rl) ? 1 / (1 / z - 1 / rl) : z);
  const zout = [unload(Math.hypot(z1![0]![0], z1![0]![1])), unload(Math.hypot(z2![1]![0], z2![1]![1]))] as const;
  const balanceAt = BALANCE_HZ.map((hz) => {
    const o = network(hz, 'grid')!;
    return balancePoint(hz, o[0]!, o[1]!);
  });
  const raL = ra.map((r) => parallel(r, rl)) as [number, number];
  const tailAc = d.tail.kind === 'resistor' ? d.tail.rt + d.rk : Infinity;
  const swing = cleanSwing(p, ops, raL, tailAc, vg);
  return {
    ok: true,
    ops,
    mu: [ss[0]!.mu, ss[1]!.mu],
    rp,
    gm,
    gain1,
    gain2,
    gainCathode: mid[2]![0],
    balance: Math.abs(gain2 / gain1),
    zout,
    balanceAt,
    tailCurrent: sum,
    cathodeVolts: vk,
    tailVolts: vk - sum * d.rk,
    swing,
    findings: [0, 1].map((i) => ratingsFindings({ tube: d.tube, bplus: d.bplus, ...ops[i]!, heaterVolts, rg: null, fixedBias: false })) as [Finding[], Finding[]],
  };
}

/**
 * The clean swing with grid 1 at vg + v and grid 2 held: at each trial v the
 * cathode voltage is the root where the tubes' currents meet the tail's
 * (a resistor: the idle sum plus the cathode's rise over its signal
 * resistance; a current source: the idle sum), each plate moving along its
 * loaded resistor. A sine of peak A is clean while, at +A and −A, neither
 * grid reaches its cathode and neither current falls below 1 µA; A is found
 * by bisection.
 */
function cleanSwing(p: Parameters<typeof korenPlateCurrent>[0], ops: readonly [OperatingPoint, OperatingPoint], raL: readonly [number, number], tailAc: number, vg: number): LongTailedPairResult['swing'] {
  const sum0 = ops[0].ia + ops[1].ia;
  const vk0 = ops[0].vk;
  const at = (v: number) => {
    const grids = [vg + v, vg] as const;
    const currents = (vk: number) => [0, 1].map((i) => tubeCurrent(p, ops[i]!.va, ops[i]!.ia, raL[i]!, vk, grids[i]! - vk));
    const want = (vk: number) => (Number.isFinite(tailAc) ? sum0 + (vk - vk0) / tailAc : sum0);
    const f = (vk: number) => {
      const c = currents(vk);
      return c[0]! + c[1]! - want(vk);
    };
    const span = Math.abs(v) + ops[0].va;
    const vk = bracketedRoot(f, vk0 - span, vk0 + span, 1e-9 * span).x;
    const c = currents(vk);
    return { vk, ia: c, vgk: [grids[0] - vk, grids[1] - vk], va: [0, 1].map((i) => ops[i]!.va - (c[i]! - ops[i]!.ia) * raL[i]!) };
  };
  const clean = (a: number) => {
    for (const s of [a, -a]) {
      const x = at(s);
      for (const i of [0, 1]) if (x.vgk[i]! >= 0 || x.ia[i]! <= CUTOFF_CURRENT_A) return { ok: false as const, by: x.vgk[i]! >= 0 ? ('grid-current' as const) : ('cutoff' as const), tube: (i + 1) as 1 | 2 };
    }
    return { ok: true as const };
  };
  let lo = 0;
  let hi = Math.max(4 * -ops[0].vgk, 1);
  while (clean(hi).ok && hi < 1e4) hi *= 2;
  for (let k = 0; k < 50 && hi - lo > 1e-6 * hi; k++) {
    const mid = 0.5 * (lo + hi);
    if (clean(mid).ok) lo = mid;
    else hi = mid;
  }
  const end = clean(hi);
  const plus = at(lo);
  const minus = at(-lo);
  const peaks = [0, 1].map((i) => Math.min(Math.abs(plus.va[i]! - ops[i]!.va), Math.abs(minus.va[i]! - ops[i]!.va))) as [number, number];
  return { inputPeak: lo, peaks, limitedBy: end.ok ? 'cutoff' : end.by, tube: end.ok ? 1 : end.tube };
}

/**
 * The pair's two triodes' findings as one envelope's list: a finding both
 * say alike once, one they say differently (each plate's dissipation, say)
 * named by its triode, so the list never shows two figures for one check
 * without saying whose.
 */
export function bothTriodesFindings([first, second]: readonly [readonly Finding[], readonly Finding[]]): Finding[] {
  const said = (f: Finding, by: readonly Finding[]) => by.some((g) => g.message === f.message);
  return [...first.map((f) => (said(f, second) ? f : byTriode(f, 'First'))), ...second.filter((f) => !said(f, first)).map((f) => byTriode(f, 'Second'))];
}

/** A finding named by the triode of a pair it belongs to ("Second triode: plate dissipation …"). */
export function byTriode(f: Finding, which: 'First' | 'Second'): Finding {
  return { ...f, message: `${which} triode: ${f.message.charAt(0).toLowerCase()}${f.message.slice(1)}` };
}
