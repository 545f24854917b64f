import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { findTube, solveChain, solveStage, type ChainInput } from '../../src/index';
import { trackLoad, wiperImpedance } from '../../src/stage/volumeControl';
import { expectClose } from '../helpers/expectClose';

const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;
const stage = { tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, rl: 470e3, rg: 250e3, rsource: 1e3, cin: 100e-9 };

describe('a gain stage\'s volume control', () => {
  // Thévenin's theorem on the divider: the wiper of a track R at share a, its top driven from Rb, sees
  // aR ∥ ((1 − a)R + Rb); at most R/4, at a = ½, with Rb = 0.
  it('drives its grid through the track below the wiper against the track above and its source (Thévenin)', () => {
    expect(wiperImpedance(100e3, 0.5, 0)).toBeCloseTo(25e3, 6);
    expect(wiperImpedance(100e3, 1, 10e3)).toBeCloseTo((100e3 * 10e3) / 110e3, 6);
    expect(wiperImpedance(100e3, 0.25, 0)).toBeCloseTo((25e3 * 75e3) / 100e3, 6);
    // What the source sees at the top: the track above in series with the track below ∥ the grid (Ohm's law).
    expect(trackLoad(100e3, 0.5, Infinity)).toBe(100e3);
    expect(trackLoad(100e3, 0.5, 50e3)).toBeCloseTo(50e3 + 25e3, 6);
  });

  // First-order RC low-pass, f = 1/(2πRC) (Horowitz and Hill, The Art of Electronics, 3rd ed., §1.7), R the wiper's worst
  // R/4 and C the grid's Miller capacitance.
  it('names the top of the band at its worst setting: a warning when that falls inside the audio band, a note above it', () => {
    const big = solveStage({ ...stage, rg: 1e6, volume: 0.5 });
    if (!big.ok) throw new Error(big.message);
    const warning = big.findings.find((f) => f.kind === 'volume-control')!;
    expect(warning.severity).toBe('warning');
    expectClose(warning.value, 1 / (2 * Math.PI * 250e3 * big.cin), { rel: 1e-12 }, 'corner with a 1M pot');
    expect(warning.message).toMatch(/^Volume control 1 MΩ: at half its track \(−6 dB\) the wiper drives the grid through 250 kΩ; with the grid's [\d.]+ pF \(Miller effect\) its corner is [\d.]+ kHz, inside the audio band/);
    const small = solveStage({ ...stage, rg: 10e3, volume: 0.5 });
    if (!small.ok) throw new Error(small.message);
    expect(small.findings.find((f) => f.kind === 'volume-control')!.severity).toBe('note');
    const none = solveStage(stage);
    if (!none.ok) throw new Error(none.message);
    expect(none.findings.some((f) => f.kind === 'volume-control')).toBe(false);
  });

  it('is refused beside its box out of range, and where there is no leak to make a pot of', () => {
    for (const volume of [0, -0.5, 1.5, Number.NaN]) {
      const r = solveStage({ ...stage, volume });
      expect(r.ok === false && r.field === 'volume', `volume ${volume}`).toBe(true);
    }
    const { rg: _rg, ...leakless } = stage;
    const r = solveStage({ ...leakless, volume: 0.5 });
    expect(r.ok === false && r.field === 'volume' && /takes the place of the grid leak/.test(r.message)).toBe(true);
    const direct = solveChain({ source: { rsource: 0 }, stages: [{ kind: 'common-cathode', tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, volume: 0.5, coupling: { kind: 'direct' } }] });
    expect(direct.ok === false && direct.field === 'stages.0.volume').toBe(true);
  });

  const amplifier = (volume?: number): ChainInput => ({
    source: { rsource: 2.2e3 },
    stages: [
      { kind: 'common-cathode', tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, ck: 47e-6, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
      { kind: 'common-cathode', tube: au7, bplus: 300, ra: 22e3, rk: 1000, bypassed: true, ck: 100e-6, ...(volume === undefined ? {} : { volume }), coupling: { kind: 'capacitor', cc: 220e-9, rg: 250e3 } },
    ],
    load: { rl: 100e3 },
  });

  it('at full is the fixed leak it replaces; turned down, the gain follows it, and the top of the band moves against the wiper\'s impedance (property)', () => {
    const bare = solveChain(amplifier());
    const full = solveChain(amplifier(1));
    if (!bare.ok || !full.ok) throw new Error('both solve');
    expectClose(full.gain, bare.gain, { rel: 1e-12 }, 'gain at full');
    expectClose(full.highHz!, bare.highHz!, { rel: 1e-9 }, 'top at full');
    fc.assert(
      fc.property(fc.double({ min: 0.02, max: 0.98, noNaN: true }), (a) => {
        const r = solveChain(amplifier(a));
        if (!r.ok) return false;
        // The wiper passes its share; the grid's own input barely loads it (within 2 %). The operating points stay.
        expect(Math.abs(r.gain / bare.gain / a - 1)).toBeLessThan(0.02);
        // The grid's Miller capacitance is fed through the wiper: where it drives the grid through half as much again as
        // the stage before's output impedance and the leak did at full, the top falls; through two thirds or less (turned
        // well down, the track below the wiper shunts it), the top rises. (Nearer, the band's other poles decide: at 0.2
        // of the track, 28 % more impedance, the top stays where it was, as ngspice also finds.)
        const zout = bare.stages[0]!.zout;
        const drive = wiperImpedance(250e3, a, zout);
        const atFull = wiperImpedance(250e3, 1, zout);
        if (drive > 1.5 * atFull) expect(r.highHz!).toBeLessThan(bare.highHz!);
        if (drive < atFull / 1.5) expect(r.highHz!).toBeGreaterThan(bare.highHz!);
        expectClose(r.stages[1]!.op.ia, bare.stages[1]!.op.ia, { rel: 0.01 }, 'stage 2 current');
        return true;
      }),
      { numRuns: 200 },
    );
  });
});
