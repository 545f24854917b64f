import type { Failure } from '../result';
import { checkNumber, LIMITS } from '../stage/checkInput';
import type { Complex } from './complexSolve';

/** What every phase splitter's outputs drive, and where its heaters sit. */
export interface SplitterLoads {
  /** Each output's load resistance (the next grid's resistor), Ω; Infinity for none. */
  readonly rl?: number;
  /** Each output's load capacitance (the next tube's input capacitance with its Miller effect), F; 0 for none. */
  readonly cl?: number;
  /** Heater potential to ground, V. */
  readonly heaterVolts?: number;
}

export function checkSplitterLoads(d: SplitterLoads): Failure | null {
  return (
    (d.rl === undefined ? null : checkNumber('rl', 'RL', d.rl, 'Ω', 1, LIMITS.maxOhms, { allowInfinity: true })) ??
    (d.cl === undefined ? null : checkNumber('cl', 'Load capacitance', d.cl, 'F', 0, 1e-6)) ??
    (d.heaterVolts === undefined ? null : checkNumber('heaterVolts', 'Heater potential', d.heaterVolts, 'V', -LIMITS.maxVolts, LIMITS.maxVolts))
  );
}

/** Where the balance is read: the audio band's top and past it, where the load capacitance tells. */
export const BALANCE_HZ = [1e3, 10e3, 20e3, 50e3, 100e3] as const;

export interface BalancePoint {
  readonly hz: number;
  /** The in-phase output's magnitude over the inverted one's. */
  readonly ratio: number;
  /** How far the two are from exactly opposite, degrees. */
  readonly phaseErrorDeg: number;
}

/** The balance of two outputs at one frequency: `inverted` and `inPhase` as complex voltages. */
export function balancePoint(hz: number, inverted: Complex, inPhase: Complex): BalancePoint {
  const ratio = Math.hypot(inPhase[0], inPhase[1]) / Math.hypot(inverted[0], inverted[1]);
  const phase = ((Math.atan2(inPhase[1], inPhase[0]) - Math.atan2(inverted[1], inverted[0])) * 180) / Math.PI;
  return { hz, ratio, phaseErrorDeg: (((phase % 360) + 360) % 360) - 180 };
}
