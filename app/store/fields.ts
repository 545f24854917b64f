import { formatValue, parseValue } from '../../src/index';

/** The design values a user types; each has one definition of how it is read, checked and shown. */
export type FieldName = 'bplus' | 'ra' | 'rk' | 'rl';

export interface FieldDef {
  readonly label: string;
  readonly unit: string;
  /** Example shown as the input's placeholder. */
  readonly example: string;
  /** Reads the typed text: the SI value, or a message for the user. */
  readonly read: (text: string) => { ok: true; value: number } | { ok: false; message: string };
  /** The text shown for a value the design holds. */
  readonly show: (value: number) => string;
}

function ranged(label: string, unit: string, min: number, max: number, opts: { allowZero?: boolean } = {}) {
  return (text: string) => {
    const r = parseValue(text);
    if (!r.ok) return r;
    const low = opts.allowZero ? r.value < 0 : r.value <= 0;
    if (low) return { ok: false as const, message: `${label} must be ${opts.allowZero ? '0 or more' : 'above 0'} ${unit}` };
    if (r.value < min && r.value !== 0) return { ok: false as const, message: `${label} must be at least ${formatValue(min, unit)}` };
    if (r.value > max) return { ok: false as const, message: `${label} must be at most ${formatValue(max, unit)}` };
    return r;
  };
}

/** Compact trade notation for an input box: 27000 → "27k", 1200 → "1.2k", 275 → "275". */
export const compact = (v: number) => formatValue(v, '').replace('µ', 'u');

export const FIELDS: Readonly<Record<FieldName, FieldDef>> = {
  bplus: { label: 'B+', unit: 'V', example: '275', read: ranged('B+', 'V', 1, 1500), show: compact },
  ra: { label: 'Ra', unit: 'Ω', example: '47k', read: ranged('Ra', 'Ω', 100, 10e6), show: compact },
  rk: { label: 'Rk', unit: 'Ω', example: '1k5', read: ranged('Rk', 'Ω', 1, 1e6, { allowZero: true }), show: compact },
  rl: {
    label: 'RL',
    unit: 'Ω',
    example: '220k or none',
    read: (text) => {
      const t = text.trim().toLowerCase();
      if (t === '' || t === 'none' || t === '∞' || t === 'inf') return { ok: true, value: Infinity };
      return ranged('RL', 'Ω', 100, 100e6)(text);
    },
    show: (v) => (Number.isFinite(v) ? compact(v) : 'none'),
  },
};
