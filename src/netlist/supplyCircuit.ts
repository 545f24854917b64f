import { findRectifierTube, perveanceOf } from '../supply/rectifierTubes';
import { SILICON } from '../supply/rectifierLaw';
import type { SupplyDesign } from '../supply/supplyTypes';
import { openCircuitWinding } from '../supply/winding';

const g = (x: number) => x.toPrecision(12);

/** Where the supply's circuit meets the rest: node k's name, and the node the rectifier delivers into (the reservoir, or a choke input's choke). */
export interface SupplyCircuit {
  readonly lines: readonly string[];
  /** The rectifier's output: the reservoir's node, or the choke's far end for a choke input. */
  readonly rectified: string;
  /** The source whose current is the rectifier's (a 0 V sense source, or a bridge's winding), for `i(...)`. */
  readonly pulses: string;
}

/**
 * A B+ supply as ngspice parts, as the model solves it (solveSupply): the
 * secondary as sine sources at its open-circuit voltage behind the winding's
 * resistance (two in antiphase for a centre-tapped winding; one into one
 * diode for half-wave; one floating for a bridge), silicon diodes with the
 * model's Shockley constants, a rectifier tube as a behavioural
 * Child–Langmuir source, a 0 V source carrying the rectifier's current, the
 * choke of a choke input, and the filter ladder: node k's capacitor to
 * ground and each section's resistor (or choke with its resistance) from
 * node k − 1 to node k. `node(k)` names node k (0 the reservoir). No loads:
 * the caller hangs them on the nodes.
 */
export function supplyCircuit(d: SupplyDesign, node: (k: number) => string): SupplyCircuit {
  const { emfRms, ohms } = openCircuitWinding(d);
  const peak = Math.SQRT2 * emfRms;
  const f = d.mainsHz;
  const winding = g(Math.max(ohms, 1e-6));
  const lines = [`.model DSI D(IS=${g(SILICON.is)} N=${g(SILICON.n)} RS=${g(SILICON.rs)})`];
  const rectified = d.input.kind === 'choke' ? 'srect' : node(0);
  const tube = d.rectifier.kind === 'tube' ? findRectifierTube(d.rectifier.tubeId) : undefined;
  const plate = (from: string, name: string) =>
    tube ? `BRECT${name} ${from} srx I = ${g(perveanceOf(tube))}*pwr(max(v(${from},srx),0),1.5)` : `DRECT${name} ${from} srx DSI`;
  let pulses = 'vsense';
  if (d.rectifier.kind === 'silicon-bridge') {
    // One floating winding; a large resistor gives its far end a DC path for the simulator's operating point. Straight
    // into the filter: a sense source there leaves the floating end too loose for the simulator's steps, so the
    // winding's own source carries every pulse.
    lines.push(`VSECA swa swb SIN(0 ${g(peak)} ${f})`, `RSECA swa swa1 ${winding}`, 'RFLOAT swb 0 1e9');
    lines.push(`DRECT1 swa1 ${rectified} DSI`, `DRECT2 swb ${rectified} DSI`, 'DRECT3 0 swa1 DSI', 'DRECT4 0 swb DSI');
    pulses = 'vseca';
  } else if (d.rectifier.kind === 'silicon-half-wave') {
    lines.push(`VSECA swa 0 SIN(0 ${g(peak)} ${f})`, `RSECA swa swa1 ${winding}`, plate('swa1', '1'));
  } else {
    // A centre-tapped winding: each half at the rated voltage, in antiphase.
    lines.push(`VSECA swa 0 SIN(0 ${g(peak)} ${f})`, `VSECB swb 0 SIN(0 ${g(-peak)} ${f})`, `RSECA swa swa1 ${winding}`, `RSECB swb swb1 ${winding}`);
    lines.push(plate('swa1', '1'), plate('swb1', '2'));
  }
  if (d.rectifier.kind !== 'silicon-bridge') lines.push(`VSENSE srx ${rectified} DC 0`);
  if (d.input.kind === 'choke') lines.push(`LIN srect srl ${g(d.input.l)}`, `RLIN srl ${node(0)} ${g(Math.max(d.input.rdc, 1e-6))}`);
  lines.push(`CN0 ${node(0)} 0 ${g(d.input.c)}`);
  d.sections.forEach((s, i) => {
    const k = i + 1;
    if (s.kind === 'rc') lines.push(`RN${k} ${node(k - 1)} ${node(k)} ${g(s.r)}`);
    else lines.push(`LN${k} ${node(k - 1)} sm${k} ${g(s.l)}`, `RLN${k} sm${k} ${node(k)} ${g(Math.max(s.rdc, 1e-6))}`);
    lines.push(`CN${k} ${node(k)} 0 ${g(s.c)}`);
  });
  return { lines, rectified, pulses };
}
