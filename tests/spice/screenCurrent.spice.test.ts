import { describe, expect, it } from 'vitest';
import { analyzePushPull, findOutputTube, solveOutput, type OutputDesign, type PushPullDesign } from '../../src/index';
import { averageScreenCurrent } from '../../src/output/outputSignal';
import { pairScreensAtFull } from '../../src/pushpull/pushPullParts';
import { expectClose } from '../helpers/expectClose';
import { ngspiceGate, runNgspiceFull } from './ngspice';
import { outputNetlist } from './outputNetlist';
import { pushPullNetlist } from './pushPullNetlist';

// Outside reference: ngspice on the whole stage (the netlists of output.spice.test.ts and pushPull.spice.test.ts), its
// screen supply's current averaged over the last cycle with the grid driven to 0 V: what a screen dropper drops at
// full power. Asked within 1 %; and it must have risen above idle (by a tenth at least), or the check would say little.
// A single-ended stage's drive is held for 300 ms, so its primary's magnetising current has settled (output.spice.test.ts).
const run = ngspiceGate();

// Our own designs, pentode-connected with the screens on a supply of their own.
const single: OutputDesign[] = [
  { tubeId: '6L6GC', connection: 'pentode', bplus: 300, screenVolts: 270, ulTap: 0.4, zPrimary: 3500, rPrimary: 150, bias: 'fixed', rk: 220, vg: -16, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 },
  { tubeId: 'EL34', connection: 'pentode', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130, bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 },
];
const pair: PushPullDesign = { tubeId: '6L6GC', connection: 'pentode', bplus: 450, screenVolts: 400, ulTap: 0.43, raa: 5600, rPrimary: 200, bias: 'fixed', rk: 0, vg: -37, rg: 100e3, speakerOhms: 8, thdLimit: 0.05 };

describe.runIf(run)('the screens\' average current at full drive agrees with ngspice', () => {
  it.each(single.map((d) => [`${d.tubeId} single-ended, ${d.bias} bias`, d] as const))('%s', (_label, d) => {
    const s = solveOutput(findOutputTube(d.tubeId)!, d);
    if (!s.ok) throw new Error(s.message);
    const ours = averageScreenCurrent(s, -s.op.vgk, 128);
    expect(ours).toBeGreaterThan(1.1 * s.op.ig2);
    const sim = runNgspiceFull(outputNetlist(s.tube, d, -s.op.vgk, true, { ck: 10, ms: 300, lp: 20 }));
    expectClose(ours, -sim.values['isavg']!, { rel: 0.01 }, 'average screen current');
  }, 60_000);

  it('a 6L6GC pair, fixed bias, both screens on one supply', () => {
    const a = analyzePushPull(findOutputTube('6L6GC')!, pair);
    if (!a.ok) throw new Error(a.message);
    const ours = pairScreensAtFull(a)!;
    expect(ours).toBeGreaterThan(1.5 * (a.solution.idle[0].ig2 + a.solution.idle[1].ig2));
    const sim = runNgspiceFull(pushPullNetlist(a.solution.tube, pair, a.full.drive));
    expectClose(ours, -sim.values['isavg']!, { rel: 0.01 }, 'both screens\' average current');
  }, 120_000);
});
