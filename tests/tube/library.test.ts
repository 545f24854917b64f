import { describe, expect, it } from 'vitest';
import { curveErrors, figureErrors, summarizeErrors } from '../../src/fit/fitToTypicalPoints';
import { smallSignalAt } from '../../src/tube/triode';
import { findTube, tubeLibrary } from '../../src/tube/library';
import { relErr } from '../helpers/expectClose';

describe('tube library', () => {
  it('holds at least 16 triode types builders use, each id once', () => {
    const ids = tubeLibrary.map((t) => t.id);
    expect(ids.length).toBeGreaterThanOrEqual(16);
    expect(new Set(ids).size).toBe(ids.length);
    for (const id of ['12AX7', '12AT7', '12AU7', '12AY7', '12BH7', '6SN7', '6SL7', '6CG7', '6DJ8', '6922', '5687', '6N1P', '300B', '2A3', '45', 'EL84-T', 'EL34-T', '6V6-T']) {
      expect(findTube(id)?.id, id).toBe(id);
    }
    expect(findTube(' 12ax7 ')?.id).toBe('12AX7');
    expect(findTube('nope')).toBeUndefined();
  });

  describe.each(tubeLibrary.map((t) => [t.id, t] as const))('%s', (_id, tube) => {
    it('has complete records: ratings, heater, capacitances, typical points, each with a source', () => {
      expect(tube.description.length).toBeGreaterThan(10);
      expect(tube.ratings.maxPlateVoltage).toBeGreaterThan(0);
      expect(tube.ratings.maxPlateDissipation).toBeGreaterThan(0);
      expect(tube.ratings.source.length).toBeGreaterThan(3);
      if (tube.directlyHeated) expect(tube.ratings.maxHeaterCathodeVoltage).toBeNull();
      else expect(tube.ratings.maxHeaterCathodeVoltage).toBeGreaterThan(0);
      expect(tube.heaters.length).toBeGreaterThan(0);
      for (const h of tube.heaters) expect(h.volts * h.amps).toBeGreaterThan(0);
      const { cgk, cgp, cpk } = tube.capacitances;
      for (const c of [cgk, cgp, cpk]) expect(c > 0 && c < 1e-10).toBe(true);
      expect(tube.typical.length).toBeGreaterThan(0);
      for (const p of tube.typical) expect(p.source.length).toBeGreaterThan(3);
    });

    it('keeps its Koren parameters physical (ex 1.2 to 1.6)', () => {
      const { ex, mu, kg1, kp, kvb } = tube.model.params;
      expect(ex).toBeGreaterThanOrEqual(1.2);
      expect(ex).toBeLessThanOrEqual(1.6);
      for (const v of [mu, kg1, kp, kvb]) expect(v).toBeGreaterThan(0);
    });

    it('records the fit residuals its parameters really have', () => {
      const { rmsPercent } = summarizeErrors(figureErrors(tube.model.params, tube.typical));
      expect(Math.abs(rmsPercent - tube.fit.rmsPercent)).toBeLessThan(0.06);
    });

    // Handbook check: the source of each figure is the typical point's own `source` (data sheet, or "from memory").
    it.each(tube.typical.map((p) => [`${p.va} V / ${p.vg} V (${p.source})`, p] as const))(
      'reproduces the datasheet point %s: Ia within 15 %, mu, rp, gm within 20 %',
      (_label, p) => {
        const s = smallSignalAt(tube, p.va, p.vg);
        expect(Math.abs(relErr(s.ia, p.ia)), `Ia ${s.ia} vs ${p.ia}`).toBeLessThanOrEqual(15);
        if (p.mu !== undefined) expect(Math.abs(relErr(s.mu, p.mu)), `mu ${s.mu} vs ${p.mu}`).toBeLessThanOrEqual(20);
        if (p.rp !== undefined) expect(Math.abs(relErr(s.rp, p.rp)), `rp ${s.rp} vs ${p.rp}`).toBeLessThanOrEqual(20);
        if (p.gm !== undefined) expect(Math.abs(relErr(s.gm, p.gm)), `gm ${s.gm} vs ${p.gm}`).toBeLessThanOrEqual(20);
      },
    );
  });

  it.each(tubeLibrary.filter((t) => t.curves).map((t) => [t.id, t] as const))('%s records the residuals its parameters really have over the points read from its plate curves', (_id, tube) => {
    const { rmsPercent } = summarizeErrors(curveErrors(tube.model.params, tube.curves!.points));
    expect(Math.abs(rmsPercent - tube.fit.curveRmsPercent!)).toBeLessThan(0.06);
  });

  it('12AX7 figures against the Tung-Sol sheet (1947), checked by name', () => {
    // Tung-Sol 12AX7 Tentative Data p.1 (P): 250 V, -2 V → 1.2 mA, mu 100, rp 62 500 Ω, gm 1 600 µmho.
    const s = smallSignalAt(findTube('12AX7')!, 250, -2);
    expect(Math.abs(relErr(s.ia, 1.2e-3))).toBeLessThan(15);
    expect(Math.abs(relErr(s.mu, 100))).toBeLessThan(20);
    expect(Math.abs(relErr(s.rp, 62500))).toBeLessThan(20);
    expect(Math.abs(relErr(s.gm, 1.6e-3))).toBeLessThan(20);
  });

  it('300B figures against the Western Electric sheet, checked by name', () => {
    // Western Electric 300B technical data (P): 300 V, -61 V → 60 mA, mu 3.85, rp 700 Ω, gm 5 500 µmho.
    const s = smallSignalAt(findTube('300B')!, 300, -61);
    expect(Math.abs(relErr(s.ia, 60e-3))).toBeLessThan(15);
    expect(Math.abs(relErr(s.mu, 3.85))).toBeLessThan(20);
    expect(Math.abs(relErr(s.rp, 700))).toBeLessThan(20);
    expect(Math.abs(relErr(s.gm, 5.5e-3))).toBeLessThan(20);
  });
});
