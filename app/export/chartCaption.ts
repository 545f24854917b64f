import { followerLegend, OUTPUT_STAGE_LEGEND, PAIR_STAGE_LEGEND, voltageStageLegend, type LegendItem } from '../ui/chart/ChartLegend';
import { PALETTE } from '../ui/chart/palette';
import { farads, milliamps, ohms, plain, volts, watts } from '../format';
import type { WorkbenchState } from '../store/workbenchStore';

/** What an exported chart carries beside the curves: the design in one line, its key figures, and the key to its lines. */
export interface ChartCaption {
  readonly title: string;
  readonly figures: string;
  readonly legend: readonly LegendItem[];
}

export function chartCaption(s: WorkbenchState): ChartCaption {
  if (s.design.stageKind === 'output') {
    const b = s.outputBench;
    const o = s.design.output;
    if (b.pair === 'push-pull') {
      const p = b.analysis;
      const one = p.solution.idle[0];
      return {
        title: `Two ${o.tubeId} ${o.connection} in push-pull, B+ ${volts(o.bplus)}, ${o.bias === 'cathode' ? `Rk ${ohms(o.rk)} shared` : `grids ${volts(o.vg)}`}, Raa ${ohms(o.raa)}`,
        figures: `Each: Vpk ${volts(one.vpk)}, Ia ${milliamps(one.ip)}, Pa ${watts(one.pa)}; ${watts(p.full.power)} with the grids driven to 0 V`,
        legend: PAIR_STAGE_LEGEND,
      };
    }
    const a = b.analysis;
    return {
      title: `${o.tubeId} ${o.connection}, B+ ${volts(o.bplus)}, ${o.bias === 'cathode' ? `Rk ${ohms(o.rk)}` : `grid ${volts(o.vg)}`}, primary ${ohms(o.zPrimary)}`,
      figures: `Vpk ${volts(a.solution.op.vpk)}, Ia ${milliamps(a.solution.op.ip)}, Pa ${watts(a.solution.op.pa)}; ${watts(a.clean.at.power)} at the onset of ${a.clean.limitedBy}`,
      legend: OUTPUT_STAGE_LEGEND,
    };
  }
  const d = s.design;
  const f = s.design.stageKind === 'follower' ? s.followerBench : null;
  if (f) {
    // The chart shows the follower: its own parts and point, and its own key.
    const sol = f.plane.solution;
    return {
      title: `${f.tube.id} cathode follower, B+ ${volts(f.bplus)}, grid at ${volts(f.vgrid)} (${d.stage2.coupling ? `held by its divider, through ${farads(d.stage2.coupling.cc)} into ${ohms(d.stage2.coupling.rg)}` : 'the plate before it'}), Rk ${ohms(d.stage2.rk)}`,
      figures: `Vk ${volts(sol.op.vk)}, Ia ${milliamps(sol.op.ia)}, Vgk ${volts(sol.op.vgk)}, Pa ${watts(sol.op.pa)}; gain ${plain(sol.gain, 3)} ×, Zout ${ohms(sol.zout)}, heater–cathode ${volts(sol.vhk)}`,
      legend: followerLegend(f.vgrid),
    };
  }
  const op = s.analysis.solution.op;
  return {
    title: `${d.tubeId}, B+ ${volts(d.bplus)}, Ra ${ohms(d.ra)}, Rk ${ohms(d.rk)}${d.bypassed ? ' bypassed' : ''}, RL ${Number.isFinite(d.rl) ? ohms(d.rl) : 'none'}`,
    figures: `Va ${volts(op.va)}, Ia ${milliamps(op.ia)}, Vgk ${volts(op.vgk)}, Pa ${watts(op.pa)}; gain ${plain(s.analysis.solution.gain)} ×, Zout ${ohms(s.analysis.solution.zout)}`,
    legend: voltageStageLegend(s.analysis.sheet.gridLimit?.vg ?? null),
  };
}

const SVG_NS = 'http://www.w3.org/2000/svg';
const HEADER = 44;
const ROW = 16;

/**
 * Wraps a chart's SVG (already a standalone clone) with the caption: the
 * title and figures above, the legend below in two columns. Returns the new
 * height. Text is set with textContent, so a title is never markup.
 */
export function addCaption(doc: SVGSVGElement, width: number, height: number, c: ChartCaption): number {
  const el = (name: string, attrs: Record<string, string | number>, text?: string) => {
    const node = document.createElementNS(SVG_NS, name);
    for (const [k, v] of Object.entries(attrs)) node.setAttribute(k, String(v));
    if (text !== undefined) node.textContent = text;
    return node;
  };
  const chart = el('g', { transform: `translate(0,${HEADER})` });
  while (doc.firstChild) chart.appendChild(doc.firstChild);
  const rows = Math.ceil((c.legend.length + 1) / 2);
  const total = HEADER + height + rows * ROW + 12;
  doc.appendChild(el('rect', { width, height: total, fill: PALETTE.sheet }));
  doc.appendChild(el('text', { x: 12, y: 18, 'font-size': 14, 'font-weight': 700, fill: PALETTE.ink }, c.title));
  doc.appendChild(el('text', { x: 12, y: 36, 'font-size': 12, fill: PALETTE.inkSoft }, c.figures));
  doc.appendChild(chart);
  const items: LegendItem[] = [...c.legend, { label: 'Operating point', stroke: PALETTE.point, dash: undefined, width: 8 }];
  items.forEach((it, k) => {
    const x = 12 + (k % 2) * (width / 2);
    const y = HEADER + height + 4 + Math.floor(k / 2) * ROW;
    doc.appendChild(el('line', { x1: x, x2: x + 26, y1: y + 6, y2: y + 6, stroke: it.stroke, 'stroke-width': Math.min(it.width, 8), ...(it.dash ? { 'stroke-dasharray': it.dash } : {}) }));
    doc.appendChild(el('text', { x: x + 32, y: y + 10, 'font-size': 11, fill: PALETTE.ink }, it.label));
  });
  return total;
}
