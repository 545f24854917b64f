import { fail, type Result } from '../result';
import { LIMITS } from '../stage/checkInput';
import { solveFollower, type FollowerSolution } from '../stage/solveFollower';
import { solveStage, type StageSolution } from '../stage/solveStage';
import type { StageDesign } from '../stage/stageDesign';
import type { TubeLike } from '../tube/types';
import type { ChainInput, ChainStage, CommonCathodeLink, Coupling } from '../chain/chainTypes';
import { prepareAmplifier } from '../chain/prepareAmplifier';
import { stopperNote } from '../chain/stopperNote';
import { sineLevel, type Level } from './levels';

/** A link of a chain: a common-cathode stage, or a cathode follower after the plate before it (direct- or capacitor-coupled). */
export type ChainLink =
  | ({ readonly kind: 'common-cathode' } & StageDesign)
  | {
      readonly kind: 'follower';
      readonly tube: TubeLike;
      readonly bplus: number;
      readonly rk: number;
      readonly rl?: number;
      readonly heaterVolts?: number;
      /** Capacitor-coupled: through `cc` into the grid leak `rg`, the grid held at `vbias` (a divider's). Absent: direct-coupled to the plate before it. */
      readonly coupling?: FollowerCoupling;
      /** Grid stopper at its socket, Ω; absent or 0: none. */
      readonly rstopper?: number;
    };

/** A follower fed through a coupling capacitor, its grid held at its own bias: free of the plate before it, at the cost of Cc and a leak that loads that plate. */
export interface FollowerCoupling {
  readonly cc: number;
  readonly rg: number;
  /** The grid's DC voltage to ground, V. */
  readonly vbias: number;
}

export type LinkResult = ({ readonly kind: 'common-cathode' } & StageSolution) | ({ readonly kind: 'follower' } & FollowerSolution);

export interface LinkChainResult {
  readonly links: readonly LinkResult[];
  /** Overall voltage gain, signed: negative means the chain inverts. */
  readonly gain: number;
  readonly inverting: boolean;
  /** Output impedance of the last link, Ω. */
  readonly zout: number;
  /** Largest clean input peak for the whole chain, V, the output peak there, and which link limits it. */
  readonly inputPeak: number;
  readonly input: Level;
  readonly outputPeak: number;
  readonly output: Level;
  readonly limitedBy: { readonly link: number; readonly by: 'grid-current' | 'cutoff' };
}

/** A link's grid feed in the amplifier's terms: its leak through an ideal capacitor, or direct. */
function couplingOf(d: StageDesign): Coupling {
  // A grid held at a bias with no leak given: a leak far above any source, so the source sees the grid alone.
  if (d.rg === undefined) return d.vbias ? { kind: 'capacitor', cc: LIMITS.maxFarads, rg: LIMITS.maxOhms } : { kind: 'direct' };
  return { kind: 'capacitor', cc: d.cin ?? LIMITS.maxFarads, rg: d.rg };
}

function commonCathodeOf(d: StageDesign): CommonCathodeLink {
  return {
    kind: 'common-cathode',
    tube: d.tube,
    bplus: d.bplus,
    ra: d.ra,
    rk: d.rk,
    bypassed: d.bypassed ?? true,
    ...(d.ck !== undefined ? { ck: d.ck } : {}),
    ...(d.vbias !== undefined ? { vbias: d.vbias } : {}),
    ...(d.heaterVolts !== undefined ? { heaterVolts: d.heaterVolts } : {}),
    coupling: couplingOf(d),
  };
}

/**
 * Solves a one- or two-link chain (the first version's input, kept working:
 * `solveChain` answers an array with this), as the amplifier it is: each
 * link's own solution, and the swing of the amplifier's composed transfer
 * (see ChainSignal), so the two forms give the same figures. A
 * common-cathode second link is coupled through a capacitor, its grid leak
 * Rg loading the first plate; a follower is direct-coupled, its grid at the
 * first plate's voltage, or capacitor-coupled into its own leak and bias.
 * The input is the first grid's open-circuit swing, as it always was (the
 * amplifier's is the source's).
 */
export function solveLinks(links: readonly ChainLink[]): Result<LinkChainResult> {
  if (!Array.isArray(links) || links.length < 1 || links.length > 2) return fail('invalid-input', 'A chain has one or two links');
  if (!links.every((l) => typeof l === 'object' && l !== null)) return fail('invalid-input', 'Every link of a chain must be a stage design', 'links');
  const first = links[0]!;
  if (first.kind !== 'common-cathode') return fail('invalid-input', 'The first link must be a common-cathode stage', 'links');
  const second = links[1];
  if (second?.kind === 'common-cathode' && second.rg === undefined) return fail('invalid-input', 'A capacitor-coupled second stage needs its grid leak Rg', 'rg');
  // With a second link, the first plate's load is that link's grid: its leak, or none for a direct-coupled follower.
  const loadOnFirst = second?.kind === 'common-cathode' ? second.rg! : second ? (second.coupling?.rg ?? Infinity) : (first.rl ?? Infinity);
  const s1 = solveStage({ ...first, rl: loadOnFirst });
  if (!s1.ok) return { ...s1, message: `Stage 1: ${s1.message}` };
  const results: LinkResult[] = [{ kind: 'common-cathode', ...s1 }];
  const stages: ChainStage[] = [commonCathodeOf(first)];
  let load = second ? undefined : first.rl;
  if (second?.kind === 'follower') {
    const c = second.coupling;
    const f = solveFollower({ tube: second.tube, bplus: second.bplus, vgrid: c ? c.vbias : s1.op.va, rk: second.rk, rl: second.rl, heaterVolts: second.heaterVolts });
    if (!f.ok) return { ...f, message: `Follower: ${f.message}` };
    // Its stopper noted as the amplifier notes it (its figures here are its operating point's, which the stopper leaves).
    const note = stopperNote(second.tube, second.rstopper, 0, f.gain);
    results.push({ kind: 'follower', ...f, ...(note ? { findings: [...f.findings, note] } : {}) });
    stages.push({
      kind: 'follower', tube: second.tube, bplus: second.bplus, rk: second.rk,
      ...(second.heaterVolts !== undefined ? { heaterVolts: second.heaterVolts } : {}),
      ...(second.rstopper !== undefined ? { rstopper: second.rstopper } : {}),
      ...(c ? { vbias: c.vbias, coupling: { kind: 'capacitor' as const, cc: c.cc, rg: c.rg } } : { coupling: { kind: 'direct' as const } }),
    });
    load = second.rl;
  } else if (second?.kind === 'common-cathode') {
    const s2 = solveStage(second);
    if (!s2.ok) return { ...s2, message: `Stage 2: ${s2.message}` };
    results.push({ kind: 'common-cathode', ...s2 });
    stages.push(commonCathodeOf(second));
    load = second.rl;
  }
  const input: ChainInput = { source: { rsource: first.rsource ?? 0 }, stages, ...(load !== undefined && Number.isFinite(load) ? { load: { rl: load } } : {}) };
  const a = prepareAmplifier(input);
  if (!a.ok) return a;
  // The chain's input is the source's; the first version's, the first grid's open-circuit swing.
  const zin = stages[0]!.coupling.kind === 'capacitor' ? stages[0]!.coupling.rg : Infinity;
  const share = Number.isFinite(zin) ? zin / (zin + input.source.rsource) : 1;
  const gain = results.reduce((g, l) => g * l.gain, 1);
  const outputPeak = a.signal.outputPeak(a.inputPeak);
  const inputPeak = a.inputPeak * share;
  return {
    ok: true,
    links: results,
    gain,
    inverting: gain < 0,
    zout: results[results.length - 1]!.zout,
    inputPeak,
    input: sineLevel(inputPeak),
    outputPeak,
    output: sineLevel(outputPeak),
    limitedBy: { link: a.first, by: a.clips[a.first]!.by },
  };
}
