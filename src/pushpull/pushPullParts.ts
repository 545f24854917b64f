import { capacitorForCorner, capacitorLine, resistorLine, type CapacitorLine, type ResistorLine } from '../build/partsList';
import type { PreferredSeries } from '../parts/preferredValues';
import type { Result } from '../result';
import { biasAdjustment, type BiasAdjustment } from '../output/biasAdjustment';
import { pairBiasTubes } from '../output/fixedBiasSupply';
import { gridStopperFor, type GridStopper } from '../output/gridStopper';
import { slopesAt } from '../output/solveOutput';
import { emptyCurrents, stageCurrentsInto } from '../output/electrodes';
import { CATHODE_BYPASS_CORNER_HZ, screenDropperParts } from '../output/outputParts';
import { screenConductance, screenFeedPlan } from '../output/screenFeed';
import type { PushPullAnalysis } from './analyzePushPull';
import { screensAtDrive } from './pushPullDrive';

/** The pair's output transformer: centre-tapped, B+ at the tap. */
export interface PairTransformerSpec {
  /** Plate-to-plate load, Ω. */
  readonly primary: number;
  readonly secondary: number;
  /** The whole primary's DC resistance, plate to plate, Ω. */
  readonly primaryDcr: number;
  /** DC in each half at idle, A (opposite senses: the core sees only their difference). */
  readonly dcPerHalf: number;
  /** The DC the halves leave uncancelled in the core, A (0 for a matched pair). */
  readonly dcUncancelled: number;
  /** Power it must pass with the grids driven to 0 V, W. */
  readonly power: number;
  readonly screenTap: number | null;
}

export interface PushPullPartsList {
  readonly resistors: ResistorLine[];
  readonly capacitors: CapacitorLine[];
  readonly transformer: PairTransformerSpec;
  /** Fixed bias: the supply the grids return to, V, and that each side wants its own balance adjustment. */
  readonly biasSupply: number | null;
  /** Fixed bias: the range each tube's own adjustment must cover for the type's spread, and the idle to set each to; null for cathode bias. */
  readonly biasAdjustment: Result<BiasAdjustment> | null;
  /** Each grid's stopper at its socket (Rst1, Rst2 on the resistor list) and the corner it makes with that grid's Miller capacitance. */
  readonly gridStopper: GridStopper;
}

/**
 * What to order for a push-pull pair, by the voltage stage's rules (power
 * and voltage ratings twice the worst case, common practice). The shared
 * cathode resistor is rated for the pair's current with the grids driven to
 * 0 V (in class AB the cathodes draw more under drive than at idle). Its
 * bypass is sized so that its reactance at CATHODE_BYPASS_CORNER_HZ equals
 * the impedance it shunts: Rk in parallel with the two cathodes, taken with
 * their plates held at idle (the lower impedance, so the larger capacitor:
 * the safe side).
 */
export function pushPullPartsList(a: PushPullAnalysis, series: PreferredSeries): PushPullPartsList {
  const s = a.solution;
  const d = s.design;
  const resistors: ResistorLine[] = [];
  const capacitors: CapacitorLine[] = [];
  if (d.bias === 'cathode') {
    const ik = Math.max(a.supplyCurrent.idle, a.supplyCurrent.full);
    resistors.push(resistorLine('Rk', 'cathode resistor, shared by both tubes', d.rk, ik, series));
    const rk = resistors[0]!.preferred;
    const gk = cathodeConductance(a);
    const shunted = gk > 0 ? 1 / (1 / rk + gk) : rk;
    // Ordered at the next E12 value up (common practice), so the corner lands at or below the one asked.
    capacitors.push(capacitorLine('Ck', 'cathode bypass, shared', capacitorForCorner(shunted, CATHODE_BYPASS_CORNER_HZ, 'E12').preferred, s.vk, 0, '+ to cathode'));
  }
  resistors.push(resistorLine('Rg1, Rg2', d.bias === 'fixed' ? 'grid resistors to the bias supply, one per tube' : 'grid resistors, one per tube', d.rg, 0, series));
  // Each tube's plate works into a quarter of Raa while both conduct (class A): the load its Miller gain is taken into.
  const slopes = slopesAt(s.tube, s.feed, s.idle[0].vpk, s.vgk, d.rPrimary / 2);
  const gridStopper = gridStopperFor(s.tube.capacitances, slopes.gm, slopes.rp, d.raa / 4);
  resistors.push(resistorLine('Rst1, Rst2', 'grid stoppers, one at each socket', gridStopper.ohms, 0, series));
  if (s.feed.kind === 'fixed') {
    // Both screens on one dropper and one bypass (common practice), carrying both idle currents.
    const [one, two] = s.idle;
    const g = screenConductance(s.tube, s.feed.vg2k, one.vpk, s.vgk) + screenConductance(s.tube2, s.feed.vg2k, two.vpk, s.vgk2);
    const screen = screenDropperParts(screenFeedPlan(d.bplus, d.screenVolts, one.ig2 + two.ig2, d.screenFromNode), d.bplus, d.screenVolts, g, pairScreensAtFull(a), series);
    resistors.push(...screen.resistors);
    capacitors.push(...screen.capacitors);
  }
  const fixed = pairBiasTubes(a);
  return {
    resistors,
    capacitors,
    transformer: {
      primary: d.raa,
      secondary: d.speakerOhms,
      primaryDcr: d.rPrimary,
      dcPerHalf: s.idle[0].ip,
      dcUncancelled: Math.abs(s.dcImbalance),
      power: a.full.power,
      screenTap: s.feed.kind === 'tap' ? d.ulTap : null,
    },
    biasSupply: d.bias === 'fixed' ? d.vg : null,
    biasAdjustment: fixed ? biasAdjustment(fixed.tube, fixed.design, fixed.vpk, fixed.ip) : null,
    gridStopper,
  };
}

/** d(Ik1 + Ik2)/dVk with the plates and screens held at idle, S: what the cathode node sees of the tubes. */
function cathodeConductance(a: PushPullAnalysis): number {
  const s = a.solution;
  const c = emptyCurrents();
  const h = 0.01;
  const sum = (dvk: number) => {
    let total = 0;
    for (const [tube, p, g] of [[s.tube, s.idle[0], s.vgk], [s.tube2, s.idle[1], s.vgk2]] as const) {
      stageCurrentsInto(tube, s.feed, p.vpk - dvk, g - dvk, c, 0);
      total += c.ik;
    }
    return total;
  };
  const g = (sum(-h) - sum(h)) / (2 * h);
  return Number.isFinite(g) && g > 0 ? g : 0;
}

/** Both screens' current averaged over the cycle with the grids driven to 0 V, A; null unless fed a fixed voltage. */
export function pairScreensAtFull(a: PushPullAnalysis): number | null {
  return screensAtDrive(a.solution, a.full);
}
