import type { OutputOverlay, PushPullOverlay } from '../../../src/index';
import { linePath } from '../chart/drawOverlay';
import { PALETTE } from '../chart/palette';
import type { PlateScales } from '../chart/plateScales';

/**
 * The output stage's moving layer: the near-vertical DC load line, the AC
 * load line through the point with the clean swing washed over it, and the
 * positions of the point and the load-slope handle. A rival's lines and
 * point are drawn dashed in its own colour.
 */
export interface OutputOverlayNodes {
  readonly lines: SVGGElement;
  readonly point: SVGGElement;
  readonly loadHandle: SVGGElement;
  readonly rivalPoint: SVGGElement;
}

const at = (scales: PlateScales, p: { v: number; i: number }) => `translate(${scales.x(p.v)},${scales.y(p.i)})`;

/** The most composite curves the model draws (compositeCurves' default). */
const COMPOSITE_CURVES = 5;

export function drawOutputOverlay(nodes: OutputOverlayNodes, overlay: OutputOverlay, rival: OutputOverlay | null, scales: PlateScales): void {
  linePath(nodes.lines, 'swing', overlay.swing, scales, { stroke: PALETTE.pointWash, width: 9 });
  linePath(nodes.lines, 'dc-load', overlay.dcLoad, scales, { stroke: PALETTE.load, width: 2 });
  linePath(nodes.lines, 'ac-load', overlay.acLoad, scales, { stroke: PALETTE.load, width: 1.6, dash: '9 5' });
  // A push-pull pair's second line: one tube working alone once its partner cuts off.
  linePath(nodes.lines, 'alone-load', 'alone' in overlay ? (overlay as PushPullOverlay).alone : [], scales, { stroke: PALETTE.load, width: 1.2, dash: '2 4' });
  // Its composite characteristics, which that line loads: a fixed number of curves, so each keeps its own path.
  const composite = 'composite' in overlay ? (overlay as PushPullOverlay).composite : [];
  for (let k = 0; k < COMPOSITE_CURVES; k++) linePath(nodes.lines, `composite-${k}`, composite[k]?.points ?? [], scales, { stroke: PALETTE.composite, width: 1, dash: '1 3' });
  linePath(nodes.lines, 'rival-dc-load', rival?.dcLoad ?? [], scales, { stroke: PALETTE.rival, width: 1.8, dash: '10 4' });
  linePath(nodes.lines, 'rival-ac-load', rival?.acLoad ?? [], scales, { stroke: PALETTE.rival, width: 1.4, dash: '3 3' });
  nodes.point.setAttribute('transform', at(scales, overlay.point));
  nodes.loadHandle.setAttribute('transform', at(scales, overlay.loadHandle));
  if (rival) nodes.rivalPoint.setAttribute('transform', at(scales, rival.point));
  nodes.rivalPoint.setAttribute('visibility', rival ? 'visible' : 'hidden');
}
