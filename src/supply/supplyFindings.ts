import { bandOf, BAND_SEVERITY, bySeverity, finding, type Finding } from '../stage/ratingBands';
import { findRectifierTube } from './rectifierTubes';
import { formatValue } from '../parts/formatValue';
import type { SupplyDesign, SupplySolution } from './supplyTypes';
import { capacitorForRipple } from './capacitorForRipple';

/** Above this share of a supply part's rating it gets a warning: mains runs up to 10 % high (common practice). */
export const SUPPLY_WARN_FRACTION = 0.9;

/** A half-wave winding's DC past this is a warning, A: a few milliamps (a bias supply's) a mains winding takes in its stride; tens magnetise its core (our threshold). */
export const HALF_WAVE_DC_WARN_AMPS = 0.01;

const v0 = (x: number) => x.toFixed(Math.abs(x) < 10 ? 1 : 0);
const mA = (a: number) => `${(a * 1e3).toFixed(0)} mA`;

/**
 * The supply against its parts' ratings, most severe first. A capacitor is
 * checked at the supply's no-load voltage: before the tubes warm (silicon,
 * or an indirectly heated rectifier tube) nothing draws current and every
 * capacitor charges to the secondary's peak. Each check runs where its
 * rating is known: the rectifier tube's from its record, the others from
 * the builder's.
 */
export function supplyFindings(d: SupplyDesign, s: SupplySolution): Finding[] {
  const out: Finding[] = [];
  const banded = (kind: Finding['kind'], what: string, value: number, rating: number, unit: (x: number) => string, overText: string) => {
    const band = bandOf(value, rating, SUPPLY_WARN_FRACTION);
    const tail = { over: `: ${overText}`, at: ': at its rating, with no margin for high mains.', near: ': little margin for high mains.', within: '.' }[band];
    out.push(finding(kind, BAND_SEVERITY[band], `${what} ${unit(value)} against its ${unit(rating)} rating${tail}`, value, rating));
  };
  const r = d.ratings ?? {};
  const caps = [d.input.c, ...d.sections.map((x) => x.c)];
  caps.forEach((_, k) => {
    const volts = r.capacitorVolts?.[k];
    if (typeof volts === 'number') banded('capacitor-voltage', `Node ${k + 1}'s capacitor sees ${v0(s.noLoadVolts)} V at switch-on, cold;`, s.noLoadVolts, volts, (x) => `${v0(x)} V`, 'it will fail, and can burst. Use a higher rating or a slow-start (common practice).');
    const amps = r.capacitorRippleAmps?.[k];
    if (typeof amps === 'number') banded('capacitor-ripple-current', `Node ${k + 1}'s capacitor carries ripple current`, s.nodes[k]!.capacitorRippleRms, amps, mA, 'it will run hot and age fast.');
  });
  if (d.rectifier.kind === 'tube') {
    const t = findRectifierTube(d.rectifier.tubeId)!;
    const total = d.loads.reduce((a, b) => a + b, 0);
    banded('rectifier-current', `The ${t.id} delivers`, total, t.maxDcAmps, mA, 'the cathode will be stripped; use a larger rectifier.');
    banded('rectifier-peak-current', `The ${t.id}'s peak plate current`, s.rectifierPeak, t.maxPeakAmps, mA, 'arcing and a short life: add winding or series resistance, or a smaller reservoir.');
    if (d.input.kind === 'capacitor') banded('reservoir-capacitance', `The ${t.id}'s reservoir capacitor of ${(d.input.c * 1e6).toFixed(0)} µF:`, d.input.c, t.maxReservoirFarads, (x) => `${(x * 1e6).toFixed(0)} µF`, 'the charging surge at switch-on exceeds what the tube is rated for.');
  }
  if (d.rectifier.kind === 'silicon-half-wave') {
    // One diode passes current one way only: the winding carries the load's whole DC, which biases its core (common practice).
    const dc = d.loads.reduce((a, b) => a + b, 0);
    const heavy = dc > HALF_WAVE_DC_WARN_AMPS;
    out.push(finding('winding-dc', heavy ? 'warning' : 'note', `Half-wave, the winding carries the load's ${mA(dc)} DC as well as its pulses${heavy ? ': that magnetises the transformer\'s core, which then runs hot and hums. Use a transformer rated for it, or rectify full wave.' : ', which a mains transformer takes at this size.'}`, dc, HALF_WAVE_DC_WARN_AMPS));
  }
  if (typeof r.secondaryAmps === 'number') banded('transformer-current', 'The secondary carries', s.secondaryRmsCurrent, r.secondaryAmps, (x) => `${mA(x)} rms`, 'the transformer will overheat.');
  if (r.hum && s.nodes[r.hum.node]) {
    const ripple = s.nodes[r.hum.node]!.rippleRms;
    const over = ripple > r.hum.maxRippleRms;
    const cure = over ? capacitorForRipple(d, s, r.hum.node, r.hum.maxRippleRms) : null;
    const advice = cure === null ? 'add a filter section or a larger capacitor.' : `node ${r.hum.node + 1}'s capacitor at ${formatValue(cure, 'F')} (rounded up to E12) brings it within, or add a filter section.`;
    out.push(finding('hum', over ? 'warning' : 'note', `Ripple at node ${r.hum.node + 1}, which feeds the first stage, is ${formatValue(ripple, 'V')} rms against your budget of ${formatValue(r.hum.maxRippleRms, 'V')}${over ? `: expect hum; ${advice}` : '.'}`, ripple, r.hum.maxRippleRms));
  }
  return bySeverity(out);
}
