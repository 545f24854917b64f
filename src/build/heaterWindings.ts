import { fail, type Result } from '../result';

/** Heaters of one kind in the amplifier: `count` alike, each drawing `amps` at `volts`. */
export interface HeaterLoad {
  readonly label: string;
  readonly volts: number;
  readonly amps: number;
  readonly count: number;
  /** A directly heated rectifier: its filament is its cathode and sits at B+. */
  readonly atBplus?: boolean;
}

/** One heater winding the transformer needs, and what it feeds. */
export interface HeaterWinding {
  readonly volts: number;
  readonly amps: number;
  /** Volt-amperes the winding delivers (heaters are resistive: V × A). */
  readonly va: number;
  readonly feeds: readonly string[];
  /** The winding is at B+ (a directly heated rectifier's filament) and must be insulated for it. */
  readonly atBplus: boolean;
}

/**
 * The heater windings a whole amplifier needs: heaters of one voltage in
 * parallel on one winding, their currents added; a directly heated
 * rectifier's filament, which is its cathode and so sits at B+, on a winding
 * of its own (common practice: a 5 V winding insulated for B+).
 */
export function heaterWindings(loads: readonly HeaterLoad[]): Result<{ windings: readonly HeaterWinding[] }> {
  if (!Array.isArray(loads) || loads.length === 0) return fail('invalid-input', 'No heaters to supply');
  const ok = (v: unknown, min: number, max: number) => typeof v === 'number' && Number.isFinite(v) && v >= min && v <= max;
  const bad = loads.findIndex((l) => typeof l !== 'object' || l === null || !ok(l.volts, 0.5, 1000) || !ok(l.amps, 0, 100) || !Number.isInteger(l.count) || l.count < 1 || l.count > 64);
  if (bad >= 0) return fail('invalid-input', `Heater ${bad + 1} must give volts (0.5 to 1000 V), amps (0 to 100 A) and a count (1 to 64)`);
  const windings: { volts: number; amps: number; feeds: string[]; atBplus: boolean }[] = [];
  for (const l of loads) {
    const atBplus = l.atBplus === true;
    const shared = atBplus ? undefined : windings.find((w) => !w.atBplus && Math.abs(w.volts - l.volts) < 1e-9);
    const label = l.count > 1 ? `${l.count} × ${l.label}` : l.label;
    if (shared) {
      shared.amps += l.amps * l.count;
      shared.feeds.push(label);
    } else windings.push({ volts: l.volts, amps: l.amps * l.count, feeds: [label], atBplus });
  }
  return { ok: true, windings: windings.map((w) => ({ ...w, va: w.volts * w.amps })) };
}
