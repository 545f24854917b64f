import { formatValue } from '../../src/index';
import type { BenchDesign } from './analysis';
import { voltageStages } from './stagePlans';
import { drivesPair, splitterName } from './outputPlan';

const CONNECTION = { pentode: 'pentode', triode: 'triode-connected', ultralinear: 'ultralinear' } as const;
const PAIR = { 'single-ended': 'single-ended', 'push-pull': 'push-pull' } as const;

/**
 * The title a design gets until the user types one: what is on the bench, in
 * the builder's words. It follows every change, so a build card never carries
 * the name of a design it no longer is.
 */
export function autoTitle(d: BenchDesign): string {
  // More than a stage and its second: the amplifier named by its chain, input to output.
  if (d.before.length + d.after.length > 0) {
    const list = voltageStages(d).map((p) => (p.kind === 'follower' ? `${p.tubeId} follower` : p.tubeId));
    // A driven pair has its splitter between the voltage stages and the output: it is a stage of the chain too.
    const splitter = drivesPair(d) ? [`${splitterName(d.output.splitter)} phase splitter`] : [];
    const end = d.drivesOutput ? [...splitter, `${d.output.tubeId} ${d.output.pair === 'push-pull' ? 'push-pull ' : ''}output`] : [];
    return `${list.length + end.length}-stage amplifier: ${[...list, ...end].join(' → ')}`;
  }
  if (d.stageKind === 'output') {
    const o = d.output;
    return `${o.tubeId} ${PAIR[o.pair]} output, ${CONNECTION[o.connection]}, B+ ${formatValue(o.bplus, 'V')}, ${o.pair === 'push-pull' ? `${formatValue(o.raa, 'Ω')} plate to plate` : `${formatValue(o.zPrimary, 'Ω')} primary`}`;
  }
  const load = Number.isFinite(d.rl) ? ` into ${formatValue(d.rl, 'Ω')}` : '';
  if (d.stage2.kind === 'follower') return `${d.tubeId} gain stage and ${d.stage2.tubeId} cathode follower, B+ ${formatValue(d.bplus, 'V')}${load}`;
  if (d.stage2.kind === 'common-cathode') return `${d.tubeId} and ${d.stage2.tubeId} gain stages, B+ ${formatValue(d.bplus, 'V')}${load}`;
  return `${d.tubeId} voltage stage, B+ ${formatValue(d.bplus, 'V')}${load}`;
}
