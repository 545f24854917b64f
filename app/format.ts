import { formatValue, type Level } from '../src/index';

/**
 * Display formatting only: SI values from the model into the units a bench
 * reads (mA, kΩ, µmho as mA/V). No physics here.
 */
export const volts = (v: number) => formatValue(v, 'V');
export const ohms = (v: number) => formatValue(v, 'Ω');
export const farads = (v: number) => formatValue(v, 'F');
/** Dissipation is read in watts at the bench, even below 1 W. */
export const watts = (v: number) => `${Number(v.toPrecision(3))} W`;
/** Plate currents read in mA on the bench, whatever their size. */
export const milliamps = (a: number) => `${Number((a * 1e3).toPrecision(3))} mA`;
/** Transconductance in mA/V (= millisiemens), as curve sheets print it. */
export const mAPerV = (s: number) => `${Number((s * 1e3).toPrecision(3))} mA/V`;
export const plain = (x: number, digits = 3) => String(Number(x.toPrecision(digits))).replace('-', '−');
/** An angle in degrees to a tenth, with a true minus sign; what rounds to zero reads 0.0° (not −0.0°, nor a rounding residue such as 2.8e-14°). */
export const degrees = (x: number) => `${(Math.abs(x) < 0.05 ? 0 : x).toFixed(1).replace('-', '−')}°`;
/** A DC voltage as a meter reads it: a grid a few millivolts off ground reads 0 V. */
export const meterVolts = (v: number) => (Math.abs(v) < 0.005 ? '0 V' : volts(v));
/** Gain as a voltage ratio in decibels (20·log10). */
export const decibels = (ratio: number) => dB(20 * Math.log10(Math.abs(ratio)));
/** A level in dB to a tenth, negative with a true minus sign (as every other figure here). */
export const dB = (x: number) => `${x.toFixed(1).replace('-', '−')} dB`;
/** A small voltage (ripple, hum) in the unit that reads: V, mV or µV, to three figures. */
export const smallVolts = (v: number) => (v >= 1 ? `${plain(v)} V` : v >= 1e-3 ? `${plain(v * 1e3)} mV` : `${plain(v * 1e6)} µV`);
/** A current that can be tiny (a filter capacitor's ripple current): mA down to 1 mA, then µA, then nA, to three figures. */
export const smallAmps = (a: number) => (a >= 1e-3 || a === 0 ? milliamps(a) : a >= 1e-6 ? `${plain(a * 1e6)} µA` : `${plain(a * 1e9)} nA`);
/** A frequency as the bench reads it: Hz, kHz or MHz, to three figures. */
export const hertz = (f: number) => (f >= 1e6 ? `${plain(f / 1e6)} MHz` : f >= 1000 ? `${plain(f / 1000)} kHz` : `${plain(f)} Hz`);
/** An inductance: H, mH or µH. */
export const henries = (v: number) => formatValue(v, 'H');
/** A fraction shown in percent, to three figures. */
export const percentOf = (x: number) => `${Number((x * 100).toPrecision(3))} %`;
/** A signed level in dB to one decimal, with a true minus sign. */
export const signedDb = (x: number) => `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(1)}`;
/** An rms voltage in volts down to 10 mV (line and speaker levels read so), then mV, then µV: a long chain's input never reads as an exponent. */
const rmsVolts = (v: number) => (v >= 0.01 ? `${plain(v)} V` : v >= 1e-5 ? `${plain(v * 1e3)} mV` : `${plain(v * 1e6)} µV`);
/** An rms voltage alone, "1.23 V rms", "2.57 mV rms". */
export const voltsRms = (v: number) => `${rmsVolts(v)} rms`;
/** A sine level as the bench reads it, "1.23 V rms (+4.0 dBu)"; a level of nothing reads "none". */
export const rmsLevel = (l: Level, ref: 'dBu' | 'dBV') => {
  const db = ref === 'dBu' ? l.dBu : l.dBV;
  return db === null ? 'none' : `${rmsVolts(l.rms)} rms (${signedDb(db)} ${ref})`;
};
