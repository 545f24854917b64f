import { formatValue, parseValue } from '../../src/index';
import type { OutputPlan, SplitterPlan } from './outputPlan';
import type { BenchDesign } from './analysis';
import type { FollowerCoupling } from '../../src/index';
import { followerCouplingFor } from './stagePlans';
import { targetPlanOf, withTargetPlan, type TargetPlan } from './targetPlan';
import { DESIGN_LIMITS as L, type Limit } from './designLimits';

/** The design values a user types; each has one definition of how it is read, checked, shown and stored. */
export type FieldName =
  | 'bplus' | 'ra' | 'rk' | 'rl' | 'rsource' | 'cin' | 'rg' | 'rstopper' | 'volume' | 'ck' | 'cout' | 'level' | 'thd' | 'ra2' | 'rk2' | 'rg2' | 'fRst' | 'sRst' | 'feedbackRf' | 'feedbackCf'
  | 'fCc' | 'fRg' | 'fVbias'
  | 'oBplus' | 'oScreen' | 'oTap' | 'oZ' | 'oRpri' | 'oLp' | 'oLl' | 'oRk' | 'oVg' | 'oRg' | 'oSpeaker' | 'oThd' | 'oRaa' | 'oMismatch' | 'oIdleMismatch'
  | 'sBplus' | 'sRa' | 'sRa2' | 'sRk' | 'sRtail' | 'sVgrid' | 'sRg' | 'sCc'
  | 'tGain' | 'tClean' | 'tThdLevel' | 'tThd' | 'tDiss' | 'tZout' | 'tRaMin' | 'tRaMax' | 'tRkMin' | 'tRkMax' | 'tHeadroom'
  | 'tPower' | 'tPowerThd' | 'tThdPower' | 'tThdAtPower' | 'tBplusMin' | 'tBplusMax';

type Read = (text: string) => { ok: true; value: number | null } | { ok: false; message: string };

export interface FieldDef {
  readonly label: string;
  readonly unit: string;
  /** Example shown as the input's placeholder. */
  readonly example: string;
  readonly read: Read;
  /** The text shown for a value the design holds. */
  readonly show: (value: number | null) => string;
  readonly get: (d: BenchDesign) => number | null;
  readonly put: (d: BenchDesign, value: number | null) => BenchDesign;
}

/** Reads a value in the field's range (DESIGN_LIMITS); 0 where the range allows no part; "none" where a field may be empty. */
function ranged(label: string, range: Limit, opts: { none?: 'infinite' | 'null' } = {}): Read {
  const unit = range.unit;
  const allowZero = range.min === 0;
  const min = range.minPart ?? range.min;
  const max = range.max;
  return (text) => {
    const t = text.trim().toLowerCase();
    if (opts.none && (t === 'none' || t === '' || t === '∞')) return { ok: true, value: opts.none === 'infinite' ? Infinity : null };
    const r = parseValue(text);
    if (!r.ok) return r;
    const low = allowZero ? r.value < 0 : r.value <= 0;
    if (low) return { ok: false, message: `${label} must be ${allowZero ? '0 or more' : 'above 0'} ${unit}` };
    if (r.value < min && r.value !== 0) return { ok: false, message: `${label} must be at least ${formatValue(min, unit)}` };
    if (r.value > max) return { ok: false, message: `${label} must be at most ${formatValue(max, unit)}` };
    return r;
  };
}

/** A meter reading as typed ("252", "1.5"), in the range a reading may have. */
export const readMeterText = ranged('A reading', L.meter);

/** A fixed-bias grid's reading as typed ("-38", "−38"): at or below chassis. */
export const readGridMeterText: Read = (text) => {
  const r = parseValue(text.trim().replace(/^\u2212/, '-'));
  if (!r.ok) return r;
  if (r.value > 0) return { ok: false, message: 'A fixed-bias grid reads below chassis: type it with its minus sign, as −38' };
  if (r.value < L.meterGrid.min) return { ok: false, message: `A grid reading must be at least ${L.meterGrid.min} V` };
  return r;
};

/** Compact trade notation for an input box: 27000 → "27k", 1.2e-7 → "120n", 275 → "275". */
export const compact = (v: number | null) => (v === null ? 'none' : Number.isFinite(v) ? formatValue(v, '').replace('µ', 'u') : 'none');

const top = <K extends keyof BenchDesign>(key: K) => ({
  get: (d: BenchDesign) => d[key] as number | null,
  put: (d: BenchDesign, v: number | null) => ({ ...d, [key]: v }),
});
const second = <K extends 'ra' | 'rk' | 'rg'>(key: K) => ({
  get: (d: BenchDesign) => d.stage2[key],
  put: (d: BenchDesign, v: number | null) => ({ ...d, stage2: { ...d.stage2, [key]: v as number } }),
});

/** A capacitor-coupled follower's own coupling values (a direct-coupled one has none to show). */
const coupling = <K extends keyof FollowerCoupling>(key: K) => ({
  get: (d: BenchDesign) => d.stage2.coupling?.[key] ?? null,
  put: (d: BenchDesign, v: number | null) => ({ ...d, stage2: { ...d.stage2, coupling: { ...(d.stage2.coupling ?? followerCouplingFor(d.bplus)), [key]: v as number } } }),
});

const out = <K extends keyof OutputPlan>(key: K) => ({
  get: (d: BenchDesign) => d.output[key] as number,
  put: (d: BenchDesign, v: number | null) => ({ ...d, output: { ...d.output, [key]: v as number } }),
});

/** An output stage's value that may be left out (null: the ideal part's). */
const outOptional = <K extends 'primaryInductance' | 'leakageInductance'>(key: K) => ({
  get: (d: BenchDesign) => d.output[key] ?? null,
  put: (d: BenchDesign, v: number | null) => ({ ...d, output: { ...d.output, [key]: v } }),
});

const splitter = <K extends Exclude<keyof SplitterPlan, 'kind' | 'tubeId'>>(key: K) => ({
  get: (d: BenchDesign) => d.output.splitter[key],
  put: (d: BenchDesign, v: number | null) => ({ ...d, output: { ...d.output, splitter: { ...d.output.splitter, [key]: v as number } } }),
});

type NumericTarget = Exclude<keyof TargetPlan, 'heaterCathodeWithinRating'>;
const target = <K extends NumericTarget>(key: K) => ({
  get: (d: BenchDesign) => targetPlanOf(d)[key],
  put: (d: BenchDesign, v: number | null) => withTargetPlan(d, { ...targetPlanOf(d), [key]: v }),
});
/** A part that may be left out, held as 0: empty or "none" is 0. */
const noneIsZero = (read: Read): Read => (text) => (text.trim() === '' || text.trim().toLowerCase() === 'none' ? { ok: true, value: 0 } : read(text));
/** A target box: empty (or "none") leaves the target off. */
const optional = (read: Read): Read => (text) => (text.trim() === '' || text.trim().toLowerCase() === 'none' ? { ok: true, value: null } : read(text));
const showOptional = (show: (v: number | null) => string) => (v: number | null) => (v === null ? '' : show(v));

/** A share typed and shown in percent, held as a fraction. */
function percent(label: string, range: Limit): Read {
  const [min, max] = [range.min * 100, range.max * 100];
  return (text) => {
    const r = parseValue(text.replace('%', ''));
    if (!r.ok) return r;
    if (r.value < min || r.value > max) return { ok: false, message: `${label} must be from ${Number(min.toPrecision(3))} to ${Number(max.toPrecision(3))} %` };
    return { ok: true, value: r.value / 100 };
  };
}
const showPercent = (v: number | null) => (v === null ? '' : String(Number((v * 100).toPrecision(3))));

/** A setting in dB at or below full (0), as a volume control's. */
function decibelsBelowFull(label: string, range: Limit): Read {
  return (text) => {
    const r = parseValue(text.replace(/db$/i, '').trim());
    if (!r.ok) return r;
    if (r.value < range.min || r.value > range.max) return { ok: false, message: `${label} must be from ${String(range.min).replace('-', '−')} to ${range.max} dB below full (0 at full, e.g. −6)` };
    return r;
  };
}

/** A fixed grid bias: 0 V or negative. */
const gridBias: Read = (text) => {
  const r = parseValue(text);
  if (!r.ok) return r;
  if (r.value > 0) return { ok: false, message: 'Grid bias must be 0 V or negative, e.g. -20' };
  if (r.value < L.output.vg.min) return { ok: false, message: `Grid bias must be at least ${L.output.vg.min} V` };
  return r;
};

/** A grid stopper's box, wherever it stands: "none" (or empty) is none, else the stopper's range; it shows "none" for none. */
const stopper = { unit: 'Ω', read: noneIsZero(ranged('Grid stopper', L.rstopper)), show: (v: number | null) => (v ? compact(v) : 'none') };

export const FIELDS: Readonly<Record<FieldName, FieldDef>> = {
  bplus: { label: 'B+', unit: 'V', example: '275', read: ranged('B+', L.bplus), show: compact, ...top('bplus') },
  ra: { label: 'Ra', unit: 'Ω', example: '33k', read: ranged('Ra', L.ra), show: compact, ...top('ra') },
  rk: { label: 'Rk', unit: 'Ω', example: '3k3', read: ranged('Rk', L.rk), show: compact, ...top('rk') },
  rl: { label: 'RL', unit: 'Ω', example: '220k or none', read: ranged('RL', L.rl, { none: 'infinite' }), show: compact, ...top('rl') },
  rsource: { label: 'Source Rs', unit: 'Ω', example: '10k', read: ranged('Source impedance', L.rsource), show: compact, ...top('rsource') },
  cin: { label: 'Cin', unit: 'F', example: '68n or none', read: ranged('Cin', L.cin, { none: 'null' }), show: compact, ...top('cin') },
  rg: { label: 'Rg', unit: 'Ω', example: '2M2', read: ranged('Rg', L.rg), show: compact, ...top('rg') },
  rstopper: { label: 'Grid stopper', example: '68k or none', ...stopper, get: (d) => d.rstopper, put: (d, v) => ({ ...d, rstopper: v ?? 0 }) },
  volume: { label: 'Volume control', unit: 'dB', example: '-6 or none', read: optional(decibelsBelowFull('Volume control', L.volume)), show: (v) => (v === null ? 'none' : String(Number(v.toPrecision(3)))), get: (d) => d.volume, put: (d, v) => ({ ...d, volume: v }) },
  ck: { label: 'Ck', unit: 'F', example: '100u or none', read: ranged('Ck', L.ck, { none: 'null' }), show: compact, ...top('ck') },
  cout: { label: 'Cout', unit: 'F', example: '470n or none', read: ranged('Cout', L.cout, { none: 'null' }), show: compact, ...top('cout') },
  feedbackRf: { label: 'Feedback Rf', unit: 'Ω', example: '47k or none', read: ranged('Feedback resistor', L.feedbackRf, { none: 'null' }), show: compact, ...top('feedbackRf') },
  feedbackCf: { label: 'Across Rf', unit: 'F', example: '22p or none', read: ranged('Capacitor across Rf', L.feedbackCf, { none: 'null' }), show: compact, ...top('feedbackCf') },
  level: { label: 'Output level', unit: 'V rms', example: '2', read: ranged('Output level', L.levelRms), show: compact, ...top('levelRms') },
  thd: { label: 'THD limit', unit: '%', example: '5', read: percent('THD limit', L.output.thdLimit), show: showPercent, ...top('thdLimit') },
  ra2: { label: 'Ra (stage 2)', unit: 'Ω', example: '22k', read: ranged('Ra', L.stage2.ra), show: compact, ...second('ra') },
  rk2: { label: 'Rk (stage 2)', unit: 'Ω', example: '1k or 33k', read: ranged('Rk', L.stage2.rk), show: compact, ...second('rk') },
  rg2: { label: 'Rg (stage 2)', unit: 'Ω', example: '470k', read: ranged('Rg', L.stage2.rg), show: compact, ...second('rg') },
  fCc: { label: 'Cc (follower)', unit: 'F', example: '100n', read: ranged('Coupling capacitor', L.stage2.cc), show: compact, ...coupling('cc') },
  fRg: { label: 'Rg (follower)', unit: 'Ω', example: '1M', read: ranged('Grid leak', L.stage2.rg), show: compact, ...coupling('rg') },
  fRst: { label: 'Grid stopper (follower)', example: '10k or none', ...stopper, get: (d) => d.stage2.rstopper ?? 0, put: (d, v) => ({ ...d, stage2: { ...d.stage2, rstopper: v ?? 0 } }) },
  fVbias: { label: 'Follower grid', unit: 'V', example: '150', read: ranged('Follower grid voltage', L.stage2.vbias), show: compact, ...coupling('vbias') },
  oBplus: { label: 'B+', unit: 'V', example: '350', read: ranged('B+', L.output.bplus), show: compact, ...out('bplus') },
  oScreen: { label: 'Screen supply', unit: 'V', example: '300', read: ranged('Screen supply', L.output.screenVolts), show: compact, ...out('screenVolts') },
  oTap: { label: 'Screen tap', unit: '%', example: '43', read: percent('Screen tap', L.output.ulTap), show: showPercent, ...out('ulTap') },
  oRaa: { label: 'Raa', unit: 'Ω', example: '6k6', read: ranged('Plate-to-plate load', L.output.raa), show: compact, ...out('raa') },
  oMismatch: { label: 'gm mismatch', unit: '%', example: '5', read: percent('gm mismatch', L.output.mismatch), show: showPercent, ...out('mismatch') },
  oIdleMismatch: { label: 'Idle mismatch', unit: '%', example: '3', read: percent('Idle mismatch', L.output.mismatch), show: showPercent, ...out('idleMismatch') },
  oZ: { label: 'Primary Z', unit: 'Ω', example: '3k5', read: ranged('Primary impedance', L.output.zPrimary), show: compact, ...out('zPrimary') },
  oRpri: { label: 'Primary DCR', unit: 'Ω', example: '120', read: ranged('Primary DC resistance', L.output.rPrimary), show: compact, ...out('rPrimary') },
  oLp: { label: 'Primary L', unit: 'H', example: '15 or none', read: ranged('Primary inductance', L.output.primaryInductance, { none: 'null' }), show: compact, ...outOptional('primaryInductance') },
  oLl: { label: 'Leakage L', unit: 'H', example: '8m or none', read: ranged('Leakage inductance', L.output.leakageInductance, { none: 'null' }), show: compact, ...outOptional('leakageInductance') },
  oRk: { label: 'Rk', unit: 'Ω', example: '270', read: ranged('Rk', L.output.rk), show: compact, ...out('rk') },
  oVg: { label: 'Grid bias', unit: 'V', example: '-20', read: gridBias, show: (v) => (v === null ? '' : String(Number(v.toFixed(2)))), ...out('vg') },
  oRg: { label: 'Rg', unit: 'Ω', example: '220k', read: ranged('Rg', L.output.rg), show: compact, ...out('rg') },
  oSpeaker: { label: 'Speaker', unit: 'Ω', example: '8', read: ranged('Speaker', L.output.speakerOhms), show: compact, ...out('speakerOhms') },
  oThd: { label: 'Distortion limit', unit: '%', example: '5', read: percent('Distortion limit', L.output.thdLimit), show: showPercent, ...out('thdLimit') },
  sBplus: { label: 'Splitter B+', unit: 'V', example: '330', read: ranged('Splitter B+', L.splitter.bplus), show: compact, ...splitter('bplus') },
  sRa: { label: 'Splitter Ra', unit: 'Ω', example: '22k', read: ranged('Splitter Ra', L.splitter.ra), show: compact, ...splitter('ra') },
  sRa2: { label: 'Second Ra', unit: 'Ω', example: '36k', read: ranged('Second plate resistor', L.splitter.ra), show: compact, ...splitter('ra2') },
  sRk: { label: 'Splitter Rk', unit: 'Ω', example: '22k', read: ranged('Splitter Rk', L.splitter.rk), show: compact, ...splitter('rk') },
  sRtail: { label: 'Tail', unit: 'Ω', example: '10k', read: ranged('Tail resistor', L.splitter.rtail), show: compact, ...splitter('rtail') },
  sVgrid: { label: 'Splitter grid', unit: 'V', example: '90', read: ranged('Splitter grid voltage', L.splitter.vgrid), show: compact, ...splitter('vgrid') },
  sRg: { label: 'Splitter Rg', unit: 'Ω', example: '1M', read: ranged('Splitter grid leak', L.splitter.rg), show: compact, ...splitter('rg') },
  sRst: { label: 'Splitter grid stopper', example: '4k7 or none', ...stopper, get: (d) => d.output.splitter.rstopper ?? 0, put: (d, v) => ({ ...d, output: { ...d.output, splitter: { ...d.output.splitter, rstopper: v ?? 0 } } }) },
  sCc: { label: 'Splitter Cc', unit: 'F', example: '100n', read: ranged('Splitter coupling capacitor', L.splitter.cc), show: compact, ...splitter('cc') },
  tGain: { label: 'Least gain', unit: '×', example: 'off, e.g. 30', read: optional(ranged('Gain', L.targets.gain)), show: showOptional(compact), ...target('minGain') },
  tClean: { label: 'Least clean output', unit: 'V rms', example: 'off, e.g. 20', read: optional(ranged('Clean output', L.targets.level)), show: showOptional(compact), ...target('minCleanOutputRms') },
  tThdLevel: { label: 'THD measured at', unit: 'V rms', example: 'off, e.g. 2', read: optional(ranged('Level', L.targets.level)), show: showOptional(compact), ...target('thdLevelRms') },
  tThd: { label: 'Most THD', unit: '%', example: 'off, e.g. 1', read: optional(percent('THD', L.targets.thd)), show: showPercent, ...target('maxThd') },
  tDiss: { label: 'Most plate dissipation', unit: '% of rating', example: 'off, e.g. 70', read: optional(percent('Plate dissipation', L.targets.dissipation)), show: showPercent, ...target('maxDissipationFraction') },
  tZout: { label: 'Most Zout', unit: 'Ω', example: 'off, e.g. 20k', read: optional(ranged('Zout', L.targets.ohms)), show: showOptional(compact), ...target('maxZout') },
  tRaMin: { label: 'Lowest Ra', unit: 'Ω', example: 'off, e.g. 47k', read: optional(ranged('Ra', L.targets.ohms)), show: showOptional(compact), ...target('raMin') },
  tRaMax: { label: 'Highest Ra', unit: 'Ω', example: 'off, e.g. 220k', read: optional(ranged('Ra', L.targets.ohms)), show: showOptional(compact), ...target('raMax') },
  tRkMin: { label: 'Lowest Rk', unit: 'Ω', example: 'off, e.g. 680', read: optional(ranged('Rk', L.targets.ohms)), show: showOptional(compact), ...target('rkMin') },
  tRkMax: { label: 'Highest Rk', unit: 'Ω', example: 'off, e.g. 3k3', read: optional(ranged('Rk', L.targets.ohms)), show: showOptional(compact), ...target('rkMax') },
  tHeadroom: { label: 'Least grid swing', unit: 'V peak', example: 'off, e.g. 2', read: optional(ranged('Grid swing', L.targets.headroom)), show: showOptional(compact), ...target('minGridHeadroom') },
  tPower: { label: 'Least power', unit: 'W', example: 'off, e.g. 8', read: optional(ranged('Power', L.targets.power)), show: showOptional(compact), ...target('minPowerW') },
  tPowerThd: { label: 'within THD', unit: '%', example: 'off, e.g. 5', read: optional(percent('THD', L.targets.thd)), show: showPercent, ...target('powerThd') },
  tThdPower: { label: 'THD measured at', unit: 'W', example: 'off, e.g. 1', read: optional(ranged('Power', L.targets.power)), show: showOptional(compact), ...target('thdPowerW') },
  tThdAtPower: { label: 'Most THD there', unit: '%', example: 'off, e.g. 2', read: optional(percent('THD', L.targets.thd)), show: showPercent, ...target('maxThdAtPower') },
  tBplusMin: { label: 'Lowest B+', unit: 'V', example: 'off, e.g. 300', read: optional(ranged('B+', L.output.bplus)), show: showOptional(compact), ...target('bplusMin') },
  tBplusMax: { label: 'Highest B+', unit: 'V', example: 'off, e.g. 360', read: optional(ranged('B+', L.output.bplus)), show: showOptional(compact), ...target('bplusMax') },
};

export const FIELD_NAMES = Object.keys(FIELDS) as FieldName[];
