import { fail, type Result } from '../result';
import type { NeededBleeder } from '../supply/bleeder';
import type { SupplyDesign, SupplySolution } from '../supply/supplyTypes';
import { resistorLine, type CapacitorLine, type ResistorLine } from './partsList';
import { CAPACITOR_VOLTS, roundUpTo } from './ratings';

/** Mains may run 10 % above nominal (IEC 60038 gives 230 V ±10 %); every supply part is rated for it. */
export const MAINS_HIGH = 1.1;

/**
 * Above this, electrolytics are scarce: two in series, each with a
 * balancing resistor across it, is the usual answer (common practice).
 */
export const ELECTROLYTIC_MAX_VOLTS = 500;

/** Reverse voltage ratings of the 1N4001 to 1N4007 series (their data sheet), V: the usual silicon rectifier diodes. */
export const DIODE_VOLTS: readonly number[] = [50, 100, 200, 400, 600, 800, 1000];

/** A filter capacitor: what a stage's capacitor line says, plus the ripple current it carries. */
export interface FilterCapacitorLine extends CapacitorLine {
  /** Ripple current through it (rms), A: the capacitor's ripple-current rating must exceed it. */
  readonly rippleAmps: number;
  /** Set when its rating is past the usual electrolytic ranges. */
  readonly note: string | null;
}

export interface ChokeLine {
  readonly ref: string;
  readonly role: string;
  readonly henries: number;
  readonly rdc: number;
  /** The DC it carries, idle or at full power, whichever is more, A: its current rating must exceed it. */
  readonly amps: number;
}

export interface RectifierLine {
  readonly kind: SupplyDesign['rectifier']['kind'];
  /** Peak inverse voltage each diode (or the tube) stands cold, and with the mains 10 % high, V. */
  readonly piv: number;
  readonly pivHighMains: number;
  /** For silicon: the first 1N400x reverse rating above the high-mains figure, or null past 1000 V (two in series). */
  readonly diodeVolts: number | null;
  readonly peakAmps: number;
  readonly rmsAmps: number;
}

export interface SupplyParts {
  /** Filter resistors, then the bleeder. */
  readonly resistors: readonly ResistorLine[];
  readonly capacitors: readonly FilterCapacitorLine[];
  readonly chokes: readonly ChokeLine[];
  readonly rectifier: RectifierLine;
}

/** What a solved supply gives for its parts: the solution, each node's load, and the loads at full power where known. */
export interface SolvedSupply {
  readonly supply: SupplySolution;
  readonly loads: readonly number[];
  readonly atFullPower: { readonly loads: readonly number[] } | null;
}

/**
 * The supply's parts to order. Each filter capacitor is rated for the
 * no-load voltage (the tubes cold: nothing draws current and every
 * capacitor charges to the secondary's peak) with the mains 10 % high,
 * rounded up to a standard rating; each filter resistor and choke carries
 * the current of every node after it (Kirchhoff's current law), idle or at
 * full power, whichever is more, the resistor rated as every other on the
 * build sheet (twice its worst case, common practice). A centre-tapped
 * full-wave rectifier's diodes (or tube) stand twice the peak of each half
 * in reverse, a bridge's once (the textbook relations of the two circuits).
 */
export function supplyPartsList(d: SupplyDesign, solved: SolvedSupply, bleeder: NeededBleeder | null = null): Result<SupplyParts> {
  const problem = shapeProblem(d, solved, bleeder);
  if (problem) return fail('invalid-input', problem);
  const nodes = 1 + d.sections.length;
  const s = solved.supply;
  const full = solved.atFullPower && Array.isArray(solved.atFullPower.loads) && solved.atFullPower.loads.length === nodes && solved.atFullPower.loads.every(finiteAtLeast(0)) ? solved.atFullPower.loads : null;
  const loadAt = (k: number) => Math.max(solved.loads[k]!, full ? full[k]! : 0);
  const downstream = (k: number) => Array.from({ length: nodes - k }, (_, j) => loadAt(k + j)).reduce((a, b) => a + b, 0);
  const cold = s.noLoadVolts;
  const need = cold * MAINS_HIGH;
  const rating = coldRating(cold);
  const caps = [d.input.c, ...d.sections.map((x) => x.c)];
  const capacitors = caps.map((c, k): FilterCapacitorLine => ({
    ref: `Cf${k + 1}`,
    role: k === 0 ? (d.input.kind === 'choke' ? 'node 1, after the choke' : 'reservoir') : `node ${k + 1}`,
    value: c,
    volts: s.nodes[k]!.dc,
    voltsAtSwitchOn: cold,
    ratingVolts: rating,
    polarity: '+ to node',
    rippleAmps: s.nodes[k]!.capacitorRippleRms,
    note: need > ELECTROLYTIC_MAX_VOLTS ? `${Math.round(need)} V is past the usual electrolytics: two in series, each with a balancing resistor across it (common practice)` : null,
  }));
  const resistors: ResistorLine[] = [];
  const chokes: ChokeLine[] = [];
  if (d.input.kind === 'choke') chokes.push({ ref: 'Lf1', role: 'input choke, rectifier to node 1', henries: d.input.l, rdc: d.input.rdc, amps: downstream(0) });
  d.sections.forEach((x, i) => {
    const into = i + 2;
    const role = `filter, node ${into - 1} to node ${into}`;
    if (x.kind === 'rc') resistors.push(resistorLine(`Rf${into}`, role, x.r, downstream(into - 1), 'E24'));
    else chokes.push({ ref: `Lf${into}`, role, henries: x.l, rdc: x.rdc, amps: downstream(into - 1) });
  });
  if (bleeder) {
    // Across node 1: it runs at the reservoir's voltage and, the tubes cold, at the no-load peak.
    const running = (s.nodes[0]!.dc ** 2) / bleeder.ohms;
    resistors.push({ ref: 'Rbleed', role: 'bleeder across node 1', value: bleeder.ohms, preferred: bleeder.ohms, series: 'E12', watts: running, wattsWorst: bleeder.watts, ratingWatts: bleeder.partWatts });
  }
  const piv = d.rectifier.kind === 'silicon-bridge' ? cold : 2 * cold;
  return { ok: true, resistors, capacitors, chokes, rectifier: rectifierLine(d.rectifier.kind, piv, s.rectifierPeak, s.rectifierRms) };
}

/** A filter capacitor's voltage rating: the cold (no-load) voltage with the mains 10 % high, rounded up to a standard rating. */
export const coldRating = (cold: number): number => roundUpTo(CAPACITOR_VOLTS, cold * MAINS_HIGH);

/** The rectifier's line: its reverse voltage cold and with the mains 10 % high, and for silicon the 1N400x rating that stands it. */
export function rectifierLine(kind: RectifierLine['kind'], piv: number, peakAmps: number, rmsAmps: number): RectifierLine {
  const pivHighMains = piv * MAINS_HIGH;
  const diodeVolts = kind === 'tube' ? null : (DIODE_VOLTS.find((v) => v >= pivHighMains) ?? null);
  return { kind, piv, pivHighMains, diodeVolts, peakAmps, rmsAmps };
}

/** Below this a bleeder is a slip, not a part (its power across the reservoir would overflow), Ω. */
const MIN_BLEEDER_OHMS = 1;

const finiteAtLeast = (min: number) => (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x) && x >= min;

/** Why a design and its solution cannot be listed, or null: every part a finite, positive value and one voltage and load per node. */
function shapeProblem(d: SupplyDesign, solved: SolvedSupply, bleeder: NeededBleeder | null): string | null {
  if (typeof d !== 'object' || d === null || !Array.isArray(d.sections) || typeof d.input !== 'object' || d.input === null || typeof d.rectifier !== 'object' || d.rectifier === null) return 'Give the supply\'s design: its rectifier, its input and its filter sections';
  const positive = finiteAtLeast(Number.MIN_VALUE);
  const section = (x: unknown) => typeof x === 'object' && x !== null && positive((x as { c?: unknown }).c) && ((x as FilterSectionLike).kind === 'rc' ? positive((x as FilterSectionLike).r) : (x as FilterSectionLike).kind === 'lc' && positive((x as FilterSectionLike).l) && finiteAtLeast(0)((x as FilterSectionLike).rdc));
  if (!positive(d.input.c) || (d.input.kind === 'choke' && !(positive(d.input.l) && finiteAtLeast(0)(d.input.rdc)))) return 'The supply\'s first capacitor (and its choke, if any) must have positive values';
  const bad = d.sections.findIndex((x) => !section(x));
  if (bad >= 0) return `Filter section ${bad + 1} must have a positive resistance (or inductance) and capacitance`;
  const nodes = 1 + d.sections.length;
  const s = typeof solved === 'object' && solved !== null ? solved.supply : null;
  if (!s || !Array.isArray(s.nodes) || s.nodes.length !== nodes || !Array.isArray(solved.loads) || solved.loads.length !== nodes) return `The supply's solution must give one voltage and one load per node (${nodes})`;
  if (!s.nodes.every((n) => typeof n === 'object' && n !== null && finiteAtLeast(0)(n.dc) && finiteAtLeast(0)(n.capacitorRippleRms)) || !solved.loads.every(finiteAtLeast(0))) return 'Every node\'s voltage, ripple current and load must be finite and not negative';
  if (!positive(s.noLoadVolts) || !finiteAtLeast(0)(s.rectifierPeak) || !finiteAtLeast(0)(s.rectifierRms)) return 'The solution must give the no-load voltage and the rectifier\'s currents';
  if (bleeder !== null && (typeof bleeder !== 'object' || !finiteAtLeast(MIN_BLEEDER_OHMS)(bleeder.ohms) || !finiteAtLeast(0)(bleeder.watts) || !finiteAtLeast(0)(bleeder.partWatts))) return `The bleeder must give its resistance (at least ${MIN_BLEEDER_OHMS} Ω) and power`;
  return null;
}

type FilterSectionLike = { readonly kind?: unknown; readonly r?: unknown; readonly l?: unknown; readonly rdc?: unknown };
