import { fail, type Result } from '../result';
import type { Rectifier } from './supplyTypes';

/** What the mains transformer's secondaries deliver, and the mains they run from. SI units. */
export interface MainsDemand {
  /** Nominal mains voltage, V rms. */
  readonly mainsVolts: number;
  /** The B+ winding's volt-amperes at idle and, where the amplifier draws more at full power, there (null: as at idle), VA. */
  readonly bplusVa: number;
  readonly bplusVaFull?: number | null;
  /** Every heater winding's (and a DC heater supply's, at its output), VA. */
  readonly heaterVa: number;
  /** A bias winding's, VA (null or absent: none). */
  readonly biasVa?: number | null;
  /** The rms current where the B+ winding's fuse sits (the centre tap, or the winding itself), at the larger of idle and full power, A (absent: no B+ fuse asked). */
  readonly htAmps?: number | null;
}

export interface MainsAnswer {
  /** Every secondary together, at the larger of idle and full power, VA: the transformer's rating must exceed it. */
  readonly va: number;
  /** The primary's rms current there, A (the secondaries' VA over the efficiency, at the mains voltage). */
  readonly primaryAmps: number;
  /** A time-lag primary fuse: the first IEC 60127-2 rating at or past FUSE_FACTOR times that current, A; null past 10 A. */
  readonly fuseAmps: number | null;
  /** A time-lag fuse for the B+ winding at FUSE_FACTOR times `htAmps`, A; null when not asked or past 10 A. */
  readonly htFuseAmps: number | null;
  readonly efficiency: number;
}

/** A small mains transformer's efficiency at full load (tens to hundreds of VA: 80 to 90 %, from memory; the lower end taken). */
export const TRANSFORMER_EFFICIENCY = 0.85;
/** A time-lag fuse at about twice the primary's full-load current rides out the switch-on surge of the transformer and the reservoir (common practice). */
export const FUSE_FACTOR = 2;
/** Rated currents of miniature fuses, the R10 series of IEC 60127-2, 50 mA to 10 A. */
export const FUSE_AMPS: readonly number[] = [0.05, 0.063, 0.08, 0.1, 0.125, 0.16, 0.2, 0.25, 0.315, 0.4, 0.5, 0.63, 0.8, 1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5, 6.3, 8, 10];

/**
 * The mains transformer's load and the primary's fuse: every secondary's
 * volt-amperes added (their currents are not in phase, so this bounds the
 * rating from above), the primary's current through the transformer's
 * efficiency, and a time-lag fuse at FUSE_FACTOR times it; and where asked
 * the B+ winding's own fuse the same way (common practice: it opens on a
 * shorted filter capacitor or a rectifier that arcs over before the
 * primary's does).
 */
export function mainsFuse(d: MainsDemand): Result<MainsAnswer> {
  if (typeof d !== 'object' || d === null) return fail('invalid-input', 'Give the mains voltage and what each winding delivers');
  const va = (x: unknown) => typeof x === 'number' && Number.isFinite(x) && x >= 0 && x <= 1e5;
  if (!(typeof d.mainsVolts === 'number' && d.mainsVolts >= 50 && d.mainsVolts <= 300)) return fail('invalid-input', 'The mains voltage must be from 50 V to 300 V', 'mainsVolts');
  if (!va(d.bplusVa)) return fail('invalid-input', 'The B+ winding\'s VA must be a number from 0 to 100 kVA', 'bplusVa');
  if (d.bplusVaFull !== undefined && d.bplusVaFull !== null && !va(d.bplusVaFull)) return fail('invalid-input', 'The B+ winding\'s VA at full power must be a number from 0 to 100 kVA, or none', 'bplusVaFull');
  if (!va(d.heaterVa)) return fail('invalid-input', 'The heaters\' VA must be a number from 0 to 100 kVA', 'heaterVa');
  if (d.biasVa !== undefined && d.biasVa !== null && !va(d.biasVa)) return fail('invalid-input', 'The bias winding\'s VA must be a number from 0 to 100 kVA, or none', 'biasVa');
  const ht = d.htAmps ?? null;
  if (ht !== null && !(typeof ht === 'number' && Number.isFinite(ht) && ht >= 0 && ht <= 100)) return fail('invalid-input', 'The B+ winding\'s fused current must be a number from 0 to 100 A, or none', 'htAmps');
  const total = Math.max(d.bplusVa, d.bplusVaFull ?? 0) + d.heaterVa + (d.biasVa ?? 0);
  const primaryAmps = total / TRANSFORMER_EFFICIENCY / d.mainsVolts;
  const fuseFor = (amps: number) => FUSE_AMPS.find((a) => a >= FUSE_FACTOR * amps * (1 - 1e-9)) ?? null;
  return { ok: true, va: total, primaryAmps, fuseAmps: fuseFor(primaryAmps), htFuseAmps: ht === null ? null : fuseFor(ht), efficiency: TRANSFORMER_EFFICIENCY };
}

/**
 * The B+ winding's VA at full power, from its VA at idle scaled by the DC
 * the supply delivers there over what it delivers at idle; null when it
 * delivers no more (a class A stage). An overestimate: behind a reservoir
 * capacitor the pulses widen as the load grows, so their rms current grows
 * more slowly than the DC (the textbook behaviour of a capacitor-input
 * rectifier), which suits a transformer's rating and a fuse.
 */
export function fullPowerVa(idleVa: number, loads: readonly number[], fullLoads: readonly number[] | null): number | null {
  const amps = (x: unknown): x is readonly number[] => Array.isArray(x) && x.every((a) => typeof a === 'number' && Number.isFinite(a) && a >= 0);
  if (!(typeof idleVa === 'number' && Number.isFinite(idleVa) && idleVa >= 0) || !amps(loads) || fullLoads === null || !amps(fullLoads)) return null;
  const idle = loads.reduce((a, b) => a + b, 0);
  const full = fullLoads.reduce((a, b) => a + b, 0);
  const va = idleVa * (full / idle);
  return idle > 0 && full > idle && Number.isFinite(va) ? va : null;
}

/**
 * Where the B+ winding's fuse goes and the rms current it carries: in a
 * centre-tapped winding's centre tap, which carries both halves' pulses
 * (the rectifier's whole current); in series with a bridge's or a
 * half-wave rectifier's winding, which carries the winding's own current.
 * Null for a rectifier it does not know or currents that are not finite.
 */
export function htFuseCurrent(rectifier: Rectifier['kind'], rectifierRms: number, secondaryRms: number): { readonly where: 'centre tap' | 'winding'; readonly amps: number } | null {
  const amps = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x) && x >= 0;
  if (rectifier === 'silicon-full-wave' || rectifier === 'tube') return amps(rectifierRms) ? { where: 'centre tap', amps: rectifierRms } : null;
  if (rectifier === 'silicon-bridge' || rectifier === 'silicon-half-wave') return amps(secondaryRms) ? { where: 'winding', amps: secondaryRms } : null;
  return null;
}

/** The B+ winding's share of the mains transformer's load, from a solved supply: its VA at idle and full power, and its fuse's place and current. */
export interface BplusWindingLoad {
  readonly va: number;
  /** At full power, where the amplifier draws more there (fullPowerVa); null otherwise, VA. */
  readonly vaFull: number | null;
  readonly fuseAt: 'centre tap' | 'winding';
  /** The fuse's current at the larger of idle and full power (scaled as the VA is), A. */
  readonly fuseAmps: number;
}

/**
 * The B+ winding's load for mainsFuse: the solved supply's VA and its
 * scaling to full power, and the current through the winding's fuse
 * (htFuseCurrent) scaled the same way. Null where the solution does not
 * give finite figures.
 */
export function bplusWindingLoad(rectifier: Rectifier['kind'], solved: { readonly secondaryVa: number; readonly rectifierRms: number; readonly secondaryRmsCurrent: number }, loads: readonly number[], fullLoads: readonly number[] | null): BplusWindingLoad | null {
  if (typeof solved !== 'object' || solved === null) return null;
  const va = solved.secondaryVa;
  if (!(typeof va === 'number' && Number.isFinite(va) && va >= 0)) return null;
  const ht = htFuseCurrent(rectifier, solved.rectifierRms, solved.secondaryRmsCurrent);
  if (!ht) return null;
  const vaFull = fullPowerVa(va, loads, fullLoads);
  const fuseAmps = ht.amps * (vaFull !== null && va > 0 ? vaFull / va : 1);
  return Number.isFinite(fuseAmps) ? { va, vaFull, fuseAt: ht.where, fuseAmps } : null;
}
