import { korenSlopesInto } from '../tube/koren';
import type { TriodeModel } from '../tube/types';
import type { OperatingPoint } from '../stage/solveStage';

/**
 * A cathode follower at midband, large signal: plate at B+, grid at vg (to
 * ground), Rk to ground, and RL on the cathode through a coupling capacitor
 * that holds the quiescent cathode voltage Vk0. Kirchhoff at the cathode:
 *   ia = vk/Rk + (vk − Vk0)/RL  ⇒  vk = (ia + Vk0/RL) · (Rk ∥ RL),
 * closed by ia = Ip(B+ − vk, vg − vk); strictly monotone in ia as before.
 */
export function followerTransfer(model: TriodeModel, bplus: number, rk: number, rl: number, op: OperatingPoint) {
  const p = model.params;
  const rPar = Number.isFinite(rl) ? (rk * rl) / (rk + rl) : rk;
  const offset = Number.isFinite(rl) ? (op.vk / rl) * rPar : 0; // vk = ia·rPar + offset
  const iaHi = (bplus - offset) / rPar; // vpk = 0
  let last = op.ia;
  const k = { ia: 0, gm: 0, ga: 0 }; // scratch for korenSlopesInto
  return (vg: number): { vk: number; ia: number; vgk: number } => {
    if (!(iaHi > 0)) return { vk: offset, ia: 0, vgk: vg - offset };
    let lo = 0;
    let hi = iaHi;
    let x = last > 0 && last < iaHi ? last : 0.5 * iaHi;
    for (let i = 0; i < 80; i++) {
      const vk = x * rPar + offset;
      korenSlopesInto(p, bplus - vk, vg - vk, k);
      const value = k.ia - x;
      if (value === 0) break;
      if (value > 0) lo = x;
      else hi = x;
      const slope = -(k.gm + k.ga) * rPar - 1;
      let next = x - value / slope;
      if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
      const step = Math.abs(next - x);
      x = next;
      if (step < iaHi * 1e-12 || hi - lo < iaHi * 1e-12) break;
    }
    last = x;
    const vk = x * rPar + offset;
    return { vk, ia: x, vgk: vg - vk };
  };
}
