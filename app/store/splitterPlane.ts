import { splitterPlane, type SplitterPlane } from '../../src/index';
import { lookupTube } from '../keep/customTubes';
import { drivesPair } from './outputPlan';
import type { WorkbenchState } from './workbenchStore';

/** Per solved amplifier: the chart runs the model once for each. */
const memo = new WeakMap<object, SplitterPlane | null>();

/** The phase splitter on its plate curves, from the solved amplifier; null when no pair is driven or it does not solve. */
export function splitterPlaneOf(s: WorkbenchState): SplitterPlane | null {
  const view = s.amplifier;
  if (!view || !drivesPair(s.design) || !view.result.ok) return null;
  const key = view.result;
  if (memo.has(key)) return memo.get(key)!;
  const i = view.names.findIndex((n) => n.role === 'splitter');
  const st = i >= 0 ? view.result.stages[i] : undefined;
  const tube = lookupTube(s.design.output.splitter.tubeId);
  const plane = st && tube ? splitterPlane(tube, s.design.output.splitter, st.op) : null;
  memo.set(key, plane);
  return plane;
}
