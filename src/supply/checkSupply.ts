import { fail, type Failure } from '../result';
import { checkNumber } from '../stage/checkInput';
import { findRectifierTube } from './rectifierTubes';
import type { SupplyDesign } from './supplyTypes';

export const MAX_SECTIONS = 8;
/** A section's R·C past this, s, is a typing slip (a supply settles in seconds), and would take the solver minutes. */
export const MAX_TIME_CONSTANT = 30;

/** The supply's design checked field by field: the first that cannot be used, or null. */
export function checkSupply(d: unknown): Failure | null {
  if (typeof d !== 'object' || d === null) return fail('invalid-input', 'No supply given');
  const s = d as SupplyDesign;
  const r = s.rectifier as { kind?: unknown; tubeId?: unknown } | undefined;
  const rectifierProblem =
    typeof r !== 'object' || r === null || !['silicon-bridge', 'silicon-full-wave', 'silicon-half-wave', 'tube'].includes(r.kind as string)
      ? fail('invalid-input', 'Choose the rectifier: a silicon bridge, silicon full-wave (centre-tapped), silicon half-wave or a rectifier tube', 'rectifier')
      : r.kind === 'tube' && (typeof r.tubeId !== 'string' || !findRectifierTube(r.tubeId))
        ? fail('invalid-input', 'Choose a rectifier tube from the list (5AR4, 5U4GB, 5Y3GT, EZ81)', 'rectifier')
        : null;
  const first =
    checkNumber('mainsHz', 'Mains frequency', s.mainsHz, 'Hz', 40, 70) ??
    checkNumber('secondaryRms', 'Secondary voltage', s.secondaryRms, 'V', 1, 2000) ??
    checkNumber('windingOhms', 'Winding resistance', s.windingOhms, 'Ω', 0, 10_000) ??
    (s.ratedAmps === undefined ? null : checkNumber('ratedAmps', 'The current the secondary voltage is rated at', s.ratedAmps, 'A', 0.001, 100)) ??
    (s.regulation === undefined ? null : checkNumber('regulation', 'Regulation', s.regulation, '', 0, 0.5)) ??
    (s.regulation !== undefined && s.ratedAmps === undefined ? fail('invalid-input', 'Regulation needs the rated current it is stated at', 'ratedAmps') : null) ??
    rectifierProblem;
  if (first) return first;
  const input = s.input as { kind?: unknown; c?: unknown; l?: unknown; rdc?: unknown } | undefined;
  if (typeof input !== 'object' || input === null || (input.kind !== 'capacitor' && input.kind !== 'choke')) {
    return fail('invalid-input', 'Choose the filter\'s input: a reservoir capacitor, or a choke then a capacitor', 'input');
  }
  const inputProblem =
    checkNumber('c', 'Reservoir capacitor', input.c, 'F', 1e-7, 10) ??
    (input.kind === 'choke' ? checkNumber('l', 'Input choke', input.l, 'H', 0.01, 1000) ?? checkNumber('rdc', 'Choke resistance', input.rdc, 'Ω', 0, 100_000) : null);
  if (inputProblem) return { ...inputProblem, field: `input.${inputProblem.field}` };
  // Common practice: a choke input holds its current through the gaps between pulses, and a half-wave rectifier leaves a
  // whole half-cycle dead, far past what a practical choke bridges.
  if (input.kind === 'choke' && r?.kind === 'silicon-half-wave') return fail('invalid-input', 'A choke input needs a full-wave rectifier: half-wave leaves it a dead half-cycle to carry the load through. Use a reservoir capacitor', 'input');
  if (!Array.isArray(s.sections) || s.sections.length > MAX_SECTIONS) return fail('invalid-input', `Give at most ${MAX_SECTIONS} filter sections`, 'sections');
  for (const [k, sec] of s.sections.entries()) {
    const x = sec as { kind?: unknown; r?: unknown; l?: unknown; rdc?: unknown; c?: unknown };
    const problem =
      typeof x !== 'object' || x === null || (x.kind !== 'rc' && x.kind !== 'lc')
        ? fail('invalid-input', 'A filter section is R–C or L–C', 'kind')
        : (x.kind === 'rc' ? checkNumber('r', 'Series resistor', x.r, 'Ω', 1, 1e6) : checkNumber('l', 'Choke', x.l, 'H', 0.01, 1000) ?? checkNumber('rdc', 'Choke resistance', x.rdc, 'Ω', 0, 100_000)) ??
          checkNumber('c', 'Capacitor', x.c, 'F', 1e-7, 10);
    if (problem) return { ...problem, message: `Section ${k + 1}: ${problem.message}`, field: `sections.${k}.${problem.field}` };
    const rc = x.kind === 'rc' ? (x.r as number) * (x.c as number) : 0;
    if (rc > MAX_TIME_CONSTANT) {
      return fail('invalid-input', `Section ${k + 1}: R·C is ${Math.round(rc)} s, far beyond any supply's (its B+ would take minutes to settle): check the values`, `sections.${k}.c`);
    }
  }
  if (!Array.isArray(s.loads) || s.loads.length !== s.sections.length + 1) {
    return fail('invalid-input', `Give the current drawn at each of the ${s.sections.length + 1} nodes (0 where none)`, 'loads');
  }
  for (const [k, a] of s.loads.entries()) {
    const problem = checkNumber('loads', `Current at node ${k + 1}`, a, 'A', 0, 10);
    if (problem) return { ...problem, field: `loads.${k}` };
  }
  return checkRatings(s.ratings, s.sections.length + 1);
}

/** The builder's ratings, where given: positive figures, one per node where a list. */
function checkRatings(r: unknown, nodes: number): Failure | null {
  if (r === undefined) return null;
  if (typeof r !== 'object' || r === null) return fail('invalid-input', 'Ratings must be an object or left out', 'ratings');
  const x = r as { secondaryAmps?: unknown; capacitorVolts?: unknown; capacitorRippleAmps?: unknown; hum?: unknown };
  if (x.secondaryAmps !== undefined) {
    const p = checkNumber('secondaryAmps', 'Secondary current rating', x.secondaryAmps, 'A', 0.001, 100);
    if (p) return { ...p, field: 'ratings.secondaryAmps' };
  }
  for (const [key, label, unit, max] of [['capacitorVolts', 'Capacitor voltage rating', 'V', 10_000], ['capacitorRippleAmps', 'Capacitor ripple-current rating', 'A', 100]] as const) {
    const list = x[key];
    if (list === undefined) continue;
    if (!Array.isArray(list) || list.length !== nodes) return fail('invalid-input', `${label}s: give one for each of the ${nodes} nodes (null where not known)`, `ratings.${key}`);
    for (const [k, v] of list.entries()) {
      const p = v === null ? null : checkNumber(key, `${label} at node ${k + 1}`, v, unit, 1e-3, max);
      if (p) return { ...p, field: `ratings.${key}.${k}` };
    }
  }
  if (x.hum !== undefined) {
    const h = x.hum as { node?: unknown; maxRippleRms?: unknown };
    const p =
      typeof h !== 'object' || h === null || typeof h.node !== 'number' || !Number.isInteger(h.node) || h.node < 0 || h.node >= nodes
        ? fail('invalid-input', `The hum budget names a node from 1 to ${nodes}`, 'ratings.hum.node')
        : checkNumber('maxRippleRms', 'Hum budget', h.maxRippleRms, 'V', 1e-9, 100);
    if (p) return p.field === 'maxRippleRms' ? { ...p, field: 'ratings.hum.maxRippleRms' } : p;
  }
  return null;
}
