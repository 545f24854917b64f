import { describe, expect, it } from 'vitest';
import { degrees, rmsLevel, voltsRms } from '../../app/format';
import { sineLevel } from '../../src/index';

const levelOf = (rms: number) => sineLevel(rms * Math.SQRT2);

describe('a sine level as the bench reads it', () => {
  // dBu is referred to 0.7746 V rms (1 mW into 600 Ω) and dBV to 1 V rms (IEC 60268-3's reference levels).
  it('reads volts at line level and keeps the dB figure', () => {
    expect(rmsLevel(levelOf(0.7746), 'dBu')).toBe('0.775 V rms (+0.0 dBu)');
    expect(rmsLevel(levelOf(0.0499), 'dBu')).toBe('0.0499 V rms (−23.8 dBu)');
  });

  it('reads millivolts and microvolts for the tiny inputs of a long chain, never an exponent', () => {
    expect(rmsLevel(levelOf(2.57e-3), 'dBV')).toBe('2.57 mV rms (−51.8 dBV)');
    expect(rmsLevel(levelOf(2.57e-6), 'dBu')).toBe('2.57 µV rms (−109.6 dBu)');
    expect(rmsLevel(levelOf(7.29e-7), 'dBu')).toBe('0.729 µV rms (−120.5 dBu)');
    expect(voltsRms(4.2e-4)).toBe('0.42 mV rms');
    expect(voltsRms(8.22)).toBe('8.22 V rms');
  });
});

describe('an angle as the bench reads it', () => {
  it("reads a tenth of a degree with a true minus, and a balanced splitter's rounding residue as 0.0°, never an exponent", () => {
    expect(degrees(-2.8e-14)).toBe('0.0°');
    expect(degrees(-0.04)).toBe('0.0°');
    expect(degrees(-3.26)).toBe('−3.3°');
    expect(degrees(52.04)).toBe('52.0°');
  });
});
