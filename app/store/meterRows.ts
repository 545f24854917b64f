import { readMeter, type MeterReadout, type Result } from '../../src/index';
import type { MeterPlan } from './meterPlan';
import type { WorkbenchState } from './workbenchStore';

/** A stage the meter can be read on (a triode with a cathode resistor to chassis), with its reading and what the model makes of it. */
export interface MeterRow {
  /** The stage's place in the amplifier, 1 the input stage. */
  readonly stage: number;
  /** As its card names it, with its tube ("Stage 2 · 12AU7"). */
  readonly name: string;
  readonly tubeId: string;
  /** The tube's plate dissipation rating, W. */
  readonly ratedWatts: number;
  /** What the meter should read there at idle, V (the solved design's). */
  readonly expected: { readonly plate: number; readonly cathode: number };
  readonly reading: MeterPlan | null;
  readonly readout: Result<MeterReadout> | null;
}

const memo = new WeakMap<object, { readings: WorkbenchState['design']['readings']; rows: readonly MeterRow[] }>();

/**
 * The amplifier's gain stages and cathode followers with a cathode
 * resistor, in chain order, each with the builder's reading (when it was
 * taken on the tube the stage now holds) read by the model. Empty when the
 * amplifier does not solve.
 */
export function meterRowsOf(s: WorkbenchState): readonly MeterRow[] {
  const view = s.amplifier;
  if (!view?.result.ok) return [];
  const readings = s.design.readings;
  const cached = memo.get(view);
  if (cached && cached.readings === readings) return cached.rows;
  const result = view.result;
  const rows: MeterRow[] = [];
  view.input.stages.forEach((st, i) => {
    if (st.kind !== 'common-cathode' && st.kind !== 'follower') return;
    const tube = st.tube;
    if (!(st.rk > 0) || tube.kind !== 'tube') return;
    const solved = result.stages[i]!;
    const stage = i + 1;
    const reading = readings?.find((r) => r.stage === stage && r.tubeId === tube.id) ?? null;
    rows.push({
      stage,
      name: `${view.names[i]!.title} · ${view.names[i]!.tube}`,
      tubeId: tube.id,
      ratedWatts: tube.ratings.maxPlateDissipation,
      expected: { plate: solved.pins.plate, cathode: solved.pins.cathode },
      reading,
      readout: reading ? readMeter({ tube, rk: st.rk, grid: solved.pins.grid }, reading) : null,
    });
  });
  memo.set(view, { readings, rows });
  return rows;
}
