import { capacitorForCorner, capacitorLine, resistorLine, type CapacitorLine, type ResistorLine } from '../build/partsList';
import { CAPACITOR_VOLTS, roundUpTo } from '../build/ratings';
import { MAINS_HIGH } from '../build/supplyParts';
import type { PreferredSeries } from '../parts/preferredValues';
import { followerZout } from '../stage/gainFormulas';
import type { OutputAnalysis } from './analyzeOutput';
import type { Result } from '../result';
import { biasAdjustment, type BiasAdjustment } from './biasAdjustment';
import { gridStopperFor, type GridStopper } from './gridStopper';
import { screenConductance, screenFeedPlan, type ScreenFeedPlan } from './screenFeed';

/** The bypass is sized for its corner to sit this far below the band, Hz (common practice: a decade under 20 Hz is often quoted; 10 Hz keeps the part sane). */
export const CATHODE_BYPASS_CORNER_HZ = 10;

export interface TransformerSpec {
  readonly primary: number;
  readonly secondary: number;
  readonly primaryDcr: number;
  /** DC through the primary at idle, A: a single-ended core must carry it without saturating. */
  readonly dcCurrent: number;
  /** Power the transformer must pass at the clean limit, W. */
  readonly power: number;
  /** Ultralinear screen tap, fraction of the primary's turns; null when there is none. */
  readonly screenTap: number | null;
}

export interface OutputPartsList {
  readonly resistors: ResistorLine[];
  readonly capacitors: CapacitorLine[];
  readonly transformer: TransformerSpec;
  /** Fixed bias: the range the grid's adjustment must cover for the type's spread of tubes, and the idle to set; null for cathode bias. */
  readonly biasAdjustment: Result<BiasAdjustment> | null;
  /** The grid stopper at the socket (on the resistor list as Rst) and the corner it makes with the grid's Miller capacitance. */
  readonly gridStopper: GridStopper;
}

/**
 * What to order for the output stage. Resistors and the bypass capacitor use
 * the voltage stage's rules (power and voltage ratings twice the worst case,
 * common practice). The bypass is sized so that its reactance equals the
 * impedance it shunts at CATHODE_BYPASS_CORNER_HZ (then the next E12 value up): Rk in parallel with the
 * cathode's own impedance, (rp + Zpri)/(μ + 1) (the cathode-follower formula,
 * Langford-Smith, RDH4 ch. 13).
 */
export function outputPartsList(a: OutputAnalysis, series: PreferredSeries): OutputPartsList {
  const { op, design } = a.solution;
  const resistors: ResistorLine[] = [];
  const capacitors: CapacitorLine[] = [];
  if (design.bias === 'cathode') {
    resistors.push(resistorLine('Rk', 'cathode resistor', design.rk, op.ik, series));
    const rkPreferred = resistors[0]!.preferred;
    const shunted = followerZout(op.mu, op.rp + design.zPrimary, rkPreferred);
    // Ordered at the next E12 value up (capacitors come in E12 values, common practice), so the corner lands at or below the one asked.
    const ck = capacitorForCorner(shunted, CATHODE_BYPASS_CORNER_HZ, 'E12').preferred;
    capacitors.push(capacitorLine('Ck', 'cathode bypass', ck, op.vk, 0, '+ to cathode'));
  }
  resistors.push(resistorLine('Rg', design.bias === 'fixed' ? 'grid resistor to the bias supply' : 'grid resistor', design.rg, 0, series));
  const gridStopper = gridStopperFor(a.solution.tube.capacitances, op.gm, op.rp, design.zPrimary);
  resistors.push(resistorLine('Rst', 'grid stopper, at the socket', gridStopper.ohms, 0, series));
  if (op.feed.kind === 'fixed') {
    const screen = screenDropperParts(screenFeedPlan(design.bplus, design.screenVolts, op.ig2, design.screenFromNode), design.bplus, design.screenVolts, screenConductance(a.solution.tube, op.feed.vg2k, op.vpk, op.vgk), a.screenAtFull ?? null, series);
    resistors.push(...screen.resistors);
    capacitors.push(...screen.capacitors);
  }
  return {
    resistors,
    capacitors,
    transformer: {
      primary: design.zPrimary,
      secondary: design.speakerOhms,
      primaryDcr: design.rPrimary,
      dcCurrent: op.ip,
      power: a.clean.at.power,
      screenTap: op.connection === 'ultralinear' ? design.ulTap : null,
    },
    biasAdjustment: design.bias === 'fixed' ? biasAdjustment(a.solution.tube, design, op.vpk, op.ip) : null,
    gridStopper,
  };
}

/**
 * The dropper's parts to order: the resistor (sized for the screens' idle
 * current, run and rated by the voltage stage's rule at the larger of that
 * and their average with the grids driven to 0 V) and its bypass to ground, sized for
 * its reactance at CATHODE_BYPASS_CORNER_HZ to equal what it shunts (the
 * resistor in parallel with the screens themselves). The bypass is a filter
 * capacitor on B+ (at switch-on cold screens draw nothing, so it sees all of
 * it) and is rated as the supply's are: for that voltage with the mains 10 %
 * high (IEC 60038's tolerance).
 */
export function screenDropperParts(plan: ScreenFeedPlan, bplus: number, screenVolts: number, gScreens: number, fullAmps: number | null, series: PreferredSeries): { resistors: ResistorLine[]; capacitors: CapacitorLine[] } {
  if (plan.kind !== 'dropper') return { resistors: [], capacitors: [] };
  const rising = fullAmps !== null && Number.isFinite(fullAmps) && fullAmps > plan.amps;
  const r = resistorLine('Rs', rising ? 'screen dropper from B+, watts at full drive' : 'screen dropper from B+', plan.ohms, rising ? fullAmps : plan.amps, series);
  const shunted = gScreens > 0 ? 1 / (1 / r.preferred + gScreens) : r.preferred;
  const c = capacitorForCorner(shunted, CATHODE_BYPASS_CORNER_HZ, 'E12').preferred;
  const line = capacitorLine('Cs', 'screen bypass, rated as a filter capacitor', c, screenVolts, bplus, '+ to screen');
  return { resistors: [r], capacitors: [{ ...line, ratingVolts: roundUpTo(CAPACITOR_VOLTS, MAINS_HIGH * bplus) }] };
}
