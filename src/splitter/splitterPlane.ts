import { bracketedRoot } from '../numeric/bracketedRoot';
import { curveSheet, type CurveSheet } from '../stage/curveSheet';
import { dcLoadLine, type PlanePoint } from '../stage/planeSeries';
import { cutoffGridVoltage, korenPlateCurrent } from '../tube/koren';
import { modelOf, type TubeLike } from '../tube/types';

const BIAS_POINTS = 48;

/**
 * The bias line Vgk = Vgrid − Ia·R, stepped in grid voltage from 0 V to
 * cutoff: with a grid held high (a split-load stage's ~90 V over 22 kΩ) it
 * spans a fraction of a milliamp, which steps in current would miss.
 */
function gridBiasLine(tube: TubeLike, r: number, vgrid: number, vmax: number): PlanePoint[] {
  const p = modelOf(tube).params;
  const lowest = -Math.abs(cutoffGridVoltage(p, vmax));
  const out: PlanePoint[] = [];
  for (let k = 0; k <= BIAS_POINTS; k++) {
    const vgk = (lowest * k) / BIAS_POINTS;
    const ia = (vgrid - vgk) / r;
    if (!(ia > 0) || korenPlateCurrent(p, vmax, vgk) < ia) continue;
    const root = bracketedRoot((v) => korenPlateCurrent(p, v, vgk) - ia, 0, vmax, vmax * 1e-9);
    if (root.converged) out.push({ v: root.x, i: ia });
  }
  return out;
}

/** A phase splitter's triode on its plate curves: its DC load line, its bias line and its operating point. */
export interface SplitterPlane {
  readonly sheet: CurveSheet;
  readonly load: readonly PlanePoint[];
  readonly bias: readonly PlanePoint[];
  readonly point: PlanePoint;
  /** A long-tailed pair's second triode: its own load line (Ra2) and point; the bias line is the first's (one grid voltage, one cathode). Null for the split-load. */
  readonly second: { readonly load: readonly PlanePoint[]; readonly point: PlanePoint } | null;
}

export interface SplitterPlaneDesign {
  readonly kind: 'split-load' | 'long-tailed-pair';
  readonly bplus: number;
  readonly ra: number;
  /** Split-load: the cathode load; long-tailed pair: the shared bias resistor. */
  readonly rk: number;
  /** The long-tailed pair's tail, Ω. */
  readonly rtail: number;
  /** The grid's DC voltage to ground, V. */
  readonly vgrid: number;
  /** The long-tailed pair's second plate resistor, Ω. */
  readonly ra2?: number;
}

/**
 * The splitter's triode (the first of a long-tailed pair) in the plate plane
 * (x is plate to cathode). Split-load: B+ across Ra, the tube and Rk, so the
 * DC load line has slope −1/(Ra + Rk); its grid at Vgrid, so on the bias line
 * Vgk = Vgrid − Ia·Rk. Long-tailed pair: the cathodes carry both tubes'
 * current through Rk and the tail, drawn with the other tube drawing as much
 * (a balanced pair): slope −1/(Ra + 2(Rk + Rt)) and Vgk = Vgrid − 2·Ia·(Rk + Rt).
 * The point is the one the amplifier solved.
 */
type Point = { readonly va: number; readonly vk: number; readonly ia: number };

export function splitterPlane(tube: TubeLike, d: SplitterPlaneDesign, op: Point, op2?: Point): SplitterPlane {
  const sheet = curveSheet(tube, d.bplus);
  const cathode = Math.max(d.kind === 'split-load' ? d.rk : 2 * (d.rk + d.rtail), 1);
  const second = d.kind === 'long-tailed-pair' && op2 ? { load: dcLoadLine(d.bplus, (d.ra2 ?? d.ra) + cathode), point: { v: op2.va - op2.vk, i: op2.ia } } : null;
  return {
    sheet,
    load: dcLoadLine(d.bplus, d.ra + cathode),
    bias: gridBiasLine(tube, cathode, d.vgrid, sheet.extent.vmax),
    point: { v: op.va - op.vk, i: op.ia },
    second,
  };
}
