import type { BenchDesign } from './analysis';
import { readMeterText } from './fields';

/**
 * A builder's meter readings on one stage of the amplifier as built: the
 * plate and cathode to chassis at idle, V. `stage` is the stage's place in
 * the amplifier (1 the input stage) and `tubeId` the tube it was read on: a
 * reading shows only while that place holds that tube, so a reordered chain
 * or a swapped tube never passes one stage's reading off as another's.
 */
export interface MeterPlan {
  readonly stage: number;
  readonly tubeId: string;
  readonly plate: number;
  readonly cathode: number;
}

/** The design's reading for a stage, when it was taken on the tube the stage now holds. */
export function readingFor(d: BenchDesign, stage: number, tubeId: string): MeterPlan | null {
  return d.readings?.find((r) => r.stage === stage && r.tubeId === tubeId) ?? null;
}

/** The design with a stage's reading put in its place (null: taken out); absent when none is left. */
export function withReading(d: BenchDesign, stage: number, reading: MeterPlan | null): BenchDesign {
  const others = (d.readings ?? []).filter((r) => r.stage !== stage);
  const readings = reading ? [...others, reading].sort((a, b) => a.stage - b.stage) : others;
  const { readings: _old, ...rest } = d;
  return readings.length > 0 ? { ...rest, readings } : rest;
}

/** A stage's two readings as typed: each box's words when it is refused. */
export interface MeterText {
  readonly plate: string;
  readonly cathode: string;
}

/**
 * What a stage's two boxes make: a reading (both read), none (both empty:
 * the reading is taken out), or the boxes' messages. A box left empty
 * beside a filled one says so: a reading needs both.
 */
export function meterFromText(stage: number, tubeId: string, text: MeterText): { ok: true; reading: MeterPlan | null } | { ok: false; errors: Partial<Record<keyof MeterText, string>> } {
  if (text.plate.trim() === '' && text.cathode.trim() === '') return { ok: true, reading: null };
  const errors: Partial<Record<keyof MeterText, string>> = {};
  const values: Partial<Record<keyof MeterText, number>> = {};
  for (const key of ['plate', 'cathode'] as const) {
    if (text[key].trim() === '') {
      errors[key] = `Give the ${key}’s reading too: the stage is read from both.`;
      continue;
    }
    const r = readMeterText(text[key]);
    if (r.ok && r.value !== null) values[key] = r.value;
    else errors[key] = r.ok ? 'A reading must be a number of volts' : r.message;
  }
  if (values.plate === undefined || values.cathode === undefined) return { ok: false, errors };
  return { ok: true, reading: { stage, tubeId, plate: values.plate, cathode: values.cathode } };
}
