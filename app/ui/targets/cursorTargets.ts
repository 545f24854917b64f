import { TARGET_LABELS, UNREACHABLE, type TargetName } from '../../../src/index';

/**
 * The targets under the cursor, as a chart's readout ends: nothing with no
 * region, why no design sits there, "all met", or the targets that fail.
 */
export function cursorTargetWords(failing: readonly string[] | null, unreachable: string): string {
  if (failing === null) return '';
  if (failing[0] === UNREACHABLE) return ` · targets: ${unreachable}`;
  return failing.length === 0 ? ' · targets: all met' : ` · targets failing: ${failing.map((k) => TARGET_LABELS[k as TargetName]).join(', ')}`;
}
