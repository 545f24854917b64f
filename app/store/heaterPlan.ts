import { findOutputTube, findRectifierTube, heaterWindings, type HeaterLoad, type HeaterWinding, type Result } from '../../src/index';
import { buildSheetOf } from './buildSheet';
import type { WorkbenchState } from './workbenchStore';

export type HeaterWindingsView = Result<{ windings: readonly HeaterWinding[] }>;

/** Keyed by the build sheet's tube list (the same object through a drag), with what else the windings depend on. */
const cache = new WeakMap<object, { key: string; view: HeaterWindingsView }>();

/**
 * Every heater the amplifier lights, as windings of the mains transformer:
 * the voltage stages' envelopes (in the wiring chosen on the build sheet)
 * and the output stage's tube, once per channel; the rectifier tube's once.
 * Remembered per tube list, output tube, rectifier and channel count, so a
 * drag (which changes none of them) neither recomputes nor redraws it.
 */
export function heaterWindingsOf(s: WorkbenchState): HeaterWindingsView {
  const d = s.design;
  const tubes = buildSheetOf(s).tubes;
  const r = d.supply.rectifier;
  const key = `${d.drivesOutput ? `${d.output.tubeId}×${d.output.pair}` : ''}|${r.kind === 'tube' ? r.tubeId : r.kind}|${d.supply.channels}`;
  const hit = cache.get(tubes);
  if (hit && hit.key === key) return hit.view;
  const channels = d.supply.channels;
  const loads: HeaterLoad[] = tubes.map((t) => ({
    label: `${t.tube.id} (${t.chosen.volts} V, ${t.chosen.amps} A)`,
    volts: t.chosen.volts,
    amps: t.chosen.amps,
    count: t.envelopes * channels,
  }));
  const output = d.drivesOutput ? findOutputTube(d.output.tubeId) : undefined;
  if (output) loads.push({ label: `${output.id} (${output.heater.volts} V, ${output.heater.amps} A)`, volts: output.heater.volts, amps: output.heater.amps, count: channels * (d.output.pair === 'push-pull' ? 2 : 1) });
  const rectifier = r.kind === 'tube' ? findRectifierTube(r.tubeId) : undefined;
  if (rectifier) loads.push({ label: `${rectifier.id} rectifier (${rectifier.heaterVolts} V, ${rectifier.heaterAmps} A)`, volts: rectifier.heaterVolts, amps: rectifier.heaterAmps, count: 1, atBplus: rectifier.directlyHeated });
  const view = heaterWindings(loads);
  cache.set(tubes, { key, view });
  return view;
}
