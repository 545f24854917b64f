import { formatValue } from '../parts/formatValue';
import { checkNumber, LIMITS } from '../stage/checkInput';
import { solveLoop } from '../stage/operatingPoint';
import { finding, type Finding } from '../stage/ratingBands';
import { solveFollower } from '../stage/solveFollower';
import { followerTransfer } from '../signal/followerTransfer';
import { gridCurrent, GRID_CURRENT_ONSET } from '../tube/gridCurrent';
import { modelOf, type TubeLike } from '../tube/types';
import type { FollowerLink } from './chainTypes';
import { couplingImpedance } from './checkCoupling';
import { checkTriodeLink } from './checkTriodeLink';
import { stopperNote } from './stopperNote';
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
    // Its grid held at vgrid (the bench's follower and the chain's sit alike); where a capacitor-coupled grid's own current
    // through its leak would pull it visibly lower, a warning says by how much.
    const own = solveFollower({ tube: s.tube, bplus: s.bplus, vgrid, rk: s.rk, rl: env.load, heaterVolts: s.heaterVolts ?? 0 });
    if (!own.ok) return own;
    const leak = s.coupling.kind === 'capacitor' ? leakBiasFinding(s.tube, s.bplus, s.rk, vgrid, s.coupling.rg, own.op.vk) : null;
    const added = [leak, stopperNote(s.tube, s.rstopper, 0, own.gain)].filter((f) => f !== null);
    const solved = added.length ? { ...own, findings: [...own.findings, ...added] } : own;
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

/** A shift of the follower's cathode past this share of its DC is one the figures would show: warned (our own threshold). */
const LEAK_SHIFT_SHARE = 0.01;

/**
 * A capacitor-coupled follower's grid returned through its leak: its own
 * retarding-field current there pulls the grid (and the cathode with it)
 * below the voltage its divider gives (grid-leak bias, solved as a gain
 * stage's is). The follower's figures take the grid where the divider puts
 * it; past LEAK_SHIFT_SHARE of the cathode's DC this says how far off that is.
 */
function leakBiasFinding(tube: TubeLike, bplus: number, rk: number, vgrid: number, rg: number, vk: number): Finding | null {
  const model = modelOf(tube);
  const leaked = solveLoop(model, bplus, 0, rk, vgrid, rg);
  const shift = vk - leaked.vk;
  if (!(leaked.converged && shift > LEAK_SHIFT_SHARE * vk)) return null;
  const ig = gridCurrent(model, leaked.vgk);
  return finding(
    'grid-leak-bias',
    'warning',
    `Its grid draws ${formatValue(ig, 'A')} at rest (it sits ${Math.abs(leaked.vgk).toFixed(2)} V below its cathode, near the onset of grid current at about ${Math.abs(GRID_CURRENT_ONSET)} V), and through its ${formatValue(rg, 'Ω')} leak that holds the grid, and the cathode with it, about ${formatValue(shift, 'V')} below the ${formatValue(vgrid, 'V')} its divider gives, where the figures here take it. Raise Rk or lower the divider's voltage so the grid sits further below its cathode, or use a smaller leak.`,
    shift,
    LEAK_SHIFT_SHARE * vk,
  );
}
