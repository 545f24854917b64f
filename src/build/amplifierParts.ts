import type { PreferredSeries } from '../parts/preferredValues';
import type { ChainInput, ChainResult, ChainStage } from '../chain/chainTypes';
import { capacitorForCorner, capacitorLine, type CapacitorLine } from './partsList';
import { chainStageParts, type StageParts } from './chainStageParts';

export interface AmplifierPartsOptions {
  readonly series: PreferredSeries;
  /**
   * The coupling capacitor from the last voltage stage into a load (an
   * amplifier with no output stage), F; null for an ideal one the design
   * leaves to choose; absent for no load.
   */
  readonly loadCoupling?: number | null;
  /**
   * A coupling capacitor of exactly `cc` stands for an ideal one the design
   * never sized (an older design's second stage): it is listed at the
   * preferred value that sets `cornerHz` against what it works into.
   */
  readonly unsized?: { readonly cc: number; readonly cornerHz: number };
}

const isVoltageStage = (s: ChainStage) => s.kind === 'common-cathode' || s.kind === 'follower';

/**
 * The amplifier's parts to order, stage by stage in chain order, every part
 * numbered by its stage's place (Ra3 is stage 3's plate resistor) and rated
 * from that stage's own operating point. The coupling out of the last
 * voltage stage (into the phase splitter, the output stage or a load) is
 * listed with that stage as Cout, across its output's DC less the grid's
 * after it. Output stages are not listed: their parts come with their own
 * analysis (outputPartsList, pushPullPartsList).
 */
export function amplifierParts(input: ChainInput, result: ChainResult, opts: AmplifierPartsOptions): StageParts[] {
  const out: StageParts[] = [];
  for (let i = 0; i < input.stages.length; i++) {
    const parts = chainStageParts(input, result, i, opts.series);
    if (!parts) continue;
    out.push(opts.unsized ? withSizedCouplings(parts, input, result, opts.unsized) : parts);
  }
  let last = -1;
  input.stages.forEach((s, i) => {
    if (isVoltageStage(s)) last = i;
  });
  const cout = last >= 0 ? outputCoupling(input, result, last, opts.loadCoupling, opts.unsized) : null;
  const at = out.findIndex((p) => p.index === last);
  if (cout && at >= 0) out[at] = { ...out[at]!, capacitors: [...out[at]!.capacitors, cout] };
  return out;
}

/** The grid's DC voltage to ground of a stage fed through a capacitor: its divider's, its bias supply's, or 0 V. */
function gridDc(s: ChainStage): number {
  if (s.kind === 'single-ended-output' || s.kind === 'push-pull-output') return s.bias === 'fixed' ? s.vg : 0;
  return s.vbias ?? 0;
}

/**
 * Where a stage's output sits cold, before its tube warms and draws: a plate
 * at its B+; a follower's cathode rises toward its grid, the plate before it
 * (at B+ cold) or its own divider's voltage.
 */
function coldOutput(s: ChainStage): number {
  if (s.kind === 'follower') return s.coupling.kind === 'capacitor' ? (s.vbias ?? 0) : s.bplus;
  return s.bplus;
}

function outputCoupling(input: ChainInput, result: ChainResult, last: number, loadCoupling: number | null | undefined, unsized: AmplifierPartsOptions['unsized']): CapacitorLine | null {
  const from = input.stages[last]!;
  const st = result.stages[last]!;
  const n = last + 1;
  const node = from.kind === 'follower' ? 'cathode' : 'plate';
  const plus = from.kind === 'follower' ? '+ to the cathode' : `+ to stage ${n}'s plate`;
  const next = input.stages[last + 1];
  if (next) {
    if (next.coupling.kind !== 'capacitor') return null;
    const g = gridDc(next);
    const into = next.kind === 'split-load' || next.kind === 'long-tailed-pair' ? 'coupling into the splitter\'s grid' : 'coupling into the output grid';
    const ideal = unsized !== undefined && next.coupling.cc === unsized.cc;
    const value = ideal ? sizedFor(st.zout + next.coupling.rg, unsized.cornerHz) : next.coupling.cc;
    return capacitorLine('Cout', `${into} from stage ${n}'s ${node}${ideal ? sizedWords(unsized.cornerHz) : ''}`, value, st.outputDc - g, coldOutput(from) - g, plus);
  }
  if (loadCoupling === undefined) return null;
  return capacitorLine('Cout', `output coupling from stage ${n}'s ${node}`, loadCoupling, st.outputDc, coldOutput(from), plus);
}

/** The preferred capacitor that sets the corner against a resistance (capacitors come in E12 values, common practice). */
const sizedFor = (ohms: number, cornerHz: number) => capacitorForCorner(ohms, cornerHz, 'E12').preferred;
const sizedWords = (cornerHz: number) => ` (sized for a ${cornerHz} Hz corner)`;

/** A stage's coupling capacitor that stands for an ideal one, sized for the corner against its source's impedance and its grid leak. */
function withSizedCouplings(parts: StageParts, input: ChainInput, result: ChainResult, unsized: { cc: number; cornerHz: number }): StageParts {
  const s = input.stages[parts.index]!;
  if (s.coupling.kind !== 'capacitor' || s.coupling.cc !== unsized.cc) return parts;
  const source = parts.index > 0 ? result.stages[parts.index - 1]!.zout : input.source.rsource;
  const sized = sizedFor(source + s.coupling.rg, unsized.cornerHz);
  const ref = `Cc${parts.index + 1}`;
  return {
    ...parts,
    capacitors: parts.capacitors.map((c) => (c.ref === ref ? capacitorLine(c.ref, `${c.role}${sizedWords(unsized.cornerHz)}`, sized, c.volts, c.voltsAtSwitchOn, c.polarity ?? '+ to the output before it') : c)),
  };
}
