import type { BiasSupplyDesign, BiasSupplySolution } from '../supply/biasSupply';
import { resistorLine, type ResistorLine } from './partsList';
import { CAPACITOR_VOLTS, roundUpTo } from './ratings';
import { DIODE_VOLTS, MAINS_HIGH, type FilterCapacitorLine, type RectifierLine } from './supplyParts';

export interface BiasParts {
  /** The filter resistor, then each tube's string: rail end, trimmer, ground end. */
  readonly resistors: readonly ResistorLine[];
  readonly capacitors: readonly FilterCapacitorLine[];
  readonly rectifier: RectifierLine;
}

/**
 * The bias supply's parts to order, rated as the B+ supply's are: the
 * capacitors for the no-load peak with the mains 10 % high (supplyParts),
 * fitted the other way round (the rail is negative: + to ground); the
 * diode's reverse voltage likewise; each resistor and trimmer for twice
 * its dissipation (partsList's rule). The strings' values are E12 and the
 * trimmers' their own (1-2-5), so each is ordered as designed.
 */
export function biasPartsList(d: BiasSupplyDesign, s: BiasSupplySolution): BiasParts {
  const cold = s.noLoadVolts;
  const rating = roundUpTo(CAPACITOR_VOLTS, cold * MAINS_HIGH);
  const capacitor = (ref: string, role: string, value: number, volts: number, rippleAmps: number): FilterCapacitorLine => ({
    ref,
    role,
    value,
    volts: -volts,
    voltsAtSwitchOn: -cold,
    ratingVolts: rating,
    polarity: '+ to ground (the rail is negative)',
    rippleAmps,
    note: null,
  });
  // The reservoir passes the diode's pulses less the rail's steady current; the rail's capacitor almost none.
  const reservoirRipple = Math.sqrt(Math.max(s.diodeRms ** 2 - s.load ** 2, 0));
  const capacitors = [capacitor('Cb1', 'bias reservoir', d.reservoir, s.reservoir, reservoirRipple), capacitor('Cb2', 'bias rail', d.c, s.rail, s.railRippleRms / impedanceAt(d.c, d.mainsHz))];
  const resistors: ResistorLine[] = [resistorLine('Rb1', 'bias filter, reservoir to rail', d.r, s.load, 'E24')];
  s.taps.forEach((t, i) => {
    const n = s.taps.length > 1 ? `${i + 1}` : '';
    const whose = s.taps.length > 1 ? ` for tube ${i + 1}` : '';
    const { top, pot, bottom, amps } = t.string;
    resistors.push(resistorLine(`Rbt${n}`, `bias string${whose}, rail to the trimmer`, top, amps, 'E12'));
    resistors.push({ ...resistorLine(`VRb${n}`, `bias trimmer${whose}, linear: wiper to the grid leak`, pot, amps, 'E12'), preferred: pot, potentiometer: true });
    resistors.push(resistorLine(`Rbb${n}`, `bias string${whose}, trimmer to ground`, bottom, amps, 'E12'));
  });
  const piv = s.piv;
  const pivHighMains = piv * MAINS_HIGH;
  return {
    resistors,
    capacitors,
    rectifier: { kind: 'silicon-half-wave', piv, pivHighMains, diodeVolts: DIODE_VOLTS.find((v) => v >= pivHighMains) ?? null, peakAmps: s.diodePeak, rmsAmps: s.diodeRms },
  };
}

/** A capacitor's reactance at the ripple's frequency (the mains', behind one diode), Ω. */
const impedanceAt = (c: number, hz: number) => 1 / (2 * Math.PI * hz * c);
