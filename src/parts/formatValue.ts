/**
 * Formats an SI value with an engineering prefix and up to three significant
 * figures, e.g. formatValue(4700, 'Ω') → "4.7 kΩ", formatValue(1e-7, 'F') →
 * "100 nF". Non-finite values read "—" (and Infinity "∞"), never "NaN".
 */
const PREFIXES: readonly [number, string][] = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
];

export function formatValue(value: number, unit = '', digitsAsked = 3): string {
  if (typeof value !== 'number') return '—';
  if (typeof unit !== 'string') unit = '';
  // toPrecision takes 1 to 100 figures; a display never wants more than 15.
  const digits = typeof digitsAsked === 'number' && Number.isFinite(digitsAsked) ? Math.min(15, Math.max(1, Math.round(digitsAsked))) : 3;
  const sep = unit === '' ? '' : ' ';
  if (value === Infinity) return `∞${sep}${unit}`;
  if (value === -Infinity) return `−∞${sep}${unit}`;
  if (!Number.isFinite(value)) return '—';
  if (value === 0) return `0${sep}${unit}`;
  const abs = Math.abs(value);
  // Frequencies below 1 Hz read as decimals: "0.91 Hz", never "913 mHz" (which reads as megahertz at a glance).
  if (unit === 'Hz' && abs < 1 && abs >= 1e-3) return `${String(Number(value.toPrecision(digits))).replace('-', '−')}${sep}${unit}`;
  let [scale, prefix] = PREFIXES[PREFIXES.length - 1]!;
  for (const [s, p] of PREFIXES) {
    if (abs >= s * (1 - 5e-4 * Math.pow(10, 3 - digits))) {
      scale = s;
      prefix = p;
      break;
    }
  }
  let mantissa = Number((value / scale).toPrecision(digits));
  // 999.6 rounds to 1000: move to the next prefix up.
  const idx = PREFIXES.findIndex(([s]) => s === scale);
  if (Math.abs(mantissa) >= 1000 && idx > 0) {
    [scale, prefix] = PREFIXES[idx - 1]!;
    mantissa = Number((value / scale).toPrecision(digits));
  }
  const text = String(mantissa).replace('-', '−');
  return `${text}${sep}${prefix}${unit}`;
}
