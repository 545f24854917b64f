import { checkNumber, LIMITS } from '../stage/checkInput';
import { solveFollower } from '../stage/solveFollower';
import { followerTransfer } from '../signal/followerTransfer';
import { modelOf } from '../tube/types';
import type { FollowerLink } from './chainTypes';
import { couplingImpedance } from './checkCoupling';
import { checkTriodeLink } from './checkTriodeLink';
import { triodeLink } from './triodeLink';
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
    // Its grid held at vgrid: a capacitor-coupled follower's own grid current through its leak is not followed at DC (it
    // is in its signal's loop), so the bench's follower and the chain's sit alike.
    const solved = solveFollower({ tube: s.tube, bplus: s.bplus, vgrid, rk: s.rk, rl: env.load, heaterVolts: s.heaterVolts ?? 0 });
    if (!solved.ok) return solved;
    const { op } = solved;
    const grid = op.vgk + op.vk;
    const t = followerTransfer(modelOf(s.tube), s.bplus, s.rk, env.load, op);
    return triodeLink({
      tube: s.tube,
      coupling: s.coupling,
      solved,
      outputDc: op.vk,
      at: (vin) => {
        const x = t(grid + vin);
        return { vout: x.vk - op.vk, vgk: x.vgk, ia: x.ia };
      },
      network: { plateLoad: 0, rk: s.rk, ck: null, cathodeGrounded: false, output: 'cathode' },
    });
  },
};
