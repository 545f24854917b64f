import { fail, type Failure } from '../result';
import { checkNumber, checkTube, LIMITS } from '../stage/checkInput';
import type { CommonCathodeLink, FollowerLink, LongTailedPairLink, SplitLoadLink } from './chainTypes';
import { checkCoupling } from './checkCoupling';

/**
 * What every triode stage of the chain is checked for: its tube, coupling,
 * B+, grid voltage (none of its own when direct-coupled: the grid sits at the
 * output before it), heater potential and grid stopper. Each kind adds its
 * own parts.
 */
export function checkTriodeLink(s: CommonCathodeLink | FollowerLink | SplitLoadLink | LongTailedPairLink, ownParts: () => Failure | null): Failure | null {
  return (
    checkTube(s.tube) ??
    checkCoupling(s.coupling, true) ??
    checkNumber('bplus', 'B+', s.bplus, 'V', 0, LIMITS.maxVolts, { minExclusive: true }) ??
    ownParts() ??
    (s.vbias === undefined ? null : checkNumber('vbias', 'Grid voltage', s.vbias, 'V', -LIMITS.maxBiasVolts, LIMITS.maxBiasVolts)) ??
    (s.coupling?.kind === 'direct' && (s.vbias ?? 0) !== 0 ? fail('invalid-input', 'A direct-coupled grid sits at the previous output\'s voltage: it takes no grid voltage of its own', 'vbias') : null) ??
    (s.heaterVolts === undefined ? null : checkNumber('heaterVolts', 'Heater potential', s.heaterVolts, 'V', -LIMITS.maxVolts, LIMITS.maxVolts)) ??
    (s.rstopper === undefined ? null : checkNumber('rstopper', 'Grid stopper (0 for none)', s.rstopper, 'Ω', 0, LIMITS.maxOhms))
  );
}
