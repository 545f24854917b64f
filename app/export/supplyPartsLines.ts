import type { BiasParts, ChokeLine, RectifierLine, SupplyParts } from '../../src/index';
import { biasSupplyOf } from '../store/biasSupply';
import { BEHIND_WORDS } from './supplyLines';
import { farads, milliamps, ohms, plain, smallAmps, smallVolts, volts, watts } from '../format';
import type { WorkbenchState } from '../store/workbenchStore';

/** The supply's capacitors' rating rule, as the table's caption states it. */
export const SUPPLY_CAPACITOR_RULE = 'Filter capacitors (voltage rating: the cold voltage, mains 10 % high, IEC 60038; ripple-current rating above the ripple current)';

/**
 * The rectifier's part in words: what each diode (or the tube) stands in
 * reverse and carries at its peak. `bias` names a bias rail's one diode,
 * turned round for the negative rail.
 */
export function rectifierWords(r: RectifierLine, tubeId: string | null, bias = false): string {
  const stands = `stands ${volts(r.piv)} peak inverse cold (${volts(r.pivHighMains)} with the mains 10 % high), peak current ${milliamps(r.peakAmps)}`;
  if (r.kind === 'tube') return `Rectifier tube${tubeId ? ` ${tubeId}` : ''}: ${stands}; check its data sheet's peak inverse rating.`;
  const each = r.kind === 'silicon-bridge' ? 'four diodes in a bridge, each' : r.kind === 'silicon-half-wave' ? (bias ? 'one diode, anode to the reservoir (the rail is negative), which' : 'one diode, which') : 'two diodes, each';
  const part = r.diodeVolts !== null ? `: ${r.diodeVolts} V or more (1N400x series ratings)` : ': past 1000 V, two 1000 V diodes in series for each (common practice)';
  return `${bias ? 'Bias rectifier' : 'Rectifier'}, ${each} ${stands}${part}.`;
}

/** A choke in words: its inductance, resistance and the DC it must be rated for. */
export function chokeWords(c: ChokeLine): string {
  return `${c.ref} (${c.role}): ${plain(c.henries)} H, ${ohms(c.rdc)}, rated for at least ${milliamps(c.amps)} DC`;
}

/** The supply's parts as the card lists them, one line each; none when the supply is off or not solved. */
export function supplyPartLines(s: WorkbenchState): string[] {
  const parts = supplyPartsOf(s);
  if (!parts) return [];
  const tube = s.design.supply.rectifier.kind === 'tube' ? s.design.supply.rectifier.tubeId : null;
  return [
    ...(s.supplyView?.stale ? [BEHIND_WORDS] : []),
    ...parts.capacitors.map((c) => `${c.ref} (${c.role}): ${c.value === null ? 'value to choose' : farads(c.value)}, ${c.ratingVolts} V, ${smallAmps(c.rippleAmps)} rms ripple${c.note ? `; ${c.note}` : ''}`),
    ...parts.resistors.map((r) => `${r.ref} (${r.role}): ${ohms(r.preferred)}, ${r.ratingWatts} W (runs at ${watts(r.watts)})`),
    ...parts.chokes.map(chokeWords),
    rectifierWords(parts.rectifier, tube),
  ];
}

/** The supply's parts from its last solve (the view says whether the design has moved on since), else null. */
export function supplyPartsOf(s: WorkbenchState): SupplyParts | null {
  const v = s.supplyView;
  return s.design.supply.on && v && v.parts?.ok ? v.parts : null;
}

/** The bias supply's parts when the output stage is fixed-bias and its supply solves, else null. */
export function biasPartsOf(s: WorkbenchState): BiasParts | null {
  const r = biasSupplyOf(s);
  return r?.ok ? r.parts : null;
}

/** The bias supply's parts as the card lists them: capacitors (fitted + to ground), resistors and trimmers, the diode. */
export function biasPartLines(s: WorkbenchState): string[] {
  const parts = biasPartsOf(s);
  if (!parts) return [];
  return [
    ...parts.capacitors.map((c) => `${c.ref} (${c.role}): ${farads(c.value!)}, ${c.ratingVolts} V, ${c.polarity}`),
    ...parts.resistors.map((r) => `${r.ref} (${r.role}): ${ohms(r.preferred)}, ${r.ratingWatts} W (runs at ${watts(r.watts)})`),
    rectifierWords(parts.rectifier, null, true),
  ];
}

/** The bias supply on the card: what the rail gives, what each trimmer reaches, the caution, then its parts; none without one. */
export function biasSection(s: WorkbenchState): { heading: string; lines: string[] } | null {
  const r = biasSupplyOf(s);
  if (!r) return null;
  if (!r.ok) return { heading: 'Bias supply', lines: [`Not solved: ${r.message}`] };
  const t = r.taps[0]!;
  const each = r.taps.length > 1 ? 'Each tube’s trimmer' : 'The trimmer';
  return {
    heading: 'Bias supply: parts to order',
    lines: [
      ...(s.biasView?.stale ? [BEHIND_WORDS] : []),
      `Rail −${volts(r.rail)} (${smallVolts(r.railRippleRms)} rms ripple). ${each} reaches −${volts(t.string.least)} to −${volts(t.string.most)}; a typical ${s.design.output.tubeId} sets at −${volts(t.nominal)}.`,
      'Turn every trimmer to its cold end (most negative) and measure each grid with the output tubes out before first switch-on (common practice).',
      ...biasPartLines(s),
    ],
  };
}
