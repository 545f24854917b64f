import { outputPartsList } from '../../src/index';
import { farads, mAPerV, milliamps, ohms, percentOf, plain, volts, watts } from '../format';
import { comparedSection, pairCardSections } from './pairCard';
import type { WorkbenchState } from '../store/workbenchStore';
import { ratingsLines } from './ratingsLines';
import { windingLines } from '../ui/output/windingWords';
import { biasLines } from '../ui/output/biasWords';
import { stopperLine } from '../ui/output/stopperWords';
import { tubeSpreadLine } from '../ui/output/TubeSpreadFigures';
import { screensNodeLine } from '../ui/output/screenNodeWords';

/** The build card's text for the output stage, from what the model already computed. */
export function outputCardSections(s: WorkbenchState): { heading: string; lines: string[] }[] {
  const b = s.outputBench;
  if (b.pair === 'push-pull') return pairCardSections(s, b);
  const a = b.analysis;
  const { op, tube, design: o } = a.solution;
  const r = tube.ratings;
  const parts = outputPartsList(a, s.design.series);
  const t = parts.transformer;
  const screen =
    op.connection === 'pentode' ? `screen at ${volts(o.screenVolts)}` : op.connection === 'ultralinear' ? `screen on a ${percentOf(o.ulTap)} tap` : tube.law.kind === 'pentode' ? 'screen tied to plate' : 'power triode';
  const sections = [
    {
      heading: 'Output stage',
      lines: [
        `${tube.id} single-ended, ${screen}, ${o.bias === 'cathode' ? `cathode bias Rk ${ohms(o.rk)} (bypassed)` : `fixed bias ${volts(o.vg)}`}`,
        `B+ ${volts(o.bplus)}, primary ${ohms(o.zPrimary)} (DCR ${ohms(o.rPrimary)}) into ${ohms(o.speakerOhms)}, turns ${plain(a.turnsRatio)} : 1`,
      ],
    },
    {
      heading: 'Operating point',
      lines: [
        `Vpk ${volts(op.vpk)}, Ia ${milliamps(op.ip)}${op.ig2 > 0 && op.connection !== 'triode' ? `, Ig2 ${milliamps(op.ig2)}` : ''}, Vgk ${volts(op.vgk)}`,
        `Pa ${watts(op.pa)} (${Math.round((100 * op.pa) / r.maxPlateDissipation)} % of ${r.maxPlateDissipation} W)${r.maxScreenDissipation !== null && op.connection !== 'triode' ? `, Pg2 ${watts(op.pg2)} at idle (${Math.round((100 * op.pg2) / r.maxScreenDissipation)} % of ${r.maxScreenDissipation} W)` : ''}`,
        `rp as wired ${ohms(op.rp)}, gm ${mAPerV(op.gm)}, damping factor ${plain(a.dampingFactor, 2)}`,
      ],
    },
    {
      heading: 'Power and distortion',
      lines: [
        `At the onset of ${a.clean.limitedBy}: ${watts(a.clean.at.power)} at ${percentOf(a.clean.at.thd)} THD, drive ${volts(a.clean.at.drive / Math.SQRT2)} rms`,
        `Grid to 0 V${o.bias === 'cathode' ? ' at the idle bias' : ''}: ${watts(a.full.power)} at ${percentOf(a.full.thd)} THD (H2 ${percentOf(a.full.harmonics[2] ?? 0)}, H3 ${percentOf(a.full.harmonics[3] ?? 0)})`,
        tubeSpreadLine(a.spread, a.solution.tube.ratings.maxPlateDissipation, false),
        a.settledCathode ? `Rk settles under full drive at Vk ${volts(a.settledCathode.vk)} (${volts(a.settledCathode.idleVk)} idle): ${watts(a.settledCathode.full.power)} at ${percentOf(a.settledCathode.full.thd)} THD with the grid to 0 V there, ${volts(a.settledCathode.full.drive / Math.SQRT2)} rms drive` : '',
        a.atLimit ? `Within ${percentOf(o.thdLimit)} THD: ${watts(a.atLimit.power)}` : '',
        a.zSweep ? `Best primary at this point: ${ohms(a.zSweep.best.zPrimary)} for ${watts(a.zSweep.best.power)} within ${percentOf(a.zSweep.limit)} THD` : '',
      ].filter(Boolean),
    },
    { heading: 'Ratings, every stage', lines: ratingsLines(s) },
    {
      heading: 'Parts to order',
      lines: [
        `Output transformer: ${ohms(t.primary)} to ${ohms(t.secondary)}, ${milliamps(t.dcCurrent)} DC in the primary, at least ${watts(t.power)}${t.screenTap !== null ? `, screen tap ${percentOf(t.screenTap)}` : ''}`,
        ...windingLines(s.design.output),
        ...[screensNodeLine(s.design)].filter((x) => x !== null),
        ...biasLines(parts.biasAdjustment, 1),
        stopperLine(parts.gridStopper, 1),
        ...parts.resistors.map((x) => `${x.ref}: ${ohms(x.preferred)} ${x.series}, ${x.ratingWatts} W (runs at ${watts(x.watts)})`),
        ...parts.capacitors.map((c) => `${c.ref}: ${c.value === null ? 'value to choose' : farads(c.value)} or more, ${c.ratingVolts} V${c.polarity ? `, ${c.polarity}` : ''}`),
        `Heater ${tube.heater.volts} V, ${tube.heater.amps} A`,
      ],
    },
  ];
  sections.push(...comparedSection(s));
  return sections;
}

/** What the driven output stage's section carries from its power figures: the clean limit and the grid driven to 0 V (the rest stays with the output stage's own card). */
const DRIVEN_POWER_LINES = 2;

/**
 * With a voltage stage on the bench, the output stage the stages drive still
 * goes on the card: its values, its operating point (each tube's, for a
 * pair) with its dissipation against the ratings, its power at the clean
 * limit and with the grid driven to 0 V, and its parts to order (the
 * screen's build sheet lists them too). Null when the stages stand apart
 * from it.
 */
export function drivenOutputSection(s: WorkbenchState): { heading: string; lines: string[] } | null {
  if (!s.design.drivesOutput) return null;
  const own = outputCardSections(s);
  const lines = (heading: string) => own.find((x) => x.heading === heading)?.lines ?? [];
  const values = lines('Output stage');
  const op = [...lines('Operating point'), ...lines('Operating point, each tube')];
  const power = lines('Power and distortion').slice(0, DRIVEN_POWER_LINES);
  return { heading: `Output stage, ${s.design.output.tubeId}`, lines: [...values, ...op, ...power, ...lines('Parts to order')] };
}
