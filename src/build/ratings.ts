/**
 * Standard ratings to round up to. Resistor power ratings as commonly
 * stocked; capacitor voltage ratings from the common electrolytic and film
 * ranges (IEC 60384 lists rated voltages of this kind; the selection is
 * common practice).
 */
export const RESISTOR_WATTS: readonly number[] = [0.125, 0.25, 0.5, 1, 2, 3, 5, 7, 10, 15, 25, 50];
export const CAPACITOR_VOLTS: readonly number[] = [6.3, 10, 16, 25, 35, 50, 63, 100, 160, 250, 350, 400, 450, 500, 630, 1000, 1600];

/** Margin on power and voltage ratings: twice what the part sees (common practice, no source). */
export const RATING_MARGIN = 2;

/** The smallest standard value at or above need; the largest one (flagged by the caller) when none is. */
export function roundUpTo(table: readonly number[], need: number): number {
  if (!Array.isArray(table) || table.length === 0) return need;
  return table.find((v) => v >= need - 1e-12) ?? table[table.length - 1]!;
}
