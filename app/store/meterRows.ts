import { findOutputTube, readMeter, readOutputMeter, readPairMeter, readPlateMeter, SENSE_OHMS, type ChainStage, type Finding, type MeterReadout, type OutputMeterReadout, type Result } from '../../src/index';
import { idleVoltagesOf } from './idleVoltages';
import type { MeterPlan, OutputMeterBoxes, OutputMeterPlan, TriodeBox } from './meterPlan';
import { outputPartsOf } from './outputParts';
import type { OutputPair } from './outputPlan';
import type { WorkbenchState } from './workbenchStore';

/**
 * How a triode stage's current is read: across its cathode resistor to
 * chassis (a gain stage, a follower, a split-load splitter), as its plate
 * resistor's drop from the supply (a gain stage with no cathode resistor),
 * or a long-tailed pair's two plates that way, its tail a check on their sum.
 */
export type MeterRoute = 'cathode' | 'plate' | 'pair';

/** What the model makes of a triode stage's reading: each tube's readout (two for a pair), their checks, and a pair's tail check. */
export interface TriodeReadout {
  readonly tubes: readonly MeterReadout[];
  readonly findings: readonly Finding[];
  readonly tail: { readonly plateSum: number; readonly tailCurrent: number; readonly agrees: boolean } | null;
}

/** A stage the meter can be read on, with its reading and what the model makes of it. */
export interface MeterRow {
  /** The stage's place in the amplifier, 1 the input stage. */
  readonly stage: number;
  /** As its card names it, with its tube ("Stage 2 · 12AU7"). */
  readonly name: string;
  readonly tubeId: string;
  /** The tube's plate dissipation rating, W. */
  readonly ratedWatts: number;
  readonly route: MeterRoute;
  /** The boxes the stage is read from, in the order shown. */
  readonly boxes: readonly TriodeBox[];
  /** What the meter should read there at idle, V (the solved design's), for each box asked. */
  readonly expected: Readonly<Record<TriodeBox, number>>;
  readonly reading: MeterPlan | null;
  readonly readout: Result<TriodeReadout> | null;
  /**
   * A direct-coupled grid sits where the stage before's output reads: the
   * place of the stage whose reading gave it (its plate, or a follower's
   * cathode), and that voltage; null where the grid is taken as designed.
   */
  readonly gridRead: { readonly stage: number; readonly pin: 'plate' | 'cathode'; readonly volts: number } | null;
}

/** None, as one value: a selector answering a fresh [] each call would redraw its panel on every store change. */
const NO_ROWS: readonly MeterRow[] = [];
const NO_OUTPUT_ROWS: readonly OutputMeterRow[] = [];

const BOXES: Record<MeterRoute, readonly TriodeBox[]> = { cathode: ['plate', 'cathode'], plate: ['supply', 'plate'], pair: ['supply', 'plate', 'plate2', 'cathode'] };

const memo = new WeakMap<object, { readings: WorkbenchState['design']['readings']; rows: readonly MeterRow[] }>();

/** One tube's readout as a stage's. */
const single = (r: Result<MeterReadout>): Result<TriodeReadout> => (r.ok ? { ok: true, tubes: [r], findings: r.findings, tail: null } : r);

/**
 * Where a stage's output reads, for the direct-coupled grid after it: a gain
 * stage's plate, a follower's cathode, as read on the tube it now holds
 * (`place`, 1-based); null where it was not read.
 */
function outputRead(before: ChainStage, place: number, readings: WorkbenchState['design']['readings']): MeterRow['gridRead'] {
  const tube = before.tube;
  const r = tube.kind === 'tube' ? readings?.find((x) => x.stage === place && x.tubeId === tube.id) : undefined;
  if (!r) return null;
  if (before.kind === 'common-cathode') return { stage: place, pin: 'plate', volts: r.plate };
  if (before.kind === 'follower') return { stage: place, pin: 'cathode', volts: r.cathode };
  return null;
}

/**
 * The amplifier's gain stages, cathode followers, split-load splitters
 * and long-tailed pairs, in chain order, each with the builder's reading
 * (when it was taken on the tube the stage now holds) read by the model.
 * Empty when the amplifier does not solve.
 */
export function meterRowsOf(s: WorkbenchState): readonly MeterRow[] {
  const view = s.amplifier;
  if (!view?.result.ok) return NO_ROWS;
  const readings = s.design.readings;
  const cached = memo.get(view);
  if (cached && cached.readings === readings) return cached.rows;
  const result = view.result;
  const rows: MeterRow[] = [];
  view.input.stages.forEach((st, i) => {
    if (st.kind !== 'common-cathode' && st.kind !== 'follower' && st.kind !== 'split-load' && st.kind !== 'long-tailed-pair') return;
    const tube = st.tube;
    if (tube.kind !== 'tube') return;
    // A split-load splitter reads as a follower does: one cathode resistor to chassis, its grid held where designed. Only a
    // gain stage runs without one (then read from its plate resistor).
    const route: MeterRoute | null = st.kind === 'long-tailed-pair' ? 'pair' : st.rk > 0 ? 'cathode' : st.kind === 'common-cathode' ? 'plate' : null;
    if (route === null) return;
    const pins = result.stages[i]!.pins;
    const stage = i + 1;
    const reading = readings?.find((r) => r.stage === stage && r.tubeId === tube.id) ?? null;
    const gridRead = st.coupling.kind === 'direct' && i > 0 ? outputRead(view.input.stages[i - 1]!, i, readings) : null;
    const grid = gridRead?.volts ?? pins.grid;
    const read = (g: MeterPlan): Result<TriodeReadout> => {
      if (st.kind === 'long-tailed-pair') {
        const r = readPairMeter({ tube, ra: st.ra, ra2: st.ra2 ?? st.ra, rk: st.rk, rtail: st.rtail, grid }, { supply: g.supply ?? 0, plate: g.plate, plate2: g.plate2 ?? 0, cathode: g.cathode });
        return r.ok ? { ok: true, tubes: r.tubes, findings: r.findings, tail: { plateSum: r.plateSum, tailCurrent: r.tailCurrent, agrees: r.tailAgrees } } : r;
      }
      if (route === 'plate' && st.kind === 'common-cathode') return single(readPlateMeter({ tube, ra: st.ra, grid }, { supply: g.supply ?? 0, plate: g.plate, cathode: 0 }));
      return single(readMeter({ tube, rk: st.rk, grid }, g));
    };
    rows.push({
      stage,
      name: `${view.names[i]!.title} · ${view.names[i]!.tube}`,
      tubeId: tube.id,
      ratedWatts: tube.ratings.maxPlateDissipation,
      route,
      boxes: BOXES[route],
      expected: { supply: st.bplus, plate: pins.plate, plate2: pins.plate2 ?? pins.plate, cathode: pins.cathode },
      reading,
      // A reading kept from before the stage asked for its box (none for it) is read as not yet whole.
      readout: reading && BOXES[route].every((b) => reading[b] !== undefined) ? read(reading) : null,
      gridRead,
    });
  });
  memo.set(view, { readings, rows });
  return rows;
}

/** An output tube the meter can be read on (or a cathode-biased pair, read together), with its reading read by the model. */
export interface OutputMeterRow {
  /** Tube 1 or 2 of a fixed-bias pair; 1 for a single tube and for a cathode-biased pair (`together`). */
  readonly tube: 1 | 2;
  /** A cathode-biased pair: its shared cathode resistor reads both tubes at once, each on average. */
  readonly together: boolean;
  readonly name: string;
  readonly tubeId: string;
  readonly pair: OutputPair;
  readonly bias: 'cathode' | 'fixed';
  /** The boxes the stage asks for beyond plate and cathode. */
  readonly boxes: OutputMeterBoxes;
  /** What the meter should read at idle, V: the cathode box is the sense resistor's drop under fixed bias. */
  readonly expected: { readonly plate: number; readonly screen: number | null; readonly grid: number; readonly cathode: number };
  readonly ratedWatts: number;
  readonly ratedScreenWatts: number | null;
  readonly reading: OutputMeterPlan | null;
  readonly readout: Result<OutputMeterReadout> | null;
}

const outputMemo = new WeakMap<object, { readings: WorkbenchState['design']['outputReadings']; sense: unknown; rows: readonly OutputMeterRow[] }>();

/**
 * The output stage's tubes as the meter reads them: one tube; a fixed-bias
 * pair's two (each on its own sense resistor); a cathode-biased pair as one
 * (its shared resistor carries both: each tube's average is half). Each with
 * the builder's reading when it was taken on this tube, form and bias.
 */
export function outputMeterRowsOf(s: WorkbenchState): readonly OutputMeterRow[] {
  const idle = idleVoltagesOf(s);
  const o = s.design.output;
  const tube = findOutputTube(o.tubeId);
  if (!idle || !tube) return NO_OUTPUT_ROWS;
  const row = idle.apartOutput ?? idle.rows.find((r) => r.name.startsWith('Output'));
  if (!row) return NO_OUTPUT_ROWS;
  const readings = s.design.outputReadings;
  const parts = o.bias === 'fixed' ? outputPartsOf(s) : null;
  const sense = parts?.biasAdjustment ?? null;
  const cached = outputMemo.get(row);
  if (cached && cached.readings === readings && cached.sense === sense) return cached.rows;
  const pair = o.pair;
  const bias = o.bias;
  const together = pair === 'push-pull' && bias === 'cathode';
  const boxes: OutputMeterBoxes = { screen: tube.law.kind === 'pentode' && o.connection !== 'triode', grid: bias === 'fixed' };
  const senseVolts = sense?.ok ? sense.senseVolts : row.ia * SENSE_OHMS;
  const expected = {
    plate: row.pins.plate,
    screen: boxes.screen ? row.pins.screen : null,
    grid: bias === 'fixed' ? row.pins.grid : 0,
    cathode: bias === 'fixed' ? senseVolts : row.pins.cathode,
  };
  // A pair's shared Rk carries both tubes: read across it as twice the resistance, the drop gives each tube's average.
  const rk = bias === 'fixed' ? SENSE_OHMS : together ? 2 * o.rk : o.rk;
  const tubes: (1 | 2)[] = pair === 'push-pull' && bias === 'fixed' ? [1, 2] : [1];
  const rows = tubes.map((n): OutputMeterRow => {
    const reading = readings?.find((r) => r.tube === n && r.tubeId === tube.id && r.pair === pair && r.bias === bias) ?? null;
    const name = `Output · ${tube.id}${together ? ' pair, each tube on average (they share Rk)' : pair === 'push-pull' ? `, tube ${n}` : ''}`;
    return {
      tube: n,
      together,
      name,
      tubeId: tube.id,
      pair,
      bias,
      boxes,
      expected,
      ratedWatts: tube.ratings.maxPlateDissipation,
      ratedScreenWatts: tube.ratings.maxScreenDissipation,
      reading,
      readout: reading ? readOutputMeter(tube, { plate: reading.plate, screen: reading.screen, grid: reading.grid, cathode: reading.cathode, rk }) : null,
    };
  });
  outputMemo.set(row, { readings, sense, rows });
  return rows;
}

/**
 * The rows a bench shows, as the voltages to check are listed: the output
 * bench with the stages apart reads its own tube alone; every other, the
 * amplifier's stages, and its output tubes when they are driven.
 */
export function shownMeterRows(s: WorkbenchState, outputBench: boolean): { readonly triodes: readonly MeterRow[]; readonly outputs: readonly OutputMeterRow[] } {
  const apart = !s.design.drivesOutput;
  return { triodes: outputBench && apart ? NO_ROWS : meterRowsOf(s), outputs: apart && !outputBench ? NO_OUTPUT_ROWS : outputMeterRowsOf(s) };
}

/**
 * The readings' dissipation checks that are more than a note, one entry per
 * row read, for the one ratings list (and so the card and the print): a
 * tube running past its rating as built is the amplifier's danger.
 */
export function meterFindings(s: WorkbenchState): { name: string; findings: readonly Finding[] }[] {
  const { triodes, outputs } = shownMeterRows(s, s.design.stageKind === 'output');
  return [...triodes, ...outputs].flatMap((row) => {
    const worth = row.readout?.ok ? row.readout.findings.filter((f) => f.severity !== 'note') : [];
    return worth.length > 0 ? [{ name: `${row.name}, as read`, findings: worth }] : [];
  });
}
