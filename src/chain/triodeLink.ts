import type { Finding } from '../stage/ratingBands';
import type { OperatingPoint } from '../stage/solveStage';
import { CUTOFF_FRACTION } from '../tube/koren';
import { gridCurrent } from '../tube/gridCurrent';
import { modelOf, recordOf, type TubeLike } from '../tube/types';
import type { Coupling } from './chainTypes';
import { couplingImpedance } from './checkCoupling';
import { NO_CAPACITANCES } from './noCapacitances';
import type { LinearStage, LinkSample, SolvedLink } from './stageKind';

/** What a triode kind's solver gives, and where its signal leaves and how its plate and cathode are loaded. */
export interface TriodeLinkParts {
  readonly tube: TubeLike;
  readonly coupling: Coupling;
  readonly solved: { readonly op: OperatingPoint; readonly gain: number; readonly zout: number; readonly gm: number; readonly rp: number; readonly findings: readonly Finding[] };
  readonly outputDc: number;
  /** The stage at a grid swing vin: its output less the quiescent value, Vgk and Ia. */
  readonly at: (vin: number) => { readonly vout: number; readonly vgk: number; readonly ia: number };
  readonly network: Pick<LinearStage, 'plateLoad' | 'rk' | 'ck' | 'cathodeGrounded' | 'output'>;
}

/** A triode stage as the chain takes it (common cathode and follower alike): the plate current feeds it, 1 % of it is cutoff. */
export function triodeLink(p: TriodeLinkParts): { ok: true } & SolvedLink {
  const { op } = p.solved;
  const model = modelOf(p.tube);
  return {
    ok: true,
    op: { va: op.va, vk: op.vk, ia: op.ia, vgk: op.vgk },
    supplyCurrent: op.ia,
    outputDc: p.outputDc,
    gain: p.solved.gain,
    zin: couplingImpedance(p.coupling),
    zout: p.solved.zout,
    sample: (vin: number, out: LinkSample) => {
      const x = p.at(vin);
      out.vout = x.vout;
      out.vgk = x.vgk;
      out.ia = x.ia;
      out.vout2 = 0;
    },
    cutoffCurrent: CUTOFF_FRACTION * op.ia,
    gridLaw: (vgk) => gridCurrent(model, vgk),
    findings: p.solved.findings,
    linear: { gm: p.solved.gm, rp: p.solved.rp, gScreen: 0, caps: recordOf(p.tube)?.capacitances ?? NO_CAPACITANCES, outputScale: 1, ...p.network },
  };
}
