import { millerInputCapacitance, solveSplitter, splitterPlane, type SplitterPlane, type SplitterResult } from '../../src/index';
import { drivesPair } from './outputPlan';
import type { WorkbenchState } from './workbenchStore';

/** The splitter's grid voltage: the divider's, or (direct-coupled) the DC of the plate before it in the solved amplifier. */
function gridVolts(s: WorkbenchState): number | null {
  const sp = s.design.output.splitter;
  if (sp.coupling !== 'direct') return sp.vgrid;
  const view = s.amplifier;
  const i = view?.names.findIndex((n) => n.role === 'splitter') ?? -1;
  return view && view.result.ok && i > 0 ? view.result.stages[i - 1]!.outputDc : null;
}

/** Per solved amplifier and the pair's last full pass: the chart runs the model once for each. */
const memo = new WeakMap<object, WeakMap<object, SplitterPlane | null>>();

/** The phase splitter on its plate curves, from the solved amplifier; null when no pair is driven or it does not solve. */
export function splitterPlaneOf(s: WorkbenchState): SplitterPlane | null {
  const view = s.amplifier;
  if (!view || !drivesPair(s.design) || !view.result.ok) return null;
  const byResult = memo.get(view.result) ?? new WeakMap<object, SplitterPlane | null>();
  memo.set(view.result, byResult);
  const key = s.outputBench.settled;
  if (byResult.has(key)) return byResult.get(key)!;
  const i = view.names.findIndex((n) => n.role === 'splitter');
  const st = i >= 0 ? view.result.stages[i] : undefined;
  const tube = s.registry.lookup(s.design.output.splitter.tubeId);
  // A long-tailed pair's second triode from the splitter's own solve (the chain carries the first's point).
  const figures = splitterFiguresOf(s);
  const vgrid = gridVolts(s);
  const plane = st && tube && vgrid !== null ? splitterPlane(tube, { ...s.design.output.splitter, vgrid }, st.op, figures?.op[1]) : null;
  byResult.set(key, plane);
  return plane;
}

const figuresMemo = new WeakMap<object, Map<object, SplitterResult | null>>();

/**
 * The splitter's own figures as the pair loads it: each output into a pair
 * grid's resistor and its input capacitance with the Miller effect (the
 * pair's plate swing per grid volt from its last full pass), so the balance
 * against frequency is the one the pair's grids see.
 */
export function splitterFiguresOf(s: WorkbenchState): SplitterResult | null {
  const b = s.outputBench;
  if (!drivesPair(s.design) || b.pair !== 'push-pull') return null;
  const sp = s.design.output.splitter;
  const byBench = figuresMemo.get(sp) ?? new Map<object, SplitterResult | null>();
  figuresMemo.set(sp, byBench);
  // Keyed by the pair's pass and, for a direct-coupled grid, the amplifier that sets its voltage.
  const key = sp.coupling === 'direct' && s.amplifier ? s.amplifier : b.settled;
  if (byBench.has(key)) return byBench.get(key)!;
  const tube = s.registry.lookup(sp.tubeId);
  const a = b.settled;
  // Each half's fundamental from the power into Raa/4, over the drive per grid: the plate's gain.
  const fundamental = Math.sqrt(2 * a.full.power * (a.solution.design.raa / 4));
  const plateGain = a.full.drive > 0 ? fundamental / a.full.drive : 0;
  const cl = millerInputCapacitance(a.solution.tube.capacitances, plateGain);
  const vgrid = gridVolts(s);
  const r = tube && vgrid !== null ? solveSplitter({ ...sp, vgrid, tube, rl: s.design.output.rg, cl }) : null;
  const result = r && r.ok ? r : null;
  byBench.set(key, result);
  return result;
}
