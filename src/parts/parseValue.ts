/**
 * Part values in the trade's notation: "33k", "3k3" (the multiplier letter as
 * decimal point, IEC 60062 resistor code), "6K8", "2R2", "2M2", "68n", "4u7",
 * "470p", "0.22u", "22µ", "330 Ω", "68nF", "1meg", "-1.5".
 *
 * Multipliers: p n u/µ/μ m k/K M/meg G, and R/r for ×1. Upper-case M is mega
 * and lower-case m is milli, as in the SI; "meg" is accepted as mega because
 * some schematics write it. One unit may follow: Ω, ohm(s), F, V, A, W, Hz.
 */
export type ParsedValue = { readonly ok: true; readonly value: number } | { readonly ok: false; readonly message: string };

const MULTIPLIERS: Record<string, number> = {
  p: 1e-12,
  n: 1e-9,
  u: 1e-6,
  'µ': 1e-6,
  'μ': 1e-6,
  m: 1e-3,
  r: 1,
  R: 1,
  k: 1e3,
  K: 1e3,
  M: 1e6,
  meg: 1e6,
  MEG: 1e6,
  Meg: 1e6,
  G: 1e9,
};

const UNIT = /(?:Ω|Ω|ohms?|Ohms?|OHMS?|F|V|A|W|Hz|HZ|hz)$/;
// number, optional multiplier, optional digits after an infix multiplier (3k3, 2R2, 4u7)
const SHAPE = /^([+-]?)(\d*\.?\d*)(meg|MEG|Meg|[pnuµμmrRkKMG]?)(\d*)$/;

export function parseValue(text: string): ParsedValue {
  if (typeof text !== 'string') return { ok: false, message: 'Enter a value, e.g. 33k' };
  const trimmed = text.trim();
  if (trimmed === '') return { ok: false, message: 'Enter a value, e.g. 33k or 3k3' };
  if (trimmed.length > 40) return { ok: false, message: 'That entry is too long to be a part value' };
  const noUnit = trimmed.replace(UNIT, '').replace(/\s+/g, '');
  const m = SHAPE.exec(noUnit);
  if (!m || noUnit === '') {
    return { ok: false, message: `“${trimmed}” is not a part value: use digits with an optional multiplier (p n u m k M), e.g. 33k, 3k3 or 68n` };
  }
  const [, sign, lead, mult, tail] = m as unknown as [string, string, string, string, string];
  if (lead === '' || lead === '.') {
    if (!(mult !== '' && tail !== '' && lead === '')) {
      return { ok: false, message: `“${trimmed}” has no digits before the multiplier: write e.g. 0.47 or 0R47` };
    }
  }
  if (tail !== '' && (mult === '' || lead.includes('.'))) {
    return { ok: false, message: `“${trimmed}” mixes a decimal point with an inner multiplier: write 4.7k or 4k7, not both` };
  }
  const digits = tail === '' ? lead : `${lead === '' ? '0' : lead}.${tail}`;
  const number = Number(digits);
  const factor = mult === '' ? 1 : MULTIPLIERS[mult];
  if (!Number.isFinite(number) || factor === undefined) {
    return { ok: false, message: `“${trimmed}” is not a part value: use digits with an optional multiplier (p n u m k M), e.g. 33k` };
  }
  // 15 significant digits: 100 × 1e-9 is 1.0000000000000001e-7 in binary floating point.
  const value = Number(((sign === '-' ? -1 : 1) * number * factor).toPrecision(15));
  return { ok: true, value: Object.is(value, -0) ? 0 : value };
}
