import { formatValue, TARGET_LABELS, type TargetName } from '../../src/index';
import { marginWords } from '../ui/targets/marginWords';
import { targetWithValue } from '../ui/targets/targetValue';
import { dB, decibels, farads, mAPerV, meterVolts, milliamps, ohms, plain, rmsLevel, smallVolts, volts, watts, voltsRms } from '../format';
import { COMPARE_ROWS } from '../ui/panels/ComparePanel';
import { AMPLIFIER_COMPARE_ROWS } from '../ui/panels/AmplifierCompare';
import type { AmplifierView } from '../store/amplifierChain';
import { buildSheetOf, railOf } from '../store/buildSheet';
import { heaterWindingsOf } from '../store/heaterPlan';
import { tubesToOrderLine } from '../store/tubesToOrder';
import { benchIndex } from '../store/stagePlans';
import { IDLE_VOLTAGES_WORDS, idleRowsFor, idleVoltagesOf } from '../store/idleVoltages';
import { feedbackPartLine } from '../ui/chain/feedbackPart';
import { feedbackBrief } from '../ui/chain/feedbackWords';
import type { WorkbenchState } from '../store/workbenchStore';
import { canvasBlob, EXPORT_FONTS, svgDocument, svgImage } from './chartImage';
import { drivenOutputSection, outputCardSections } from './outputCard';
import { dividerWords, elevationAdvice } from '../ui/panels/elevationAdvice';
import { elevationOf } from '../store/heaterChoice';
import { outputMeterWords, triodeMeterLines } from '../ui/panels/meterWords';
import type { TriodeBox } from '../store/meterPlan';
import { shownMeterRows } from '../store/meterRows';
import { ratingsLines } from './ratingsLines';
import { amplifierSection, leakWords, otherStageSections, partLines } from './amplifierLines';
import { supplySection } from './supplyLines';
import { biasSection, supplyPartLines } from './supplyPartsLines';

/** A4 portrait at 150 dots per inch: 210 × 297 mm. Letter paper prints it with a little white at the bottom. */
export const CARD_WIDTH = 1240;
export const CARD_HEIGHT = 1754;
const MARGIN = 60;

/** Everything the card shows, as lines of text, gathered from the store (the model already computed it). */
export function cardSections(s: WorkbenchState): { heading: string; lines: string[] }[] {
  const amplifier = amplifierSection(s);
  const supply = supplySection(s);
  const stageSections = s.design.stageKind === 'output' ? [...outputCardSections(s), ...targetSections(s), ...voltagePartsSections(s)] : voltageCardSections(s);
  const supplyParts = supplyPartLines(s);
  // The tubes once for the whole design, whichever bench the card is made from (no stage's section repeats them).
  const tubes = { heading: 'Tubes to order', lines: [tubesToOrderLine(s)] };
  const idle = idleVoltageSection(s);
  const bias = biasSection(s);
  const readings = meterSection(s);
  return [...(amplifier ? [amplifier] : []), ...(supply ? [supply] : []), ...stageSections, tubes, ...(supplyParts.length ? [{ heading: 'B+ supply: parts to order', lines: supplyParts }] : []), ...(bias ? [bias] : []), ...(idle ? [idle] : []), ...(readings ? [readings] : [])];
}

/** A triode stage's box as the card's line names it. */
const CARD_BOX_WORDS: Record<TriodeBox, string> = { supply: 'supply', plate: 'plate', plate2: 'second plate', cathode: 'cathode' };

/** The builder's meter readings, each with what the model makes of it: the bench notes of the amplifier as built. */
function meterSection(s: WorkbenchState): { heading: string; lines: string[] } | null {
  const { triodes, outputs } = shownMeterRows(s, s.design.stageKind === 'output');
  const lines = [
    ...triodes.flatMap((r) => {
      if (!r.reading || !r.readout) return [];
      const g = r.reading;
      const read = r.boxes.map((b) => `${CARD_BOX_WORDS[b]} ${meterVolts(g[b] ?? 0)}`).join(', ');
      return [`${r.name}, read ${read}: ${r.readout.ok ? triodeMeterLines(r.readout, r).join(' ') : r.readout.message}`];
    }),
    ...outputs.flatMap((r) => {
      if (!r.reading || !r.readout) return [];
      const g = r.reading;
      const read = [`plate ${meterVolts(g.plate)}`, ...(g.screen !== null ? [`screen ${meterVolts(g.screen)}`] : []), ...(r.bias === 'fixed' ? [`grid ${meterVolts(g.grid)}`, `sense resistor ${smallVolts(g.cathode)}`] : [`cathode ${meterVolts(g.cathode)}`])].join(', ');
      return [`${r.name}, read ${read}: ${r.readout.ok ? outputMeterWords(r.readout, r) : r.readout.message}`];
    }),
  ];
  return lines.length > 0 ? { heading: 'Meter readings, as built', lines } : null;
}

/** Each stage's electrode voltages at idle, chassis to each: the figures to check at first switch-on. */
function idleVoltageSection(s: WorkbenchState): { heading: string; lines: string[] } | null {
  const idle = idleVoltagesOf(s);
  if (!idle) return null;
  const lines = idleRowsFor(idle, s.design.stageKind === 'output').map((r) => {
    const plate = r.pins.plate2 === null ? `plate ${meterVolts(r.pins.plate)}` : `plates ${meterVolts(r.pins.plate)} and ${meterVolts(r.pins.plate2)}`;
    const screen = r.pins.screen === null ? '' : `, screen ${meterVolts(r.pins.screen)}`;
    return `${r.name}${r.eachTube ? ' (each tube)' : ''}: B+ ${meterVolts(r.bplus)}, ${plate}, cathode ${meterVolts(r.pins.cathode)}, grid ${meterVolts(r.pins.grid)}${screen}; Ia ${milliamps(r.ia)}${r.pins.plate2Current === null ? '' : ` and ${milliamps(r.pins.plate2Current)}`}`;
  });
  return { heading: 'Voltages to check at first switch-on', lines: [...lines, IDLE_VOLTAGES_WORDS] };
}

/** The builder's targets, each with how the stage on the bench meets it. */
function targetSections(s: WorkbenchState): { heading: string; lines: string[] }[] {
  const v = s.verdict;
  if (!v?.ok || Object.keys(v.margins).length === 0) return [];
  return [{ heading: 'Targets', lines: (Object.keys(v.margins) as TargetName[]).map((k) => `${v.margins[k]! >= 0 ? 'Met' : 'MISSED'}: ${targetWithValue(TARGET_LABELS[k], k, v.values[k])}, ${marginWords(v.margins[k]!)}`) }];
}

/** With the output stage on the bench, the voltage stages that drive it still go on the card: each one's parts, with their own ratings. */
function voltagePartsSections(s: WorkbenchState): { heading: string; lines: string[] }[] {
  if (!s.design.drivesOutput) return [];
  return otherStageSections(s, buildSheetOf(s));
}

function voltageCardSections(s: WorkbenchState): { heading: string; lines: string[] }[] {
  const sol = s.analysis.solution;
  const d = s.design;
  const sig = s.analysis.signal;
  const build = buildSheetOf(s);
  const sections = [
    {
      heading: build.stages.length > 1 ? `${build.stages.find((st) => st.onBench)?.title ?? 'Stage'} (on the bench)` : 'Stage',
      lines: [
        `${d.tubeId}, B+ ${volts(d.bplus)}, Ra ${ohms(d.ra)}, Rk ${ohms(d.rk)}${d.bypassed ? ` bypassed${d.ck ? ` by ${farads(d.ck)}` : ''}` : ' unbypassed'}`,
        `RL ${Number.isFinite(d.rl) ? ohms(d.rl) : 'none'}, Rs ${ohms(d.rsource)}, Cin ${d.cin ? farads(d.cin) : 'none'}, ${leakWords(d.rg, d.volume)}${d.rstopper ? `, grid stopper ${ohms(d.rstopper)}` : ''}, Cout ${d.cout ? farads(d.cout) : 'none'}`,
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
        sig.swing.output.rms === 0 ? 'No clean output: the grid has no bias' : `Clean output ${rmsLevel(sig.swing.output, 'dBu')}, clips by ${sig.swing.limitedBy === 'grid-current' ? 'grid current' : 'cutoff'}`,
        sig.distortion.ok
          ? `At ${voltsRms(d.levelRms)} out: THD ${plain(sig.distortion.thdPercent)} %, H2 ${dB(sig.distortion.harmonicsDb[0]!)}, H3 ${dB(sig.distortion.harmonicsDb[1]!)}`
          : sig.distortion.message,
        `−3 dB: ${sig.corners.lowHz ? formatValue(sig.corners.lowHz, 'Hz') : 'DC'} to ${sig.corners.highHz ? formatValue(sig.corners.highHz, 'Hz') : 'beyond 1 GHz'}`,
        sig.atThd.ok ? `Output at ${plain(100 * d.thdLimit)} % THD: ${voltsRms(sig.atThd.outputRms)} (${sig.atThd.limitedBy === 'curvature' ? 'within the clean swing' : `past the clean swing, ${sig.atThd.limitedBy === 'grid-current' ? 'grid current' : 'cutoff'}`})` : sig.atThd.message,
      ],
    },
  ];
  sections.push(...targetSections(s));
  const chain = sig.chain?.ok ? sig.chain : null;
  const link = chain?.links[1];
  if (chain && link) {
    // Numbered by its place in the amplifier: right after the bench's stage.
    const n = benchIndex(d) + 2;
    sections.push({
      heading: link.kind === 'follower' ? `Stage ${n}: ${d.stage2.tubeId} cathode follower, ${d.stage2.coupling ? 'capacitor-coupled' : 'direct-coupled'}` : `Stage ${n}: ${d.stage2.tubeId} gain stage, capacitor-coupled`,
      lines: [
        link.kind === 'follower'
          ? `Rk ${ohms(d.stage2.rk)}${d.stage2.coupling ? `; Cc ${farads(d.stage2.coupling.cc)} into Rg ${ohms(d.stage2.coupling.rg)}, grid held at ${volts(d.stage2.coupling.vbias)}` : ''}${d.stage2.rstopper ? `; grid stopper ${ohms(d.stage2.rstopper)}` : ''}`
          : `Ra ${ohms(d.stage2.ra)}, Rk ${ohms(d.stage2.rk)} bypassed, Rg ${ohms(d.stage2.rg)}`,
        `Va ${volts(link.op.va)}, Vk ${volts(link.op.vk)}, Ia ${milliamps(link.op.ia)}, Vgk ${volts(link.op.vgk)}, Pa ${watts(link.op.pa)}`,
        `Gain ${plain(link.gain)} ×, Zout ${ohms(link.zout)}${link.kind === 'follower' ? `, heater–cathode ${volts(link.vhk)}` : ''}`,
        `Both stages: gain ${plain(chain.gain)} × (${chain.inverting ? 'inverting' : 'not inverting'}), clean output ${voltsRms(chain.output.rms)}`,
      ],
    });
  }
  sections.push(...otherStageSections(s, build));
  const output = drivenOutputSection(s);
  if (output) sections.push(output);
  sections.push({ heading: 'Ratings, every stage', lines: ratingsLines(s) });
  const windings = heaterWindingsOf(s);
  const windingLines = windings.ok
    ? [
        ...windings.windings.map((w, i) => `Winding ${plain(w.volts)} V, ${plain(w.amps)} A (${plain(w.va)} VA): ${w.feeds.join(', ')}${w.atBplus ? ', at B+' : ''}${windings.held[i] ? `, held at ${plain(windings.heldVolts)} V` : ''}`),
        ...(windings.dc ? [`DC heater supply ${plain(windings.dc.volts)} V, ${plain(windings.dc.amps)} A: ${windings.dc.feeds.join(', ')}${windings.heldVolts !== 0 ? `, held at ${plain(windings.heldVolts)} V` : ''}`] : []),
      ]
    : [windings.message];
  const held = elevationOf(s.design.heaters);
  const divider = build.elevationDivider;
  sections.push({ heading: 'Heaters', lines: [build.elevation.ok ? elevationAdvice(build.elevation, held) : build.elevation.message, ...(divider ? [dividerWords(divider)] : []), ...windingLines] });
  sections.push({
    heading: 'Parts to order',
    lines: [
      ...build.stages.filter((st) => st.onBench).flatMap(partLines),
      feedbackPartLine(s) ?? '',
      divider?.divider.ok ? `Heater elevation ${divider.divider.resistors.map((r) => `${r.ref} ${ohms(r.preferred)} ${r.ratingWatts} W`).join(', ')}, Ch ${farads(divider.divider.capacitor.value ?? 0)} ${divider.divider.capacitor.ratingVolts} V` : '',
      build.dropper?.ok && build.dropper.preferred > 0 ? `Heater dropper ${ohms(build.dropper.preferred)} ${build.dropper.ratingWatts} W from the ${plain(s.design.heaters.dcVolts)} V DC supply${s.design.supply.channels > 1 ? `, one for each channel (${s.design.supply.channels})` : ''}` : '',
      // With the supply solved its own ladder filters the stages (its parts are listed with it): the one-section estimate is not theirs.
      build.filter.ok && !s.design.supply.on ? `B+ filter ${ohms(s.buildInputs.filterR)} / ${farads(s.buildInputs.filterC)} from ${volts(railOf(s))}: drop ${volts(build.filter.dropVolts)}, ripple ${build.filter.ripple100Db.toFixed(0)} dB at 100 Hz` : '',
    ].filter(Boolean),
  });
  const r = s.rivalAnalysis;
  if (s.rival.on && r?.ok) {
    sections.push({
      heading: `Compared: ${s.analysis.tube.id} against ${r.tube.id} (${s.rival.mode === 'same-parts' ? 'same parts' : 'each its own values'})`,
      lines: COMPARE_ROWS.map((row) => {
        const a = row.value(s.analysis);
        const b = row.value(r);
        return `${row.label}: ${a === null ? '—' : row.show(a)}  |  ${b === null ? '—' : row.show(b)}`;
      }).concat(amplifierCompareLines(s)),
    });
  }
  return sections;
}

/** The text as it fits a width on one line: whole, or cut between words with an ellipsis. */
function cutToWidth(ctx: CanvasRenderingContext2D, text: string, width: number): string {
  if (ctx.measureText(text).width <= width) return text;
  const words = text.split(' ');
  while (words.length > 1 && ctx.measureText(`${words.join(' ')} …`).width > width) words.pop();
  return `${words.join(' ')} …`;
}

/** The whole amplifier with each tube in the bench's socket, as the compare panel shows it; none without a chain. */
function amplifierCompareLines(s: WorkbenchState): string[] {
  const a = s.amplifier;
  const b = s.rivalAmplifier;
  if (!a?.result.ok || !b?.result.ok) return [];
  const solved = (v: AmplifierView) => v as AmplifierView & { result: { ok: true } };
  const rows = AMPLIFIER_COMPARE_ROWS.map((row) => `In the amplifier, ${row.label.toLowerCase()}: ${row.show(solved(a))}  |  ${row.show(solved(b))}`);
  const fa = feedbackBrief(a);
  const fb = feedbackBrief(b);
  return fa || fb ? [...rows, `In the amplifier, with feedback: ${fa ?? '—'}  |  ${fb ?? '—'}`] : rows;
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

/** The most A4 pages a card may run to: past them a note names what is left (the screen has it all). */
export const MAX_CARD_PAGES = 4;
/** Where a page's text stops, above the caution at its foot (a line may wrap below its start: 66 px kept). */
const TEXT_BOTTOM = CARD_HEIGHT - 120 - 66;
/** The whole amplifier's drawing on the card is at most this tall (a short chain is drawn at full width, a long one scaled to fit). */
const CHAIN_MAX_HEIGHT = 330;
/** Where text starts on the pages after the first, below their running title. */
const CONTINUED_TOP = MARGIN + 50;

/**
 * The build card as a PNG of one A4 page or more, stacked: title and date,
 * the schematic (the whole amplifier's across the page when it has more than
 * one stage, else the bench's stage beside the title), chart, then the figures in two columns (the stages' own on the
 * left; ratings, heaters, parts and any comparison on the right), each
 * column running on to the next page when it fills one (the right one into
 * both halves of a page the left no longer reaches), every page with the
 * safety caution at its foot. Past MAX_CARD_PAGES a note names what is left.
 */
export async function buildCardPng(s: WorkbenchState, chart: SVGSVGElement, schematic: SVGSVGElement | null, date = new Date(), chain: SVGSVGElement | null = null): Promise<Blob> {
  const canvas = document.createElement('canvas');
  canvas.width = CARD_WIDTH;
  canvas.height = CARD_HEIGHT * MAX_CARD_PAGES;
  const ctx = canvas.getContext('2d')!;
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, CARD_WIDTH, canvas.height);
  ctx.fillStyle = '#1d2329';
  ctx.textBaseline = 'top';
  ctx.font = `bold 40px ${EXPORT_FONTS}`;
  const title = s.title || 'Untitled design';
  // The title runs beside the bench stage's drawing, or across the page above the whole amplifier's.
  let y = wrapText(ctx, title, MARGIN, MARGIN, chain ? CARD_WIDTH - 2 * MARGIN : 700, 46);
  ctx.font = `22px ${EXPORT_FONTS}`;
  ctx.fillStyle = '#4a535c';
  ctx.fillText(`Quiescent build card · ${date.toISOString().slice(0, 10)}`, MARGIN, y);
  y += 40;
  const schematicTop = MARGIN;
  if (chain) {
    // The whole amplifier, input to speaker, across the page under the title (the bench's stage is marked in it).
    const doc = svgDocument(chain);
    const img = await svgImage(doc.text);
    const maxW = CARD_WIDTH - 2 * MARGIN;
    const h = Math.min((maxW * doc.height) / doc.width, CHAIN_MAX_HEIGHT);
    const w = (h * doc.width) / doc.height;
    ctx.drawImage(img, MARGIN, y, w, h);
    y += h + 16;
  } else if (schematic) {
    const doc = svgDocument(schematic);
    const img = await svgImage(doc.text);
    const w = 400;
    ctx.drawImage(img, CARD_WIDTH - MARGIN - w, schematicTop, w, (w * doc.height) / doc.width);
    y = Math.max(y, schematicTop + (w * doc.height) / doc.width + 10);
  }
  const chartDoc = svgDocument(chart);
  const chartImg = await svgImage(chartDoc.text);
  const cw = CARD_WIDTH - 2 * MARGIN;
  // The chart takes at most 40 % of the first page; the figures run on below it and onto more pages.
  const ch = Math.min((cw * chartDoc.height) / chartDoc.width, CARD_HEIGHT * 0.4);
  const chartW = (ch * chartDoc.width) / chartDoc.height;
  ctx.drawImage(chartImg, MARGIN + (cw - chartW) / 2, y, chartW, ch);
  y += ch + 20;
  ctx.fillStyle = '#1d2329';
  const sections = cardSections(s);
  const split = sections.findIndex((x) => x.heading.startsWith('Ratings'));
  const columns = [sections.slice(0, split), sections.slice(split)];
  const colWidth = cw / 2 - 12;
  let pages = 1;
  // The last page the left column reaches: past it the right column runs on in the left half first, then the right,
  // so a long list of parts does not leave half of each page after the stages' figures blank.
  let leftLast = 0;
  columns.forEach((column, c) => {
    const right = MARGIN + c * (colWidth + 24);
    let x = right;
    let page = 0;
    let cy = y;
    // Room for a block of `need` px here, or at the top of the next slot (this page's right half, or the next page);
    // false past the last page.
    const room = (need: number): boolean => {
      if (cy + need <= page * CARD_HEIGHT + TEXT_BOTTOM) return true;
      if (c === 1 && x !== right) {
        x = right;
        cy = page * CARD_HEIGHT + CONTINUED_TOP;
        return true;
      }
      if (page + 1 >= MAX_CARD_PAGES) return false;
      page += 1;
      cy = page * CARD_HEIGHT + CONTINUED_TOP;
      if (c === 1 && page > leftLast) x = MARGIN;
      return true;
    };
    for (const [n, section] of column.entries()) {
      if (!room(27 + 22)) {
        ctx.font = `17px ${EXPORT_FONTS}`;
        wrapText(ctx, `… did not fit: ${column.slice(n).map((x) => x.heading).join(', ')} (see the screen)`, x, cy, colWidth, 22);
        break;
      }
      ctx.font = `bold 21px ${EXPORT_FONTS}`;
      cy = wrapText(ctx, section.heading, x, cy, colWidth, 27) + 2;
      ctx.font = `17px ${EXPORT_FONTS}`;
      for (const [k, line] of section.lines.entries()) {
        if (!room(22)) {
          // Never drop lines without a word: say how many did not fit.
          ctx.fillText(`… ${section.lines.length - k} more: see the build sheet on screen`, x + 10, cy);
          cy += 22;
          break;
        }
        cy = wrapText(ctx, line, x + 10, cy, colWidth - 10, 22);
      }
      cy += 8;
    }
    if (c === 0) leftLast = page;
    pages = Math.max(pages, page + 1);
  });
  for (let p = 0; p < pages; p++) {
    if (p > 0) {
      ctx.fillStyle = '#4a535c';
      ctx.font = `20px ${EXPORT_FONTS}`;
      // The page's number at the right; the title before it, cut between words to what is left (a long amplifier's ran off the page).
      const number = `build card, page ${p + 1} of ${pages}`;
      const numberWidth = ctx.measureText(number).width;
      ctx.fillText(number, CARD_WIDTH - MARGIN - numberWidth, p * CARD_HEIGHT + MARGIN);
      ctx.fillText(cutToWidth(ctx, title, cw - numberWidth - 24), MARGIN, p * CARD_HEIGHT + MARGIN);
    }
    ctx.fillStyle = '#b42318';
    ctx.font = `bold 18px ${EXPORT_FONTS}`;
    wrapText(ctx, 'Danger: lethal voltages. Discharge capacitors before touching; follow local electrical codes and licensed practice. Figures are a design aid from a model.', MARGIN, p * CARD_HEIGHT + CARD_HEIGHT - 80, cw, 24);
  }
  // The pages used, as one image: A4 after A4.
  const out = document.createElement('canvas');
  out.width = CARD_WIDTH;
  out.height = CARD_HEIGHT * pages;
  out.getContext('2d')!.drawImage(canvas, 0, 0);
  return canvasBlob(out);
}
