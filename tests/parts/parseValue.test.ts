import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatValue, parseValue } from '../../src/index';

describe('parseValue reads the trade notation', () => {
  it.each([
    ['33k', 33e3], ['3k3', 3.3e3], ['6K8', 6.8e3], ['2R2', 2.2], ['2M2', 2.2e6], ['68n', 68e-9], ['4u7', 4.7e-6],
    ['470p', 470e-12], ['0.22u', 0.22e-6], ['22µ', 22e-6], ['22μ', 22e-6], ['330 Ω', 330], ['330', 330], ['68nF', 68e-9],
    ['33kΩ', 33e3], ['1meg', 1e6], ['0R47', 0.47], ['R47', 0.47], ['-1.5', -1.5], ['250V', 250], [' 68k ', 68e3],
    ['1.5mA', 1.5e-3], ['10 ohms', 10], ['2.2uF', 2.2e-6],
  ])('%s → %d', (text, value) => {
    const r = parseValue(text);
    expect(r).toEqual({ ok: true, value });
  });

  it.each([
    ['', 'Enter a value, e.g. 33k or 3k3'],
    ['bad', '“bad” is not a part value: use digits with an optional multiplier (p n u m k M), e.g. 33k, 3k3 or 68n'],
    ['4.7k7', '“4.7k7” mixes a decimal point with an inner multiplier: write 4.7k or 4k7, not both'],
    ['k', '“k” has no digits before the multiplier: write e.g. 0.47 or 0R47'],
    ['4kk', '“4kk” is not a part value: use digits with an optional multiplier (p n u m k M), e.g. 33k, 3k3 or 68n'],
    ['1e3', '“1e3” is not a part value: use digits with an optional multiplier (p n u m k M), e.g. 33k, 3k3 or 68n'],
    ['x'.repeat(41), 'That entry is too long to be a part value'],
  ])('%j is refused: %s', (text, message) => {
    expect(parseValue(text)).toEqual({ ok: false, message });
  });

  it('round-trips what formatValue writes, to three significant figures', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-12, max: 9e9, noNaN: true }), fc.constantFrom('Ω', 'F', 'V', 'A', 'W', 'Hz'), (v, unit) => {
        const text = formatValue(v, unit);
        const back = parseValue(text);
        expect(back.ok, text).toBe(true);
        if (back.ok) expect(Math.abs(back.value - v) / v).toBeLessThan(5e-3);
      }),
      { numRuns: 3000 },
    );
  });

  it('never throws on any string', () => {
    fc.assert(fc.property(fc.string({ maxLength: 60 }), (s) => {
      const r = parseValue(s);
      expect(typeof r.ok).toBe('boolean');
      if (r.ok) expect(Number.isFinite(r.value)).toBe(true);
      else expect(r.message.length).toBeGreaterThan(5);
    }), { numRuns: 3000 });
  });
});

describe('formatValue', () => {
  it('writes sub-hertz frequencies as decimals, never as millihertz (which reads as megahertz at a glance)', () => {
    expect(formatValue(0.913, 'Hz')).toBe('0.913 Hz');
    expect(formatValue(0.5, 'Hz')).toBe('0.5 Hz');
    expect(formatValue(913, 'Hz')).toBe('913 Hz');
    expect(formatValue(0.913, 'V')).toBe('913 mV');
  });

  it.each([
    [4700, 'Ω', '4.7 kΩ'], [1e-7, 'F', '100 nF'], [999.7, 'V', '1 kV'], [0.0012, 'A', '1.2 mA'], [2.2e-6, 'F', '2.2 µF'],
    [0, 'V', '0 V'], [Infinity, 'Ω', '∞ Ω'], [Number.NaN, 'V', '—'], [-8.5, 'V', '−8.5 V'], [68e3, 'Ω', '68 kΩ'], [1.5e6, 'Ω', '1.5 MΩ'],
  ])('%d %s → %s', (v, unit, text) => {
    expect(formatValue(v, unit)).toBe(text);
  });
});
