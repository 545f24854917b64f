import type { BenchDesign } from './analysis';
import { readGridMeterText, readMeterText } from './fields';
import type { OutputPair } from './outputPlan';

/**
 * A builder's meter readings on one stage of the amplifier as built: the
 * plate and cathode to chassis at idle, V, and where the current is read
 * from the plate side (a stage with no cathode resistor, a long-tailed
 * pair) the supply at the plate resistor's top and a pair's second plate.
 * `stage` is the stage's place in
 * the amplifier (1 the input stage) and `tubeId` the tube it was read on: a
 * reading shows only while that place holds that tube, so a reordered chain
 * or a swapped tube never passes one stage's reading off as another's.
 */
export interface MeterPlan {
  readonly stage: number;
  readonly tubeId: string;
  readonly plate: number;
  readonly cathode: number;
  readonly supply?: number;
  readonly plate2?: number;
}

/** The design with a stage's reading put in its place (null: taken out); absent when none is left. */
export function withReading(d: BenchDesign, stage: number, reading: MeterPlan | null): BenchDesign {
  const others = (d.readings ?? []).filter((r) => r.stage !== stage);
  const readings = reading ? [...others, reading].sort((a, b) => a.stage - b.stage) : others;
  const { readings: _old, ...rest } = d;
  return readings.length > 0 ? { ...rest, readings } : rest;
}

/** A stage's readings as typed, every box it may ask for: each box's words when it is refused. */
export interface MeterText {
  readonly supply: string;
  readonly plate: string;
  readonly plate2: string;
  readonly cathode: string;
}

/** A box a triode stage is read from. */
export type TriodeBox = keyof MeterText;

/** Each box as the messages name it. */
const BOX_WORDS: Record<TriodeBox, string> = { supply: 'supply', plate: 'plate', plate2: 'second plate', cathode: 'cathode' };

/** A row's boxes as read: every asked box's value, or the boxes' messages; null when every asked box is empty. */
type ReadBoxes<K extends string> = { ok: true; values: Record<K, number> | null } | { ok: false; errors: Partial<Record<K, string>> };

/**
 * Reads a row's asked boxes: all empty is no reading; a box left empty
 * beside a filled one says so (`missing` names it), as does a refused one.
 */
function readBoxes<K extends string>(asked: readonly K[], text: Readonly<Record<K, string>>, missing: (key: K) => string): ReadBoxes<K> {
  if (asked.every((k) => text[k].trim() === '')) return { ok: true, values: null };
  const errors: Partial<Record<K, string>> = {};
  const values: Partial<Record<K, number>> = {};
  for (const key of asked) {
    if (text[key].trim() === '') {
      errors[key] = missing(key);
      continue;
    }
    const r = key === 'grid' ? readGridMeterText(text[key]) : readMeterText(text[key]);
    if (r.ok && r.value !== null) values[key] = r.value;
    else errors[key] = r.ok ? 'A reading must be a number of volts' : r.message;
  }
  return Object.keys(errors).length > 0 ? { ok: false, errors } : { ok: true, values: values as Record<K, number> };
}

/** Two readings of one row the same, value for value (so settling an unchanged box is no undo step). */
export function sameReading<T extends object>(a: T | null, b: T | null): boolean {
  return a === b || (a !== null && b !== null && (Object.keys(a) as (keyof T)[]).every((k) => a[k] === b[k]));
}

/**
 * What a stage's asked boxes make: a reading (every one read), none (all
 * empty: the reading is taken out), or the boxes' messages. A cathode not
 * asked (a stage with no cathode resistor) sits at chassis, 0 V.
 */
export function meterFromText(stage: number, tubeId: string, asked: readonly TriodeBox[], text: MeterText): { ok: true; reading: MeterPlan | null } | { ok: false; errors: Partial<Record<TriodeBox, string>> } {
  const read = readBoxes(asked, text, (key) => `Give the ${BOX_WORDS[key]}’s reading too: the stage is read from ${asked.length === 2 ? 'both' : 'every box'}.`);
  if (!read.ok) return read;
  const v = read.values as Partial<Record<TriodeBox, number>> | null;
  if (v === null) return { ok: true, reading: null };
  return { ok: true, reading: { stage, tubeId, plate: v.plate ?? 0, cathode: v.cathode ?? 0, ...(v.supply === undefined ? {} : { supply: v.supply }), ...(v.plate2 === undefined ? {} : { plate2: v.plate2 }) } };
}

/**
 * A builder's meter readings on an output tube at idle, V to chassis: tube
 * 1 or 2 of a pair (1 for a single tube, and for a cathode-biased pair, whose
 * shared cathode resistor reads both at once), with the tube, the stage's
 * form and its bias they were read on (a reading shows only while they
 * hold). `cathode` is the cathode's voltage under cathode bias, the drop
 * across the 1 Ω sense resistor under fixed bias; `grid` is 0 under cathode
 * bias; `screen` null where the screen is not read apart (triode-connected,
 * or a power triode).
 */
export interface OutputMeterPlan {
  readonly tube: 1 | 2;
  readonly tubeId: string;
  readonly pair: OutputPair;
  readonly bias: 'cathode' | 'fixed';
  readonly plate: number;
  readonly screen: number | null;
  readonly grid: number;
  readonly cathode: number;
}

/** The design with an output tube's reading put in its place (null: taken out); absent when none is left. */
export function withOutputReading(d: BenchDesign, tube: 1 | 2, reading: OutputMeterPlan | null): BenchDesign {
  const others = (d.outputReadings ?? []).filter((r) => r.tube !== tube);
  const readings = reading ? [...others, reading].sort((a, b) => a.tube - b.tube) : others;
  const { outputReadings: _old, ...rest } = d;
  return readings.length > 0 ? { ...rest, outputReadings: readings } : rest;
}

/** An output tube's boxes as typed: plate and cathode always, the screen and grid where the stage has them to read. */
export interface OutputMeterText {
  readonly plate: string;
  readonly screen: string;
  readonly grid: string;
  readonly cathode: string;
}

/** Which of an output tube's boxes the stage asks for. */
export interface OutputMeterBoxes {
  readonly screen: boolean;
  readonly grid: boolean;
}

/** The boxes an output tube is read from: plate and cathode always, the screen and grid where the stage asks for them. */
export function askedBoxes(boxes: OutputMeterBoxes): (keyof OutputMeterText)[] {
  return ['plate', 'cathode', ...(boxes.screen ? ['screen' as const] : []), ...(boxes.grid ? ['grid' as const] : [])];
}

/** What an output tube's boxes make: a reading (every asked box read), none (all empty), or the boxes' messages. */
export function outputMeterFromText(
  at: Pick<OutputMeterPlan, 'tube' | 'tubeId' | 'pair' | 'bias'>,
  boxes: OutputMeterBoxes,
  text: OutputMeterText,
): { ok: true; reading: OutputMeterPlan | null } | { ok: false; errors: Partial<Record<keyof OutputMeterText, string>> } {
  const read = readBoxes(askedBoxes(boxes), text, (key) => `Give the ${key === 'cathode' && at.bias === 'fixed' ? 'sense resistor' : key}’s reading too: the tube is read from every box.`);
  if (!read.ok) return read;
  const v = read.values;
  return { ok: true, reading: v && { ...at, plate: v.plate, cathode: v.cathode, screen: boxes.screen ? v.screen : null, grid: boxes.grid ? v.grid : 0 } };
}
