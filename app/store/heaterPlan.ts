import { findOutputTube, findRectifierTube, heaterWindings, type HeaterLoad, type HeaterWinding, type Result } from '../../src/index';
import { buildSheetOf } from './buildSheet';
import { outputTubesPerChannel } from './outputPlan';
import type { WorkbenchState } from './workbenchStore';
import { elevationOf } from './heaterChoice';

/** The DC heater supply the small tubes run from, when the builder chose one: its voltage, the current it delivers and what it lights. */
export interface DcHeaterSupply {
  readonly volts: number;
  readonly amps: number;
  readonly feeds: readonly string[];
}

export type HeaterWindingsView = Result<{
  windings: readonly HeaterWinding[];
  dc: DcHeaterSupply | null;
  /** The potential the small tubes' heater supply is held at, V (0: ground), and which windings (by place) it holds: those lighting a small tube. */
  heldVolts: number;
  held: readonly boolean[];
}>;

/** Keyed by the build sheet's tube list (the same object through a drag), with what else the windings depend on. */
const cache = new WeakMap<object, { key: string; heaters: object; view: HeaterWindingsView }>();

/**
 * Every heater the amplifier lights: the mains transformer's heater
 * windings (the output stage's tubes once per channel, the rectifier
 * tube's once, and the voltage stages' envelopes in the wiring chosen on
 * the build sheet when they run on AC), and the DC heater supply when the
 * voltage stages run from one (its current at the heaters' own rating; the
 * dropping resistor takes up the difference in voltage). Remembered per tube
 * list, heater choice, output tube, rectifier and channel count, so a drag
 * (which changes none of them) neither recomputes nor redraws it.
 */
export function heaterWindingsOf(s: WorkbenchState): HeaterWindingsView {
  const d = s.design;
  const sheet = buildSheetOf(s);
  const tubes = sheet.tubes;
  const r = d.supply.rectifier;
  const key = `${d.drivesOutput ? `${d.output.tubeId}×${d.output.pair}` : ''}|${r.kind === 'tube' ? r.tubeId : r.kind}|${d.supply.channels}`;
  const hit = cache.get(tubes);
  if (hit && hit.key === key && hit.heaters === d.heaters) return hit.view;
  const channels = d.supply.channels;
  const small: HeaterLoad[] = tubes.map((t) => ({
    label: `${t.tube.id} (${t.chosen.volts} V, ${t.chosen.amps} A)`,
    volts: t.chosen.volts,
    amps: t.chosen.amps,
    count: t.envelopes * channels,
  }));
  const onDc = d.heaters.voltageStages === 'dc' && small.length > 0;
  const loads = onDc ? [] : small;
  const output = d.drivesOutput ? findOutputTube(d.output.tubeId) : undefined;
  if (output) loads.push({ label: `${output.id} (${output.heater.volts} V, ${output.heater.amps} A)`, volts: output.heater.volts, amps: output.heater.amps, count: channels * outputTubesPerChannel(d.output) });
  const rectifier = r.kind === 'tube' ? findRectifierTube(r.tubeId) : undefined;
  if (rectifier) loads.push({ label: `${rectifier.id} rectifier (${rectifier.heaterVolts} V, ${rectifier.heaterAmps} A)`, volts: rectifier.heaterVolts, amps: rectifier.heaterAmps, count: 1, atBplus: rectifier.directlyHeated });
  // Everything on DC with no output or rectifier tube: no winding to list (the model refuses an empty list).
  const windings: Result<{ windings: readonly HeaterWinding[] }> = loads.length === 0 ? { ok: true, windings: [] } : heaterWindings(loads);
  const dc = onDc && sheet.heaters.ok
    ? { volts: d.heaters.dcVolts, amps: sheet.heaters.totalAmps * channels, feeds: small.map((l) => (l.count > 1 ? `${l.count} × ${l.label}` : l.label)) }
    : null;
  // A winding is held where it lights a small tube (the elevation divider returns its centre tap): the windings are grouped by
  // voltage, so one at a small tube's voltage and not at B+ lights it. The output tubes on it ride along.
  const heldVolts = elevationOf(d.heaters);
  const held = (w: HeaterWinding) => !onDc && heldVolts !== 0 && !w.atBplus && small.some((l) => l.volts === w.volts);
  const view: HeaterWindingsView = windings.ok ? { ok: true, windings: windings.windings, dc, heldVolts, held: windings.windings.map(held) } : windings;
  cache.set(tubes, { key, heaters: d.heaters, view });
  return view;
}
