import type { BiasSupplyDesign, BiasSupplySolution } from '../supply/biasSupply';
import { resistorLine, type ResistorLine } from './partsList';
import { coldRating, rectifierLine, type FilterCapacitorLine, type RectifierLine } from './supplyParts';

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
  const rating = coldRating(cold);
  const capacitor = (ref: string, role: string, value: number, volts: number, rippleAmps: number): FilterCapacitorLine => ({
    ref,
    role,
    value,
    volts: -volts,
    voltsAtSwitchOn: -cold,
    ratingVolts: rating,
    polarity: '+ to ground',
    rippleAmps,
    note: null,
  });
  const capacitors = [capacitor('Cb1', 'bias reservoir', d.reservoir, s.reservoir, s.reservoirRippleAmps), capacitor('Cb2', 'bias rail', d.c, s.rail, s.railRippleAmps)];
  const resistors: ResistorLine[] = [resistorLine('Rb1', 'bias filter, reservoir to rail', d.r, s.load, 'E24')];
  // Every tube needs the same reach, so every string is alike: one line each part, its references one per tube.
  const refs = (ref: string) => (s.taps.length > 1 ? s.taps.map((_, i) => `${ref}${i + 1}`).join(', ') : ref);
  const each = s.taps.length > 1 ? ', one per tube' : '';
  const { top, pot, bottom, amps } = s.taps[0]!.string;
  resistors.push(resistorLine(refs('Rbt'), `bias string, rail to the trimmer${each}`, top, amps, 'E12'));
  resistors.push({ ...resistorLine(refs('VRb'), `bias trimmer, linear: wiper to the grid leak${each}`, pot, amps, 'E12'), preferred: pot, potentiometer: true });
  resistors.push(resistorLine(refs('Rbb'), `bias string, trimmer to ground${each}`, bottom, amps, 'E12'));
  return { resistors, capacitors, rectifier: rectifierLine('silicon-half-wave', s.piv, s.diodePeak, s.diodeRms) };
}
