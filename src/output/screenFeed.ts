import { emptyCurrents, stageCurrentsInto } from './electrodes';
import { formatValue } from '../parts/formatValue';
import { finding, type Finding } from '../stage/ratingBands';
import type { OutputTube } from './outputTube';

/** Within this many volts of B+ a screen is taken as fed straight from it (our threshold: a volt is well inside any supply's spread). */
export const SCREEN_FROM_BPLUS_VOLTS = 1;

/**
 * Where a pentode-connected screen gets its voltage: straight from the
 * plate's B+, through a dropping resistor from it, or, above B+, from a
 * supply node of its own.
 */
export type ScreenFeedPlan =
  | { readonly kind: 'from-bplus' }
  /** The resistor from B+ that drops to the screen voltage at the screens' idle current (Ohm's law), Ω, and that current, A. */
  | { readonly kind: 'dropper'; readonly ohms: number; readonly amps: number }
  | { readonly kind: 'own-node' };

/**
 * The screen's feed for a screen voltage asked against the plate's B+ (both
 * to ground), drawing `amps` at idle (every screen on it): a dropping
 * resistor R = (B+ − Vg2)/Ig2 (Ohm's law) where the screen sits lower; its
 * voltage sags as the screen current rises under drive, which a bypass holds
 * only over a cycle (common practice). A screen at B+ needs nothing; one
 * above it (or drawing no current to drop) needs a node of its own, and
 * screens the supply feeds from a node of their own (`fromNode`) have one.
 */
export function screenFeedPlan(bplus: number, screenVolts: number, amps: number, fromNode = false): ScreenFeedPlan {
  if (fromNode === true) return { kind: 'own-node' };
  if (!(Number.isFinite(bplus) && Number.isFinite(screenVolts))) return { kind: 'from-bplus' };
  if (screenVolts > bplus + SCREEN_FROM_BPLUS_VOLTS) return { kind: 'own-node' };
  const drop = bplus - screenVolts;
  if (drop <= SCREEN_FROM_BPLUS_VOLTS) return { kind: 'from-bplus' };
  // A screen drawing nothing drops nothing through a resistor: its voltage has to come from a node (or a divider) of its own.
  const ohms = drop / amps;
  if (!(amps > 0) || !Number.isFinite(ohms)) return { kind: 'own-node' };
  return { kind: 'dropper', ohms, amps };
}

/** dIg2/dVg2 of a screen held at `feed`'s fixed voltage, the plate and grid at their idle, S (what a screen bypass sees besides its resistor). */
export function screenConductance(tube: OutputTube, vg2k: number, vpk: number, vgk: number): number {
  const c = emptyCurrents();
  const h = 0.01;
  const at = (v: number) => {
    stageCurrentsInto(tube, { kind: 'fixed', vg2k: v }, vpk, vgk, c, 0);
    return c.ig2;
  };
  const g = (at(vg2k + h) - at(vg2k - h)) / (2 * h);
  return Number.isFinite(g) && g > 0 ? g : 0;
}

/** A note where the screens need a node above B+ and the supply names none for them (`fromNode` false): the figures hold them there. */
export function screenSupplyFinding(bplus: number, screenVolts: number, fromNode = false): Finding | null {
  if (fromNode === true || screenFeedPlan(bplus, screenVolts, 1).kind !== 'own-node') return null;
  return finding('screen-supply', 'note', `The screens at ${screenVolts.toFixed(0)} V sit above B+ (${bplus.toFixed(0)} V): feed them from a supply node of their own at that voltage (the figures take it as held there; the supply here feeds the plates).`, screenVolts, bplus);
}

/** A dropper's sag at full drive past this share of the screen voltage is warned (our own threshold: about where the power figures, which hold the screen, stop being the amplifier's). */
export const SCREEN_SAG_SHARE = 0.05;

/**
 * Where a dropper would let the screens sag at full drive: their average
 * current there through the dropper drops more than at idle (Ohm's law),
 * while the figures hold the screen at the voltage asked. Past
 * SCREEN_SAG_SHARE of it, a warning with the cure.
 */
export function screenSagFinding(plan: ScreenFeedPlan, screenVolts: number, fullAmps: number): Finding | null {
  if (plan.kind !== 'dropper' || !(fullAmps > plan.amps) || !Number.isFinite(fullAmps)) return null;
  const sag = plan.ohms * (fullAmps - plan.amps);
  if (!(sag > SCREEN_SAG_SHARE * screenVolts)) return null;
  return finding(
    'screen-supply',
    'warning',
    `At full drive the screens draw ${(fullAmps * 1e3).toFixed(1)} mA on average (${(plan.amps * 1e3).toFixed(1)} mA at idle): through a ${formatValue(plan.ohms, 'Ω')} dropper from B+ they would sag about ${sag.toFixed(0)} V below ${screenVolts.toFixed(0)} V, where the power figures hold them. Feed the screens from a stiffer supply: a node of their own at that voltage, or a smaller dropper from a lower node (common practice).`,
    sag,
    SCREEN_SAG_SHARE * screenVolts,
  );
}
