import { bracketedRoot } from '../numeric/bracketedRoot';
import type { Failure } from '../result';
import { checkNumber, LIMITS } from '../stage/checkInput';
import { parallel } from '../stage/parallel';
import { bothTriodesFindings, solveLongTailedPair, tubeCurrent } from '../splitter/longTailedPair';
import { CUTOFF_FRACTION, korenPlateCurrent } from '../tube/koren';
import { modelOf, recordOf } from '../tube/types';
import type { LongTailedPairLink } from './chainTypes';
import { couplingImpedance } from './checkCoupling';
import { checkTriodeLink } from './checkTriodeLink';
import { stopperNote } from './stopperNote';
import { NO_CAPACITANCES } from './noCapacitances';
import type { LinkSample, StageKind } from './stageKind';

const fieldOf = (f: Failure): Failure => (f.field === 'grid.volts' ? { ...f, field: 'vbias' } : f.field === 'tail.rt' ? { ...f, field: 'rtail' } : f.field === 'ra1' ? { ...f, field: 'ra' } : f);

/**
 * The long-tailed pair in the chain: the signal on the first grid, the
 * second at signal ground, both cathodes over Rk and the tail. At each
 * instant the tail's current S sets the cathodes (S·(Rk + Rt)), each tube
 * answers along its own plate load (Ra in parallel with the next grid's
 * leak), and one S agrees: a bracketed root per instant. The first plate
 * carries the chain's signal (inverted); the second, in phase, the other.
 */
export const longTailedPairKind: StageKind<LongTailedPairLink> = {
  kind: 'long-tailed-pair',
  check: (s) =>
    checkTriodeLink(s, () =>
      checkNumber('ra', 'Ra', s.ra, 'Ω', LIMITS.minOhms, LIMITS.maxOhms) ??
      (s.ra2 === undefined ? null : checkNumber('ra2', 'Ra (second plate)', s.ra2, 'Ω', LIMITS.minOhms, LIMITS.maxOhms)) ??
      checkNumber('rk', 'Rk', s.rk, 'Ω', 0, LIMITS.maxOhms) ??
      checkNumber('rtail', 'Tail resistor', s.rtail, 'Ω', LIMITS.minOhms, LIMITS.maxOhms),
    ),
  inputImpedance: (s) => couplingImpedance(s.coupling),
  solve(s, env) {
    const vg = env.gridDc ?? s.vbias ?? 0;
    const ra2 = s.ra2 ?? s.ra;
    const r = solveLongTailedPair({ tube: s.tube, bplus: s.bplus, ra1: s.ra, ra2, rk: s.rk, tail: { kind: 'resistor', rt: s.rtail }, grid: { kind: 'fixed', volts: vg }, rl: env.load, heaterVolts: s.heaterVolts ?? 0 });
    if (!r.ok) return fieldOf(r);
    const [o1, o2] = r.ops;
    const p = modelOf(s.tube).params;
    const r1 = parallel(s.ra, env.load);
    const r2 = parallel(ra2, env.load);
    const tail = s.rk + s.rtail;
    const sum0 = o1.ia + o2.ia;
    let i1 = o1.ia;
    let i2 = o2.ia;
    // The sure way: the tail's current by a bracketed root, each tube's along its load by another (nested, so slow).
    const bracketed = (vin: number) => {
      const excess = (sum: number) => {
        const vk = sum * tail;
        i1 = tubeCurrent(p, o1.va, o1.ia, r1, vk, vg + vin - vk);
        i2 = tubeCurrent(p, o2.va, o2.ia, r2, vk, vg - vk);
        return i1 + i2 - sum;
      };
      const top = Math.max(s.bplus / tail, 2 * sum0);
      excess(bracketedRoot(excess, 0, top, 1e-12 * (1 + top)).x);
    };
    // The quick way: Newton's method on both currents at once from the idle point, each tube's slopes (1/rp, gm)
    // taken by central differences; it converges in a few steps over the clean swing, else the sure way answers.
    const newton = (vin: number): boolean => {
      let a = o1.ia;
      let b = o2.ia;
      const h = 1e-4;
      for (let k = 0; k < 30; k++) {
        const vk = (a + b) * tail;
        const va1 = o1.va - (a - o1.ia) * r1 - vk;
        const va2 = o2.va - (b - o2.ia) * r2 - vk;
        const g1 = vg + vin - vk;
        const g2 = vg - vk;
        const k1 = korenPlateCurrent(p, va1, g1);
        const k2 = korenPlateCurrent(p, va2, g2);
        const f1 = a - k1;
        const f2 = b - k2;
        if (Math.abs(f1) < 1e-12 && Math.abs(f2) < 1e-12) {
          i1 = a;
          i2 = b;
          return true;
        }
        const gp1 = (korenPlateCurrent(p, va1 + h, g1) - korenPlateCurrent(p, va1 - h, g1)) / (2 * h);
        const gm1 = (korenPlateCurrent(p, va1, g1 + h) - korenPlateCurrent(p, va1, g1 - h)) / (2 * h);
        const gp2 = (korenPlateCurrent(p, va2 + h, g2) - korenPlateCurrent(p, va2 - h, g2)) / (2 * h);
        const gm2 = (korenPlateCurrent(p, va2, g2 + h) - korenPlateCurrent(p, va2, g2 - h)) / (2 * h);
        // d(f)/d(a, b): each current moves its own plate (r) and both move the cathodes (tail).
        const j11 = 1 + gp1 * (r1 + tail) + gm1 * tail;
        const j12 = (gp1 + gm1) * tail;
        const j21 = (gp2 + gm2) * tail;
        const j22 = 1 + gp2 * (r2 + tail) + gm2 * tail;
        const det = j11 * j22 - j12 * j21;
        if (!(Math.abs(det) > 0)) return false;
        a = Math.max(0, a - (f1 * j22 - f2 * j12) / det);
        b = Math.max(0, b - (j11 * f2 - j21 * f1) / det);
        if (!Number.isFinite(a) || !Number.isFinite(b)) return false;
      }
      return false;
    };
    const sample = (vin: number, out: LinkSample) => {
      if (!newton(vin)) bracketed(vin);
      const vk = (i1 + i2) * tail;
      out.vout = -(i1 - o1.ia) * r1;
      out.vout2 = -(i2 - o2.ia) * r2;
      out.vgk = Math.max(vg + vin - vk, vg - vk);
      out.ia = Math.min(i1, i2);
    };
    return {
      ok: true,
      op: { va: o1.va, vk: o1.vk, ia: o1.ia, vgk: o1.vgk },
      pins: { plate2: o2.va, plate2Current: o2.ia },
      supplyCurrent: sum0,
      outputDc: o1.va,
      gain: r.gain1,
      zin: couplingImpedance(s.coupling),
      zout: r.zout[0],
      antiphase: r.gain2 / r.gain1,
      sample,
      cutoffCurrent: CUTOFF_FRACTION * Math.min(o1.ia, o2.ia),
      // One envelope: each triode's own findings named by it, the shared ones once.
      findings: [...bothTriodesFindings(r.findings), ...[stopperNote(s.tube, s.rstopper, r.gain1, r.gainCathode)].filter((f) => f !== null)],
      // The first triode, the tail at its cathode, and the second triode (its grid at signal ground) on the same cathode, its
      // plate the second output; each plate's next grid loads it through its own coupling in the network.
      linear: {
        gm: r.gm[0], rp: r.rp[0], plateLoad: s.ra, rk: tail, ck: null, cathodeGrounded: false, gScreen: 0, caps: recordOf(s.tube)?.capacitances ?? NO_CAPACITANCES, output: 'plate', outputScale: 1,
        output2: 'second', second: { gm: r.gm[1], rp: r.rp[1], plateLoad: ra2 },
      },
    };
  },
};
