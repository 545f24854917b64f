const fmt = (v: number) => (Number.isFinite(v) ? String(Number(v.toPrecision(6))) : String(v));

/** A value as a message quotes it: numbers to six figures, never the words NaN or undefined. */
export function shown(v: unknown): string {
  if (typeof v === 'number') return Number.isNaN(v) ? 'not a number' : fmt(v);
  if (v === undefined || v === null) return 'nothing';
  return typeof v === 'string' ? `“${v.slice(0, 20)}”` : typeof v;
}
