import { describe, it } from 'vitest';
import { solveSupply } from '../../src/index';
import type { SupplyDesign } from '../../src/supply/supplyTypes';
import { expectClose } from '../helpers/expectClose';
import { ngspiceGate, runNgspiceFull } from './ngspice';
import { supplyNetlist } from './supplyNetlist';

// Outside reference: ngspice's transient run of the same supply (its own diode
// model with the same constants; the tube as a Child–Langmuir source) to a
// steady state from capacitors started 10 % off. Asked: DC within 0.5 % at
// every node, ripple peak to peak within 5 % where it is over 10 mV, the
// rectifier's peak current within 5 %.
const run = ngspiceGate();

// Our own supplies.
const supplies: { label: string; d: SupplyDesign; seconds: number }[] = [
  {
    label: 'silicon full wave, 47 µF reservoir, two R–C sections',
    d: { mainsHz: 50, secondaryRms: 250, windingOhms: 40, rectifier: { kind: 'silicon-full-wave' }, input: { kind: 'capacitor', c: 47e-6 }, sections: [{ kind: 'rc', r: 1000, c: 47e-6 }, { kind: 'rc', r: 10e3, c: 22e-6 }], loads: [0.07, 0.005, 0.002] },
    seconds: 2,
  },
  {
    label: 'silicon bridge at 60 Hz, 100 µF, one L–C section',
    d: { mainsHz: 60, secondaryRms: 300, windingOhms: 25, rectifier: { kind: 'silicon-bridge' }, input: { kind: 'capacitor', c: 100e-6 }, sections: [{ kind: 'lc', l: 5, rdc: 120, c: 100e-6 }], loads: [0.02, 0.1] },
    seconds: 2,
  },
  {
    label: '5AR4 rectifier, 33 µF reservoir, one R–C section',
    d: { mainsHz: 50, secondaryRms: 330, windingOhms: 60, rectifier: { kind: 'tube', tubeId: '5AR4' }, input: { kind: 'capacitor', c: 33e-6 }, sections: [{ kind: 'rc', r: 2200, c: 47e-6 }], loads: [0.12, 0.01] },
    seconds: 1.5,
  },
  {
    label: 'silicon half wave, 220 µF reservoir, one R–C section (a small single-ended amplifier\'s)',
    d: { mainsHz: 50, secondaryRms: 230, windingOhms: 60, rectifier: { kind: 'silicon-half-wave' }, input: { kind: 'capacitor', c: 220e-6 }, sections: [{ kind: 'rc', r: 2200, c: 100e-6 }], loads: [0.045, 0.004] },
    seconds: 2,
  },
  {
    label: 'silicon half wave at 60 Hz from a 50 V bias tap: 47 µF, 10 kΩ into 47 µF, 2 mA (a fixed-bias rail\'s size)',
    d: { mainsHz: 60, secondaryRms: 50, windingOhms: 150, rectifier: { kind: 'silicon-half-wave' }, input: { kind: 'capacitor', c: 47e-6 }, sections: [{ kind: 'rc', r: 10e3, c: 47e-6 }], loads: [0, 0.002] },
    seconds: 3,
  },
  {
    // The reservoir sits far below the peak: shooting starts from reservoirGuess's estimate of it.
    label: 'silicon half wave from a 60 V winding behind 4.7 kΩ: 47 µF, 4.7 kΩ into 47 µF, 2 mA (a bias tap through a dropping resistor)',
    d: { mainsHz: 50, secondaryRms: 60, windingOhms: 4700, rectifier: { kind: 'silicon-half-wave' }, input: { kind: 'capacitor', c: 47e-6 }, sections: [{ kind: 'rc', r: 4700, c: 47e-6 }], loads: [0, 0.002] },
    // ngspice's own start, 10 % off, takes longer to settle behind the winding's 4.7 kΩ (at 3 s it is still 1 % short).
    seconds: 8,
  },
  {
    label: 'choke input (10 H, 150 Ω) into 47 µF, one R–C section',
    d: { mainsHz: 50, secondaryRms: 250, windingOhms: 40, rectifier: { kind: 'silicon-full-wave' }, input: { kind: 'choke', l: 10, rdc: 150, c: 47e-6 }, sections: [{ kind: 'rc', r: 4700, c: 22e-6 }], loads: [0.08, 0.004] },
    seconds: 3,
  },
];

/** ngspice's `meas` lines: "avg0 = 3.30e+02 from= … to= …". */
function measured(output: string): Record<string, number> {
  const out: Record<string, number> = {};
  for (const m of output.matchAll(/^(avg\d+|pp\d+|ipk|ineg)\s*=\s*([-+]?\d[\d.]*(?:e[-+]?\d+)?)/gim)) out[m[1]!.toLowerCase()] = Number(m[2]);
  return out;
}

describe.runIf(run)('supplies agree with an ngspice transient', () => {
  // Both ways to the steady state: shooting (the one used) and marching in time (the fallback when shooting does not converge).
  it.each(supplies.map((s) => [s.label, s] as const))('%s', (_label, s) => {
    const shot = solveSupply(s.d);
    const marched = solveSupply(s.d, { steady: 'marching' });
    if (!shot.ok) throw new Error(shot.message);
    if (!marched.ok) throw new Error(marched.message);
    const sim = measured(runNgspiceFull(supplyNetlist(s.d, shot.nodes.map((n) => n.dc), s.seconds)).output);
    for (const [how, ours] of [['shooting', shot], ['marching', marched]] as const) {
      ours.nodes.forEach((node, k) => {
        expectClose(node.dc, sim[`avg${k}`]!, { rel: 0.005 }, `${how}: node ${k} DC`);
        if (node.ripplePp > 0.01) expectClose(node.ripplePp, sim[`pp${k}`]!, { rel: 0.05 }, `${how}: node ${k} ripple`);
      });
      expectClose(ours.rectifierPeak, Math.max(sim.ipk!, -(sim.ineg ?? 0)), { rel: 0.05 }, `${how}: rectifier peak current`);
    }
  }, 120_000);
});
