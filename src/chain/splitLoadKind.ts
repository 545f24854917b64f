import { bracketedRoot } from '../numeric/bracketedRoot';
import type { Failure } from '../result';
import { checkNumber, LIMITS } from '../stage/checkInput';
import { parallel } from '../stage/parallel';
import { solveCathodyne } from '../splitter/cathodyne';
import { CUTOFF_FRACTION, korenPlateCurrent } from '../tube/koren';
import { gridCurrent } from '../tube/gridCurrent';
import { modelOf, recordOf } from '../tube/types';
import type { SplitLoadLink } from './chainTypes';
import { couplingImpedance } from './checkCoupling';
import { checkTriodeLink } from './checkTriodeLink';
import { stopperNote } from './stopperNote';
import { NO_CAPACITANCES } from './noCapacitances';
import type { LinkSample, StageKind } from './stageKind';

/** The splitter's own field names, as the chain names them. */
const fieldOf = (f: Failure): Failure => (f.field === 'grid.volts' ? { ...f, field: 'vbias' } : f);

/**
 * The split-load phase splitter in the chain. Its two outputs carry one
 * current, so at any instant the plate has moved by −δi·Ra′ and the cathode
 * by +δi·Rk′ (each resistor in parallel with its output's load, the next
 * grids' leaks): the large-signal transfer is one root per instant, and the
 * outputs stay exactly in the ratio −Rk′/Ra′ however hard it is driven.
 */
export const splitLoadKind: StageKind<SplitLoadLink> = {
  kind: 'split-load',
  check: (s) => checkTriodeLink(s, () => checkNumber('ra', 'Ra', s.ra, 'Ω', LIMITS.minOhms, LIMITS.maxOhms) ?? checkNumber('rk', 'Rk', s.rk, 'Ω', LIMITS.minOhms, LIMITS.maxOhms)),
  inputImpedance: (s) => couplingImpedance(s.coupling),
  solve(s, env) {
    const vgrid = env.gridDc ?? s.vbias ?? 0;
    const r = solveCathodyne({ tube: s.tube, bplus: s.bplus, ra: s.ra, rk: s.rk, rb: 0, grid: { kind: 'fixed', volts: vgrid }, rl: env.load, heaterVolts: s.heaterVolts ?? 0 });
    if (!r.ok) return fieldOf(r);
    const { op } = r;
    const p = modelOf(s.tube).params;
    const raL = parallel(s.ra, env.load);
    const rkL = parallel(s.rk, env.load);
    const both = raL + rkL;
    const sample = (vin: number, out: LinkSample) => {
      const excess = (di: number) => korenPlateCurrent(p, op.vpk - di * both, op.vgk + vin - di * rkL) - (op.ia + di);
      const di = bracketedRoot(excess, -op.ia, op.vpk / both, 1e-12 * (op.ia + 1e-3)).x;
      out.vout = -di * raL;
      out.vout2 = di * rkL;
      out.vgk = op.vgk + vin - di * rkL;
      out.ia = op.ia + di;
    };
    return {
      ok: true,
      op: { va: op.va, vk: op.vk, ia: op.ia, vgk: op.vgk },
      supplyCurrent: op.ia,
      outputDc: op.va,
      gain: r.gainPlate,
      zin: couplingImpedance(s.coupling),
      zout: r.zPlate,
      antiphase: r.gainCathode / r.gainPlate,
      sample,
      cutoffCurrent: CUTOFF_FRACTION * op.ia,
      gridLaw: (vgk) => gridCurrent(modelOf(s.tube), vgk),
      findings: [...r.findings, ...[stopperNote(s.tube, s.rstopper, r.gainPlate, r.gainCathode)].filter((f) => f !== null)],
      // The plate output as a common-cathode stage with an unbypassed cathode resistor, the other output; the push-pull
      // pair's second grid loads it through its own coupling in the network.
      linear: { gm: r.gm, rp: r.rp, plateLoad: s.ra, rk: s.rk, ck: null, cathodeGrounded: false, gScreen: 0, caps: recordOf(s.tube)?.capacitances ?? NO_CAPACITANCES, output: 'plate', output2: 'cathode', outputScale: 1 },
    };
  },
};
