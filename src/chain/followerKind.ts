import { checkNumber, LIMITS } from '../stage/checkInput';
import { solveFollower } from '../stage/solveFollower';
import { followerTransfer } from '../signal/followerTransfer';
import { CUTOFF_FRACTION } from '../tube/koren';
import { modelOf, recordOf } from '../tube/types';
import type { FollowerLink } from './chainTypes';
import { couplingImpedance } from './checkCoupling';
import { checkTriodeLink } from './checkTriodeLink';
import { NO_CAPACITANCES } from './noCapacitances';
import type { StageKind } from './stageKind';

/**
 * The cathode follower in the chain: direct-coupled, its grid at the plate
 * before it; or capacitor-coupled, its grid held at `vbias` through the leak.
 */
export const followerKind: StageKind<FollowerLink> = {
  kind: 'follower',
  check: (s) => checkTriodeLink(s, () => checkNumber('rk', 'Rk', s.rk, 'Ω', LIMITS.minOhms, LIMITS.maxOhms)),
  inputImpedance: (s) => couplingImpedance(s.coupling),
  solve(s, env) {
    const vgrid = env.gridDc ?? s.vbias ?? 0;
    const solved = solveFollower({ tube: s.tube, bplus: s.bplus, vgrid, rk: s.rk, rl: env.load, heaterVolts: s.heaterVolts ?? 0 });
    if (!solved.ok) return solved;
    const { op } = solved;
    const t = followerTransfer(modelOf(s.tube), s.bplus, s.rk, env.load, op);
    return {
      ok: true,
      op: { va: op.va, vk: op.vk, ia: op.ia, vgk: op.vgk },
      supplyCurrent: op.ia,
      outputDc: op.vk,
      gain: solved.gain,
      zin: couplingImpedance(s.coupling),
      zout: solved.zout,
      sample: (vin, out) => {
        const x = t(vgrid + vin);
        out.vout = x.vk - op.vk;
        out.vgk = x.vgk;
        out.ia = x.ia;
      },
      cutoffCurrent: CUTOFF_FRACTION * op.ia,
      findings: solved.findings,
      linear: {
        gm: solved.gm,
        rp: solved.rp,
        plateLoad: 0,
        rk: s.rk,
        ck: null,
        cathodeGrounded: false,
        gScreen: 0,
        caps: recordOf(s.tube)?.capacitances ?? NO_CAPACITANCES,
        output: 'cathode',
        outputScale: 1,
      },
    };
  },
};
