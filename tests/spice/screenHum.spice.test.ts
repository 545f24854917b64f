import { describe, expect, it } from 'vitest';
import { findOutputTube, findTube, screenFeedPlan, solveChain, supplyHum, type ChainInput } from '../../src/index';
import { solveOutput } from '../../src/output/solveOutput';
import { screenConductance } from '../../src/output/screenFeed';
import { CATHODE_BYPASS_CORNER_HZ } from '../../src/output/outputParts';
import { designOf } from '../../src/chain/singleEndedKind';
import type { SingleEndedLink } from '../../src/chain/chainTypes';
import { expectClose } from '../helpers/expectClose';
import { nodes } from '../../src/netlist/chainNetlist';
import { ngspiceGate } from './ngspice';
import { rippleRun } from './rippleRun';

// Outside reference: ngspice (Debian's package) on the whole amplifier with its input at rest and a 100 Hz ripple of
// 1 V on the output stage's screens, on its B+, or on both, as the screens are fed. The designs are our own: a
// voltage stage into a pentode-connected single-ended output stage.
const run = ngspiceGate();


function pentodeChain(tube: 'EL34' | '6V6GT', bplus: number, screenVolts: number, zPrimary: number, rk: number): ChainInput {
  return {
    source: { rsource: 1e3 },
    stages: [
      { kind: 'common-cathode', tube: findTube('12AX7')!, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 1e-6, rg: 1e6 } },
      {
        kind: 'single-ended-output', tube: findOutputTube(tube)!, connection: 'pentode', bplus, screenVolts, ulTap: 0.4, zPrimary, rPrimary: 150,
        bias: 'cathode', rk, vg: -15, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 1e-6, rg: 470e3 },
      },
    ],
  };
}

const B_PLUS = nodes.supply(1).toUpperCase();
// The netlist winds the secondary so the speaker follows the primary's B+ end against its plate end; the model phases
// the speaker as the plate (its gain's convention). Through an output stage the two differ in sign only.
const PHASE = -1;

describe.runIf(run)('hum through a pentode output stage\'s screens, against ngspice', () => {
  it.each([
    ['6V6GT, screens at 250 V', pentodeChain('6V6GT', 300, 250, 5000, 270)],
    ['EL34, screens at 265 V', pentodeChain('EL34', 330, 265, 3000, 200)],
  ])('%s: the output per volt of ripple on the screens alone', (_, chain) => {
    const solved = solveChain(chain);
    if (!solved.ok) throw new Error(solved.message);
    const hum = supplyHum(chain, solved, 50);
    if (!hum.ok) throw new Error(hum.message);
    const sim = rippleRun(chain, (line) => (line.startsWith('VSCR1 ') ? `${line} AC 1` : line));
    expect(Math.abs(sim['vi(out)']!)).toBeLessThan(0.02 * Math.abs(sim['vr(out)']!));
    expectClose(hum.screenPerVolt[1]!, PHASE * sim['vr(out)']!, { rel: 0.02 }, 'screens\' hum per volt');
    // Common practice, checked here: a pentode's screen moves the plate current many times harder than its plate does.
    expect(Math.abs(hum.screenPerVolt[1]!)).toBeGreaterThan(5 * Math.abs(hum.perVolt[1]!));
    expect(hum.screenPerVolt[0]).toBeNull();
  });

  it('screens straight on B+: the plate\'s and the screens\' shares add, signed, to what the whole stage gives', () => {
    const chain = pentodeChain('EL34', 300, 300, 3000, 200);
    const solved = solveChain(chain);
    if (!solved.ok) throw new Error(solved.message);
    const hum = supplyHum(chain, solved, 50);
    if (!hum.ok) throw new Error(hum.message);
    expect(hum.screenShare[1]).toBe(1);
    const sim = rippleRun(chain, (line) => (line.startsWith('VSCR1 ') || line.startsWith(`${B_PLUS} `) ? `${line} AC 1` : line));
    expectClose(hum.perVolt[1]! + hum.screenPerVolt[1]!, PHASE * sim['vr(out)']!, { rel: 0.02 }, 'the whole stage\'s hum per volt');
  });

  it('screens behind their dropper and its bypass: the share of the B+ ripple on them, and the bound over the whole', () => {
    const chain = pentodeChain('6V6GT', 300, 250, 5000, 270);
    const stage = chain.stages[1] as SingleEndedLink;
    const solved = solveChain(chain);
    if (!solved.ok) throw new Error(solved.message);
    const hum = supplyHum(chain, solved, 50);
    if (!hum.ok) throw new Error(hum.message);
    // The network as the parts list builds it: the dropper by Ohm's law, its bypass for a 10 Hz corner against the
    // dropper beside the screens' own conductance (taken from the model's law; ngspice's tube has its own).
    const out = solveOutput(stage.tube, designOf(stage));
    if (!out.ok || out.op.feed.kind !== 'fixed') throw new Error('no pentode operating point');
    const plan = screenFeedPlan(stage.bplus, stage.screenVolts, out.op.ig2);
    if (plan.kind !== 'dropper') throw new Error(`expected a dropper, got ${plan.kind}`);
    const g = screenConductance(stage.tube, out.op.feed.vg2k, out.op.vpk, out.op.vgk);
    const c = 1 / (2 * Math.PI * CATHODE_BYPASS_CORNER_HZ * (plan.ohms / (1 + plan.ohms * g)));
    const dropper = (line: string) =>
      line.startsWith('VSCR1 ') ? `RSCR1 bp1 screen ${plan.ohms}\nCSCR1 screen 0 ${c}` : line.startsWith(`${B_PLUS} `) ? `${line} AC 1` : line.startsWith('print v(p0)') ? `${line} v(screen)` : line;
    const sim = rippleRun(chain, dropper, 'vm(screen) vr(out) vi(out)');
    // At DC the screens sit where they were designed (the dropper carries their current).
    expectClose(sim['v(screen)']!, stage.screenVolts, { rel: 0.01 }, 'screen DC');
    expectClose(hum.screenShare[1]!, sim['vm(screen)']!, { rel: 0.02 }, 'share of the B+ ripple on the screens');
    const whole = Math.hypot(sim['vr(out)']!, sim['vi(out)']!);
    const bound = Math.abs(hum.perVolt[1]!) + Math.abs(hum.screenPerVolt[1]! * hum.screenShare[1]!);
    expect(whole).toBeLessThanOrEqual(bound);
    // The bypass turns the screens' share near 90° from the plate's: the bound is not far over the whole (0.7: our threshold).
    expect(whole).toBeGreaterThan(0.7 * bound);
    // Behind a half-wave rectifier the ripple comes at the mains' own 50 Hz, where the bypass passes twice as much.
    const half = supplyHum(chain, solved, 50, true);
    if (!half.ok) throw new Error(half.message);
    const sim50 = rippleRun(chain, dropper, 'vm(screen) vr(out) vi(out)', 50);
    expectClose(half.screenShare[1]!, sim50['vm(screen)']!, { rel: 0.02 }, 'share at 50 Hz');
    expect(half.screenShare[1]! / hum.screenShare[1]!).toBeGreaterThan(1.8);
  });
});
