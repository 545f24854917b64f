import { formatValue } from '../../src/index';
import { decibels, farads, mAPerV, milliamps, ohms, plain, volts, watts } from '../format';
import { COMPARE_ROWS } from '../panels/ComparePanel';
import { buildSheetOf } from '../store/buildSheet';
import type { WorkbenchState } from '../store/workbenchStore';
import { canvasBlob, EXPORT_FONTS, svgDocument, svgImage } from './chartImage';
import { outputCardSections } from './outputCard';

/** A4 portrait at 150 dots per inch: 210 × 297 mm. Letter paper prints it with a little white at the bottom. */
export const CARD_WIDTH = 1240;
export const CARD_HEIGHT = 1754;
const MARGIN = 60;

/** Everything the card shows, as lines of text, gathered from the store (the model already computed it). */
export function cardSections(s: WorkbenchState): { heading: string; lines: string[] }[] {
  if (s.design.stageKind === 'output') return outputCardSections(s);
  const sol = s.analysis.solution;
  const d = s.design;
  const sig = s.analysis.signal;
  const sections = [
    {
      heading: 'Stage',
      lines: [
        `${d.tubeId}, B+ ${volts(d.bplus)}, Ra ${ohms(d.ra)}, Rk ${ohms(d.rk)}${d.bypassed ? ` bypassed${d.ck ? ` by ${farads(d.ck)}` : ''}` : ' unbypassed'}`,
        `RL ${Number.isFinite(d.rl) ? ohms(d.rl) : 'none'}, Rs ${ohms(d.rsource)}, Cin ${d.cin ? farads(d.cin) : 'none'}, Rg ${ohms(d.rg)}, Cout ${d.cout ? farads(d.cout) : 'none'}`,
      ],
    },
    {
      heading: 'Operating point',
      lines: [
        `Va ${volts(sol.op.va)}, Vk ${volts(sol.op.vk)}, Ia ${milliamps(sol.op.ia)}, Vgk ${volts(sol.op.vgk)}`,
        `Pa ${watts(sol.op.pa)} (${Math.round((100 * sol.op.pa) / s.analysis.tube.ratings.maxPlateDissipation)} % of ${s.analysis.tube.ratings.maxPlateDissipation} W)`,
        `μ ${plain(sol.mu)}, rp ${ohms(sol.rp)}, gm ${mAPerV(sol.gm)}`,
        `Gain ${plain(sol.gain)} × (${decibels(sol.gain)}), Zout ${ohms(sol.zout)}, Cin ${farads(sol.cin)}`,
      ],
    },
    {
      heading: 'Signal',
      lines: [
        `Clean output ${plain(sig.swing.output.rms)} V rms (${sig.swing.output.dBu.toFixed(1)} dBu), clips by ${sig.swing.limitedBy === 'grid-current' ? 'grid current' : 'cutoff'}`,
        sig.distortion.ok
          ? `At ${plain(d.levelRms)} V rms out: THD ${plain(sig.distortion.thdPercent)} %, H2 ${sig.distortion.harmonicsDb[0]!.toFixed(1)} dB, H3 ${sig.distortion.harmonicsDb[1]!.toFixed(1)} dB`
          : sig.distortion.message,
        `−3 dB: ${sig.corners.lowHz ? formatValue(sig.corners.lowHz, 'Hz') : 'DC'} to ${sig.corners.highHz ? formatValue(sig.corners.highHz, 'Hz') : 'beyond 1 GHz'}`,
      ],
    },
    { heading: 'Ratings', lines: sol.findings.map((f) => `${f.severity.toUpperCase()}: ${f.message}`) },
  ];
  const build = buildSheetOf(s);
  sections.push({
    heading: 'Parts to order',
    lines: [
      ...build.resistors.map((r) => `${r.ref}: ${ohms(r.preferred)} ${r.series}, ${r.ratingWatts} W (runs at ${watts(r.watts)})`),
      ...build.capacitors.map((c) => `${c.ref}: ${c.value === null ? 'value to choose' : farads(c.value)}, ${c.ratingVolts} V${c.polarity ? `, ${c.polarity}` : ''} (sees ${volts(Math.max(c.volts, c.voltsAtSwitchOn))})`),
      build.heaters.ok ? `Heaters ${build.heaters.volts} V, ${plain(build.heaters.totalAmps)} A${build.dropper?.ok && build.dropper.preferred > 0 ? `; dropper ${ohms(build.dropper.preferred)} ${build.dropper.ratingWatts} W from the DC supply` : ''}` : '',
      build.filter.ok ? `B+ filter ${ohms(s.buildInputs.filterR)} / ${farads(s.buildInputs.filterC)} from ${volts(s.buildInputs.railVolts)}: drop ${volts(build.filter.dropVolts)}, ripple ${build.filter.ripple100Db.toFixed(0)} dB at 100 Hz` : '',
    ].filter(Boolean),
  });
  const r = s.rivalAnalysis;
  if (s.rival.on && r && 'solution' in r) {
    sections.push({
      heading: `Compared: ${s.analysis.tube.id} against ${r.tube.id} (${s.rival.mode === 'same-parts' ? 'same parts' : 'each its own values'})`,
      lines: COMPARE_ROWS.map((row) => {
        const a = row.value(s.analysis);
        const b = row.value(r);
        return `${row.label}: ${a === null ? '—' : row.show(a)}  |  ${b === null ? '—' : row.show(b)}`;
      }),
    });
  }
  return sections;
}

/** Draws text wrapped to a width; returns the y below it. */
function wrapText(ctx: CanvasRenderingContext2D, text: string, x: number, y: number, width: number, lineHeight: number): number {
  let line = '';
  for (const word of text.split(' ')) {
    const trial = line ? `${line} ${word}` : word;
    if (ctx.measureText(trial).width > width && line) {
      ctx.fillText(line, x, y);
      y += lineHeight;
      line = word;
    } else line = trial;
  }
  if (line) ctx.fillText(line, x, y);
  return y + lineHeight;
}

/** The build card as a PNG: title and date, schematic, chart, figures, ratings, comparison, and the safety caution. */
export async function buildCardPng(s: WorkbenchState, chart: SVGSVGElement, schematic: SVGSVGElement | null, date = new Date()): Promise<Blob> {
  const canvas = document.createElement('canvas');
  canvas.width = CARD_WIDTH;
  canvas.height = CARD_HEIGHT;
  const ctx = canvas.getContext('2d')!;
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, CARD_WIDTH, CARD_HEIGHT);
  ctx.fillStyle = '#1d2329';
  ctx.textBaseline = 'top';
  ctx.font = `bold 40px ${EXPORT_FONTS}`;
  let y = wrapText(ctx, s.title || 'Untitled design', MARGIN, MARGIN, 700, 46);
  ctx.font = `22px ${EXPORT_FONTS}`;
  ctx.fillStyle = '#4a535c';
  ctx.fillText(`Quiescent build card · ${date.toISOString().slice(0, 10)}`, MARGIN, y);
  y += 40;
  const schematicTop = MARGIN;
  if (schematic) {
    const doc = svgDocument(schematic);
    const img = await svgImage(doc.text);
    const w = 400;
    ctx.drawImage(img, CARD_WIDTH - MARGIN - w, schematicTop, w, (w * doc.height) / doc.width);
    y = Math.max(y, schematicTop + (w * doc.height) / doc.width + 10);
  }
  const chartDoc = svgDocument(chart);
  const chartImg = await svgImage(chartDoc.text);
  const cw = CARD_WIDTH - 2 * MARGIN;
  // The chart takes at most 40 % of the page, so the figures, ratings and a comparison fit below it.
  const ch = Math.min((cw * chartDoc.height) / chartDoc.width, CARD_HEIGHT * 0.4);
  const chartW = (ch * chartDoc.width) / chartDoc.height;
  ctx.drawImage(chartImg, MARGIN + (cw - chartW) / 2, y, chartW, ch);
  y += ch + 20;
  ctx.fillStyle = '#1d2329';
  // The design's own figures on the left; a comparison, when there is one, in a column on the right.
  const sections = cardSections(s);
  // The design's own figures on the left; parts and any comparison on the right.
  const columns = [sections.slice(0, 4), sections.slice(4)];
  const colWidth = columns.length > 1 ? cw / 2 - 12 : cw;
  const top = y;
  columns.forEach((column, c) => {
    let cy = top;
    const x = MARGIN + c * (colWidth + 24);
    for (const section of column) {
      if (cy > CARD_HEIGHT - 140) break;
      ctx.font = `bold 21px ${EXPORT_FONTS}`;
      cy = wrapText(ctx, section.heading, x, cy, colWidth, 27) + 2;
      ctx.font = `17px ${EXPORT_FONTS}`;
      for (const line of section.lines) {
        if (cy > CARD_HEIGHT - 120) break;
        cy = wrapText(ctx, line, x + 10, cy, colWidth - 10, 22);
      }
      cy += 8;
    }
  });
  ctx.fillStyle = '#b42318';
  ctx.font = `bold 18px ${EXPORT_FONTS}`;
  wrapText(ctx, 'Danger: lethal voltages. Discharge capacitors before touching; follow local electrical codes and licensed practice. Figures are a design aid from a model.', MARGIN, CARD_HEIGHT - 80, cw, 24);
  return canvasBlob(canvas);
}
