import type { Rectifier } from '../../../src/index';

/** Whether the secondary is one winding (a bridge's, a half-wave's) rather than two halves of a centre-tapped one (full wave, silicon or tube). */
export const oneWinding = (r: Rectifier): boolean => r.kind === 'silicon-bridge' || r.kind === 'silicon-half-wave';

/** The rectifier as the drawing and the card name it. */
export function rectifierName(r: Rectifier): string {
  switch (r.kind) {
    case 'tube': return r.tubeId;
    case 'silicon-bridge': return 'bridge';
    case 'silicon-half-wave': return 'half wave';
    default: return 'full wave';
  }
}
