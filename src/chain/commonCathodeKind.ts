import { fail } from '../result';
import { checkNumber, LIMITS } from '../stage/checkInput';
import { solveStage } from '../stage/solveStage';
import { volumeProblem } from '../stage/volumeControl';
import { normalizeStage, type StageDesign } from '../stage/stageDesign';
import { stageTransfer } from '../signal/stageTransfer';
import type { CommonCathodeLink } from './chainTypes';
import { couplingImpedance } from './checkCoupling';
import { checkTriodeLink } from './checkTriodeLink';
import { triodeLink } from './triodeLink';
import type { StageKind } from './stageKind';

/**
 * The common-cathode stage in the chain: today's solver and large-signal
 * transfer, with the next grid's leak as its load. Its grid stopper and
 * volume control are the chain's to follow (stopperOf, volumeOf): they sit
 * between the stage before and this grid, in the grid's drive and in the
 * network.
 */
export const commonCathodeKind: StageKind<CommonCathodeLink> = {
  kind: 'common-cathode',
  check: (s) =>
    checkTriodeLink(s, () =>
      checkNumber('ra', 'Ra', s.ra, 'Ω', LIMITS.minOhms, LIMITS.maxOhms) ??
      checkNumber('rk', 'Rk', s.rk, 'Ω', 0, LIMITS.maxOhms) ??
      (typeof s.bypassed === 'boolean' ? null : fail('invalid-input', 'Bypass must be on or off', 'bypassed')) ??
      (s.ck === undefined ? null : checkNumber('ck', 'Ck', s.ck, 'F', LIMITS.minFarads, LIMITS.maxFarads)) ??
      volumeProblem(s.volume, s.coupling?.kind === 'capacitor'),
    ),
  inputImpedance: (s) => couplingImpedance(s.coupling),
  solve(s, env) {
    const design: StageDesign = {
      tube: s.tube,
      bplus: s.bplus,
      ra: s.ra,
      rk: s.rk,
      bypassed: s.bypassed,
      ...(s.ck !== undefined && s.bypassed ? { ck: s.ck } : {}),
      rl: env.load,
      vbias: env.gridDc ?? s.vbias ?? 0,
      ...(s.coupling.kind === 'capacitor' ? { rg: s.coupling.rg, ...(s.volume !== undefined ? { volume: s.volume } : {}) } : {}),
      ...(s.rstopper ? { rstopper: s.rstopper } : {}),
      heaterVolts: s.heaterVolts ?? 0,
    };
    // Solved with its stopper and pot, so its findings name them; neither moves its operating point.
    const solved = solveStage(design);
    if (!solved.ok) return solved;
    // The transfer from the grid's own swing: what drives the grid (the pot's wiper, the stopper) is the chain's to follow.
    const checked = normalizeStage({ ...design, volume: undefined, rstopper: undefined });
    if (!checked.ok) return checked;
    const t = stageTransfer(checked, solved.op);
    return triodeLink({
      tube: s.tube,
      coupling: s.coupling,
      solved,
      outputDc: solved.op.va,
      at: (vin) => t.at(vin),
      network: {
        plateLoad: s.ra,
        rk: checked.rk,
        ck: checked.bypassed ? checked.ck : null,
        cathodeGrounded: checked.rk === 0 || (checked.bypassed && checked.ck === null),
        output: 'plate',
      },
    });
  },
};
