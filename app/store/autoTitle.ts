import { formatValue } from '../../src/index';
import type { BenchDesign } from './analysis';
import { voltageStages } from './stagePlans';

const CONNECTION = { pentode: 'pentode', triode: 'triode-connected', ultralinear: 'ultralinear' } as const;

/**
 * The title a design gets until the user types one: what is on the bench, in
 * the builder's words. It follows every change, so a build card never carries
 * the name of a design it no longer is.
 */
export function autoTitle(d: BenchDesign): string {
  // More than a stage and its second: the amplifier named by its chain, input to output.
  if (d.before.length + d.after.length > 0) {
    const list = voltageStages(d).map((p) => (p.kind === 'follower' ? `${p.tubeId} follower` : p.tubeId));
    const end = d.drivesOutput ? [`${d.output.tubeId} output`] : [];
    return `${list.length + end.length}-stage amplifier: ${[...list, ...end].join(' → ')}`;
  }
  if (d.stageKind === 'output') {
    const o = d.output;
    return `${o.tubeId} single-ended output, ${CONNECTION[o.connection]}, B+ ${formatValue(o.bplus, 'V')}, ${formatValue(o.zPrimary, 'Ω')} primary`;
  }
  const load = Number.isFinite(d.rl) ? ` into ${formatValue(d.rl, 'Ω')}` : '';
  if (d.stage2.kind === 'follower') return `${d.tubeId} gain stage and ${d.stage2.tubeId} cathode follower, B+ ${formatValue(d.bplus, 'V')}${load}`;
  if (d.stage2.kind === 'common-cathode') return `${d.tubeId} and ${d.stage2.tubeId} gain stages, B+ ${formatValue(d.bplus, 'V')}${load}`;
  return `${d.tubeId} voltage stage, B+ ${formatValue(d.bplus, 'V')}${load}`;
}
