import { findOutputTube, findRectifierTube, heaterWindings, type HeaterLoad, type HeaterWinding, type Result } from '../../src/index';
import { buildSheetOf } from './buildSheet';
import type { WorkbenchState } from './workbenchStore';

export type HeaterWindingsView = Result<{ windings: readonly HeaterWinding[] }>;

const cache = new WeakMap<object, { inputs: object; view: HeaterWindingsView }>();

/**
 * Every heater the amplifier lights, as windings of the mains transformer:
 * the voltage stages' envelopes (in the wiring chosen on the build sheet)
 * and the output stage's tube, once per channel; the rectifier tube's once.
 * Remembered per design and build-sheet inputs, so panels can read it freely.
 */
export function heaterWindingsOf(s: WorkbenchState): HeaterWindingsView {
  const hit = cache.get(s.design);
  if (hit && hit.inputs === s.buildInputs) return hit.view;
  const d = s.design;
  const channels = d.supply.channels;
  const loads: HeaterLoad[] = buildSheetOf(s).tubes.map((t) => ({
    label: `${t.tube.id} (${t.chosen.volts} V, ${t.chosen.amps} A)`,
    volts: t.chosen.volts,
    amps: t.chosen.amps,
    count: t.envelopes * channels,
  }));
  const output = d.drivesOutput ? findOutputTube(d.output.tubeId) : undefined;
  if (output) loads.push({ label: `${output.id} (${output.heater.volts} V, ${output.heater.amps} A)`, volts: output.heater.volts, amps: output.heater.amps, count: channels });
  const rectifier = d.supply.rectifier.kind === 'tube' ? findRectifierTube(d.supply.rectifier.tubeId) : undefined;
  if (rectifier) loads.push({ label: `${rectifier.id} rectifier (${rectifier.heaterVolts} V, ${rectifier.heaterAmps} A)`, volts: rectifier.heaterVolts, amps: rectifier.heaterAmps, count: 1, atBplus: rectifier.directlyHeated });
  const view = heaterWindings(loads);
  cache.set(s.design, { inputs: s.buildInputs, view });
  return view;
}
