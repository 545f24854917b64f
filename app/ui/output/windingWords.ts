import { henries } from '../../format';
import type { WindingInductance } from '../../../src/index';

/**
 * The transformer's inductances as the design gives them, a line for the
 * parts list: the band and the loop's margins were worked out with them, so
 * a transformer with less primary or more leakage does worse. None when the
 * transformer was taken as ideal.
 */
export function windingLines(winding: WindingInductance): string[] {
  const lp = winding.primaryInductance ?? null;
  const ll = winding.leakageInductance ?? null;
  if (lp === null && ll === null) return [];
  const asked = [lp === null ? '' : `Primary inductance at least ${henries(lp)} at its DC current`, ll === null ? '' : `leakage inductance at most ${henries(ll)}`].filter(Boolean).join(', ');
  return [`${asked.charAt(0).toUpperCase()}${asked.slice(1)} (the band and the feedback's margins were worked out with ${lp !== null && ll !== null ? 'these' : 'this'}).`];
}

/** The inductances as the drawings label the transformer ("Lp 15 H, Ll 8 mH"); empty when ideal. */
export function windingText(winding: WindingInductance): string {
  const lp = winding.primaryInductance ?? null;
  const ll = winding.leakageInductance ?? null;
  return [lp === null ? '' : `Lp ${henries(lp)}`, ll === null ? '' : `Ll ${henries(ll)}`].filter(Boolean).join(', ');
}
