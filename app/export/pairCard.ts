import { farads, milliamps, ohms, percentOf, plain, volts, watts } from '../format';
import { screensNodeLine } from '../ui/output/screenNodeWords';
import { compareCells } from '../ui/output/OutputComparePanel';
import { transformerLines } from '../ui/output/OutputPartsPanel';
import type { PushPullBench } from '../store/outputAnalysis';
import { outputPartsOf } from '../store/outputParts';
import { drivesPair, splitterName } from '../store/outputPlan';
import type { WorkbenchState } from '../store/workbenchStore';
import { ratingsLines } from './ratingsLines';
import { tubeSpreadLine } from '../ui/output/TubeSpreadFigures';

type Section = { heading: string; lines: string[] };

/** A harmonic as a percentage; under a millionth (a matched pair's even ones) it is the arithmetic's, not the pair's. */
const share = (x: number) => (x < 1e-6 ? 'below 0.0001 %' : percentOf(x));

/** The build card's text for a push-pull pair, from what the model already computed. */
export function pairCardSections(s: WorkbenchState, b: PushPullBench): Section[] {
  const a = b.settled;
  const sol = a.solution;
  const o = sol.design;
  const r = sol.tube.ratings;
  const f = a.figures;
  const plan = s.design.output;
  const [one, two] = sol.idle;
  const parts = outputPartsOf(s);
  const screen = sol.feed.kind === 'fixed' ? `screens at ${volts(o.screenVolts)}` : sol.feed.kind === 'tap' ? `screens on ${percentOf(o.ulTap)} taps` : sol.tube.law.kind === 'pentode' ? 'screens tied to plates' : 'power triodes';
  const sections: Section[] = [
    {
      heading: 'Output stage',
      lines: [
        `Two ${sol.tube.id} in push-pull, ${screen}, ${o.bias === 'cathode' ? `cathode bias, Rk ${ohms(o.rk)} shared (bypassed)` : `fixed bias ${volts(o.vg)}`}${plan.mismatch || plan.idleMismatch ? `, the second tube's gm ${percentOf(plan.mismatch)} and idle ${percentOf(plan.idleMismatch)} above the first's` : ''}`,
        `B+ ${volts(o.bplus)} at the centre tap, ${ohms(o.raa)} plate to plate (DCR ${ohms(o.rPrimary)}) into ${ohms(o.speakerOhms)}, turns ${plain(a.turnsRatio)} : 1`,
        drivesPair(s.design)
          ? `The grids are driven in antiphase by the ${splitterName(s.design.output.splitter)} phase splitter (its parts with the other stages')`
          : 'The grids are driven in antiphase: join the voltage stages to the output stage to design the phase splitter that does it',
      ],
    },
    {
      heading: 'Operating point, each tube',
      lines: [
        `Vpk ${volts(one.vpk)}, Ia ${milliamps(one.ip)}${plan.mismatch || plan.idleMismatch ? ` and ${milliamps(two.ip)}` : ''}, Vgk ${volts(sol.vgk)}${sol.vk > 0 ? `, Vk ${volts(sol.vk)}` : ''}`,
        `Pa ${watts(Math.max(one.pa, two.pa))} at idle (${Math.round((100 * Math.max(one.pa, two.pa)) / r.maxPlateDissipation)} % of ${r.maxPlateDissipation} W)${f ? `, worst under drive ${watts(f.worstPlate.watts)}` : ''}`,
        `B+ current ${milliamps(a.supplyCurrent.idle)} at idle, ${milliamps(a.supplyCurrent.full)} with the grids driven to 0 V`,
      ],
    },
    {
      heading: 'Power and distortion',
      lines: [
        `Grids to 0 V: ${watts(a.full.power)} at ${percentOf(a.full.thd)} THD (H2 ${share(a.full.harmonics[2] ?? 0)}, H3 ${share(a.full.harmonics[3] ?? 0)}), ${volts(a.full.drive / Math.SQRT2)} rms per grid`,
        tubeSpreadLine(a.spread, a.solution.tube.ratings.maxPlateDissipation, true),
        a.settledBias ? `The shared Rk settles under full drive at Vk ${volts(a.settledBias.vk)} (${volts(a.settledBias.idleVk)} idle): ${watts(a.settledBias.full.power)} at ${percentOf(a.settledBias.full.thd)} THD with the grids to 0 V there, ${volts(a.settledBias.full.drive / Math.SQRT2)} rms per grid` : '',
        f ? (f.overThdEverywhere ? `Over ${percentOf(o.thdLimit)} THD at every level (crossover)` : `Within ${percentOf(o.thdLimit)} THD: ${watts((f.atThdLimit ?? f.atZeroGrid).power)}`) : '',
        f ? (f.classABFrom === null ? 'Class A to 0 V on the grids' : `Class AB from ${volts(f.classABFrom)} peak per grid`) : '',
        f?.dampingFactor ? `Damping factor ${plain(f.dampingFactor, 2)}` : '',
      ].filter(Boolean),
    },
    { heading: 'Ratings, every stage', lines: ratingsLines(s) },
    {
      heading: 'Parts to order',
      lines: [
        ...transformerLines(parts, s.design.output),
        ...[screensNodeLine(s.design)].filter((x) => x !== null),
        ...parts.resistors.map((x) => `${x.ref}: ${ohms(x.preferred)} ${x.series}, ${x.ratingWatts} W (runs at ${watts(x.watts)})`),
        ...parts.capacitors.map((c) => `${c.ref}: ${c.value === null ? 'value to choose' : farads(c.value)} or more, ${c.ratingVolts} V${c.polarity ? `, ${c.polarity}` : ''}`),
        `Heaters: two tubes, each ${sol.tube.heater.volts} V, ${sol.tube.heater.amps} A`,
      ],
    },
  ];
  sections.push(...comparedSection(s));
  return sections;
}

/** Two output tubes in the same sockets, when compared: the on-screen table's rows. */
export function comparedSection(s: WorkbenchState): Section[] {
  const rival = s.outputRivalBench;
  if (!s.outputRival.on || !rival || !rival.ok) return [];
  return [
    {
      heading: `Compared: ${s.outputBench.analysis.solution.tube.id} against ${rival.analysis.solution.tube.id} (same parts)`,
      lines: compareCells(s.outputBench, rival).map((c) => `${c.label}: ${c.a}  |  ${c.b}`),
    },
  ];
}
