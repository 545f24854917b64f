import { fail, type Failure } from '../result';
import { checkNumber } from '../stage/checkInput';
import { CONNECTIONS, connectionsOf, type Connection, type OutputTube } from './outputTube';
import { windingProblem, type WindingInductance } from './windingInductance';

/**
 * A transformer-coupled single-ended output stage. SI units. The primary
 * runs from B+ to the plate; the transformer is ideal at midband apart from
 * the primary's DC resistance, and reflects the speaker as zPrimary; its
 * inductances, when given, shape the amplifier's band. The cathode
 * resistor, when used, is taken as fully bypassed for signal.
 */
export interface OutputDesign extends WindingInductance {
  readonly tubeId: string;
  readonly connection: Connection;
  /** Supply at the primary's B+ end, to ground, V. */
  readonly bplus: number;
  /** Screen supply to ground, V (pentode connection). */
  readonly screenVolts: number;
  /**
   * The screens (pentode connection) are fed straight from a supply node of
   * their own at screenVolts, as a supply that names their node says: no
   * dropper from B+. Absent or false: from B+, through a dropper when lower.
   */
  readonly screenFromNode?: boolean;
  /** Ultralinear screen tap, fraction of the primary's turns from its B+ end. */
  readonly ulTap: number;
  /** Reflected load, plate to B+, Ω. */
  readonly zPrimary: number;
  /** Primary DC resistance, Ω. */
  readonly rPrimary: number;
  readonly bias: 'cathode' | 'fixed';
  /** Cathode resistor, Ω (cathode bias). */
  readonly rk: number;
  /** Grid-to-ground bias voltage, V, ≤ 0 (fixed bias). */
  readonly vg: number;
  /** Grid resistor (grid leak) to ground or to the bias supply, Ω. */
  readonly rg: number;
  /** Speaker impedance on the secondary, Ω. */
  readonly speakerOhms: number;
  /** Distortion ceiling for "power at a distortion limit", a fraction. */
  readonly thdLimit: number;
  /** DC potential of the heaters to ground, V (a winding held above ground); default 0. Only the heater–cathode check reads it. */
  readonly heaterVolts?: number;
}

export const OUTPUT_LIMITS = {
  minBplus: 20,
  maxBplus: 2000,
  minZ: 100,
  maxZ: 100_000,
  maxRPrimary: 10_000,
  minTap: 0.05,
  maxTap: 0.95,
  minThd: 0.001,
  maxThd: 0.5,
  minScreen: 10,
  minRk: 1,
  maxRk: 100_000,
  minVg: -500,
  minRg: 1000,
  maxRg: 10e6,
  minSpeaker: 1,
  maxSpeaker: 100,
} as const;

/** The first field that cannot be used, worded for showing next to it; null when the design is usable. */
export function outputDesignProblem(d: OutputDesign, tube: OutputTube): Failure | null {
  if (!CONNECTIONS.includes(d.connection)) return fail('invalid-input', 'Choose pentode, triode or ultralinear connection', 'connection');
  if (!connectionsOf(tube).includes(d.connection)) return fail('invalid-input', `The ${tube.id} is a triode: it has no screen to connect`, 'connection');
  if (d.bias !== 'cathode' && d.bias !== 'fixed') return fail('invalid-input', 'Choose cathode or fixed bias', 'bias');
  const L = OUTPUT_LIMITS;
  return (
    checkNumber('bplus', 'B+', d.bplus, 'V', L.minBplus, L.maxBplus) ??
    checkNumber('screenVolts', 'Screen supply', d.screenVolts, 'V', L.minScreen, L.maxBplus) ??
    (d.connection === 'ultralinear' ? checkNumber('ulTap', 'Screen tap', d.ulTap, '', L.minTap, L.maxTap) : null) ??
    checkNumber('zPrimary', 'Primary impedance', d.zPrimary, 'Ω', L.minZ, L.maxZ) ??
    checkNumber('rPrimary', 'Primary DC resistance', d.rPrimary, 'Ω', 0, L.maxRPrimary) ??
    (d.bias === 'cathode' ? checkNumber('rk', 'Rk', d.rk, 'Ω', L.minRk, L.maxRk) : checkNumber('vg', 'Grid bias', d.vg, 'V', L.minVg, 0)) ??
    checkNumber('rg', 'Grid resistor', d.rg, 'Ω', L.minRg, L.maxRg) ??
    checkNumber('speakerOhms', 'Speaker', d.speakerOhms, 'Ω', L.minSpeaker, L.maxSpeaker) ??
    checkNumber('thdLimit', 'Distortion limit', d.thdLimit, '', L.minThd, L.maxThd) ??
    (d.heaterVolts === undefined ? null : checkNumber('heaterVolts', 'Heater potential', d.heaterVolts, 'V', -L.maxBplus, L.maxBplus)) ??
    windingProblem(d)
  );
}

/** The connection the tube can use: a power triode is always 'triode'. */
export function effectiveConnection(d: OutputDesign, tube: OutputTube): Connection {
  return tube.law.kind === 'triode' ? 'triode' : d.connection;
}
