import { withOutputReading, withReading, type MeterPlan, type OutputMeterPlan } from './meterPlan';
import type { StateCreator } from 'zustand/vanilla';
import type { HeaterChoice } from './heaterChoice';
import { feedbackPartsProblem, loadLineExtent, tubeLibrary, tubeSummary, type Failure, type Result, type PlateExtent, type PreferredSeries, type TubeSummary } from '../../src/index';
import { analyze, type Analysis, type BenchDesign } from './analysis';
import { analyzeAmplifier, splitterRefusal, type AmplifierView } from './amplifierChain';
import { analyzeRival, analyzeRivalAmplifier, sharedWindow } from './compareSlice';
import { analyzeFollowerBench, type FollowerBench } from './followerBench';
import { analyzeOutputBench, rivalOutputDesign, sharedOutputWindow } from './outputAnalysis';
import { screensOnNode } from './outputPlan';
import { outputHeaterVolts, outputPlaced } from './heaterSharing';
import { customTubes } from '../keep/customTubes';
import { tubeRegistry, type TubeRegistry } from './tubeRegistry';
import { autoTitle } from './autoTitle';
import { DEMO_DESIGN, DEMO_TITLE } from './demoDesign';
import { MAX_TITLE_CHARS } from '../keep/designFile';
import { FIELD_NAMES, FIELDS, type FieldName } from './fields';
import type { WorkbenchState } from './workbenchStore';
import { supplyDraftsFor } from './supplySlice';
import { chainProblem } from './chainSlice';

export type Drafts = Record<FieldName, string>;
export type FieldErrors = Partial<Record<FieldName | 'tube' | 'stage2' | 'outputTube' | 'outputPair' | 'splitter', string>>;

/**
 * The design and what the model makes of it. Every change goes through
 * `commit`, which runs the model once and replaces the design only when the
 * model can solve it: an invalid entry never replaces a valid value, it
 * leaves a message next to its field instead.
 */
export interface DesignSlice {
  /** The chooser's list: every available tube with its key figures (computed once by the model). */
  tubes: readonly TubeSummary[];
  /** Every tube the bench can use, the library's and the user's (see tubeRegistry.ts). */
  registry: TubeRegistry;
  /** Re-reads the tube list and the registry after the user saved, removed or loaded tubes of their own. */
  refreshTubes: () => void;
  design: BenchDesign;
  /** The design's name, for the page and the build card. */
  title: string;
  /** True once the user has typed a title; until then (and after clearing it) the title follows the design. */
  titleTyped: boolean;
  /**
   * How the design's last change counts for undo: 'joins' the step before it
   * (CommitOptions.derived), starts its 'own' (CommitOptions.step), or
   * 'merges' with a change within COALESCE_MS (typing, and the rest).
   */
  undoStep: 'merges' | 'own' | 'joins';
  setTitle: (title: string) => void;
  analysis: Analysis;
  /** The bench's cathode follower on its own curves, while it is the stage shown; null otherwise. */
  followerBench: FollowerBench | null;
  /** The compared tube in the follower's socket (same Rk, same grid), while the follower is shown and a tube is compared. */
  followerRival: Result<FollowerBench> | null;
  /** The whole amplifier (the chain strip's figures); null when a stage's tube is unknown. */
  amplifier: AmplifierView | null;
  /** Joins the voltage stages to the output stage as one amplifier, or parts them. */
  setDrivesOutput: (on: boolean) => void;
  /** The text in each input box: what the user typed, or the design's value. */
  drafts: Drafts;
  errors: FieldErrors;
  editField: (field: FieldName, text: string) => void;
  /** When a box loses focus: show the held value in trade notation if the text was valid. */
  settleField: (field: FieldName) => void;
  chooseTube: (id: string) => void;
  setBypassed: (on: boolean) => void;
  setSeries: (series: PreferredSeries) => void;
  setSnap: (on: boolean) => void;
  /** How the small tubes' heaters are fed and wired (the build sheet's choice): one undo step. */
  setHeaters: (patch: Partial<HeaterChoice>) => void;
  /** A stage's meter reading on the tube it holds (null: taken out): one undo step, kept in files and links. */
  setReading: (stage: number, reading: MeterPlan | null) => void;
  /** An output tube's meter reading (null: taken out): one undo step, kept in files and links. */
  setOutputReading: (tube: 1 | 2, reading: OutputMeterPlan | null) => void;
  /** Runs the model on `next`; on success makes it the design and returns null. */
  commit: (next: BenchDesign, opts?: CommitOptions) => Failure | null;
  /** How many plate curves the chart draws at most: 6 (sparse), 12 (normal) or 24 (dense). */
  curveCount: number;
  setCurveCount: (n: number) => void;
  /** The second stage's kind, tube or coupling (a follower's `coupling` undefined: direct-coupled to the plate). */
  setStage2: (patch: Partial<Pick<BenchDesign['stage2'], 'kind' | 'tubeId' | 'coupling'>>) => void;
  /** Runs the full analysis now if a light one (a drag's or a keystroke's) is showing: before an export reads the figures. */
  settleAnalysis: () => void;
  /** Makes a whole document (opened file, shared link, shelf) the current design; null on success, else why not. */
  loadDocument: (doc: { title: string; design: BenchDesign }) => Failure | null;
}

export interface CommitOptions {
  /** Pins the voltage stage's chart window (while B+ is dragged). */
  readonly extent?: PlateExtent;
  /** Pins the follower's chart window (while its point is dragged). */
  readonly followerExtent?: PlateExtent;
  /** Pins the output stage's chart window (while its point is dragged). */
  readonly outputExtent?: PlateExtent;
  readonly typedField?: FieldName;
  /** The light analysis of a drag or a keystroke: the costly figures wait for the full pass. */
  readonly light?: boolean;
  /** Re-run both analyses even where the design part did not change (curve count, rival). */
  readonly force?: boolean;
  /**
   * A whole document opened (file, link, autosave): taken as it was kept, so a design
   * kept before a check existed still opens; the strip then says what cannot run.
   */
  readonly opened?: boolean;
  /**
   * The workbench's own change, following one the user made (the stages' B+
   * taking their nodes' once the supply is solved): part of that change's undo
   * step however late it lands, never a step of its own, which undo would
   * take back only for it to follow again.
   */
  readonly derived?: boolean;
  /**
   * A whole action of the user's (a stage added, removed or moved, a tube
   * chosen, a pair switched on): an undo step of its own however soon after
   * the last change it comes (changes within COALESCE_MS otherwise merge, as
   * a value's keystrokes do). What follows it at once (its own second
   * commit, a value typed straight after) still joins it.
   */
  readonly step?: boolean;
}

/** True when two designs differ only in their output stage, their supply, or which stage is shown. */
function sameVoltagePart(a: BenchDesign, b: BenchDesign): boolean {
  for (const k of Object.keys(a) as (keyof BenchDesign)[]) if (k !== 'output' && k !== 'stageKind' && k !== 'supply' && a[k] !== b[k]) return false;
  return true;
}

/** The grid leak the voltage stages drive when joined: the output grid's resistor, or the splitter's before a pair. */
function drivenLeak(d: BenchDesign): number {
  if (d.output.pair !== 'push-pull') return d.output.rg;
  // A direct-coupled splitter's grid has no leak: the stage before drives no load of its own.
  return d.output.splitter.coupling === 'direct' ? Infinity : d.output.splitter.rg;
}

function withDrivenLeak(d: BenchDesign, rg: number): BenchDesign {
  return d.output.pair === 'push-pull' ? { ...d, output: { ...d.output, splitter: { ...d.output.splitter, rg } } } : { ...d, output: { ...d.output, rg } };
}

/**
 * With the output stage driven, RL is the grid leak the voltage stages feed:
 * the output grid's resistor, or the phase splitter's before a push-pull
 * pair. Whichever of the two the change touched, the other follows. An open
 * RL cannot be a grid leak.
 */
function withOutputDriven(next: BenchDesign, prev: BenchDesign): Result<{ design: BenchDesign }> {
  // The design itself when nothing follows, so an unchanged design stays the same object (history and re-analysis key on it).
  const same = (design: BenchDesign) => ({ ok: true as const, design });
  if (!next.drivesOutput) return same(next);
  const leak = drivenLeak(next);
  // Joining the stages (or switching what they drive): the driven grid's own leak becomes the voltage stage's load.
  const directBefore = prev.output.pair === 'push-pull' && prev.output.splitter.coupling === 'direct';
  if (!prev.drivesOutput || next.output.pair !== prev.output.pair || (leak === Infinity) !== directBefore) return same(next.rl === leak ? next : { ...next, rl: leak });
  if (leak === Infinity) {
    if (next.rl !== prev.rl) return { ok: false, reason: 'invalid-input', message: 'The splitter takes its grid straight from this plate: there is no RL to give (choose capacitor coupling for a grid leak)', field: 'rl' };
    return same(next);
  }
  if (next.rl !== prev.rl) {
    if (!Number.isFinite(next.rl)) return { ok: false, reason: 'invalid-input', message: 'RL is the driven grid\'s leak while the stages drive the output stage: give it a value', field: 'rl' };
    return same(next.rl === leak ? next : withDrivenLeak(next, next.rl));
  }
  return same(leak === next.rl ? next : { ...next, rl: leak });
}

/** How long after the last keystroke the full (signal) analysis runs, ms. */
export const TYPING_SETTLE_MS = 200;
const pending = new WeakMap<object, ReturnType<typeof setTimeout>>();

/** Runs the deferred full analysis once typing pauses (one timer per store). */
function scheduleFullAnalysis(get: () => WorkbenchState): void {
  const key = get().commit; // stable per store
  clearTimeout(pending.get(key));
  pending.set(key, setTimeout(() => get().settleAnalysis(), TYPING_SETTLE_MS));
}

function withoutError(errors: FieldErrors, key: keyof FieldErrors): FieldErrors {
  const next = { ...errors };
  delete next[key];
  return next;
}

export function draftsFor(d: BenchDesign): Drafts {
  return Object.fromEntries(FIELD_NAMES.map((f) => [f, FIELDS[f].show(FIELDS[f].get(d))])) as Drafts;
}

function initialAnalysis(registry: TubeRegistry): Analysis {
  const a = analyze(DEMO_DESIGN, registry, null);
  if (!a.ok) throw new Error(`the demo design must solve: ${a.message}`);
  return a;
}

const LIBRARY_SUMMARIES: readonly TubeSummary[] = tubeLibrary.map(tubeSummary);
const summariesOf = (registry: TubeRegistry) => [...LIBRARY_SUMMARIES, ...registry.user.map(tubeSummary)];

export const createDesignSlice: StateCreator<WorkbenchState, [], [], DesignSlice> = (set, get) => {
  // The tubes as the page holds them now (the user's are read in when the browser gives them: refreshTubes).
  const registry = tubeRegistry(customTubes());
  return {
  tubes: summariesOf(registry),
  registry,
  refreshTubes: () => {
    const next = tubeRegistry(customTubes());
    set({ tubes: summariesOf(next), registry: next });
  },
  design: DEMO_DESIGN,
  title: DEMO_TITLE,
  titleTyped: false,
  undoStep: 'merges',
  setTitle: (title) => {
    const typed = title.trim() !== '';
    set({ title: typed ? title.slice(0, MAX_TITLE_CHARS) : autoTitle(get().design), titleTyped: typed });
  },
  analysis: initialAnalysis(registry),
  followerBench: null,
  followerRival: null,
  amplifier: analyzeAmplifier(DEMO_DESIGN, registry),
  setDrivesOutput: (on) => {
    const failure = get().commit({ ...get().design, drivesOutput: on });
    // Said on the strip, where the box is: the box stays as it was, and why.
    set({ chainNote: failure ? `${on ? 'The stages were not joined to the output stage' : 'The output stage was not separated'}: ${failure.message}` : null });
  },
  drafts: draftsFor(DEMO_DESIGN),
  errors: {},

  commit: (asked, opts = {}) => {
    const s = get();
    const joined = withOutputDriven(asked, s.design);
    if (!joined.ok) return joined;
    const shape = chainProblem(joined.design) ?? (joined.design.feedbackRf !== null ? feedbackPartsProblem(joined.design.feedbackRf, joined.design.feedbackCf) : null);
    if (shape) return shape;
    // The follower can be the stage shown only while the bench's stage has one.
    const next = joined.design.stageKind === 'follower' && joined.design.stage2.kind !== 'follower' ? { ...joined.design, stageKind: 'voltage' as const } : joined.design;
    // The splitter before a driven pair is no bench's stage: it is checked in its place, so a value that stops it is refused like any other.
    const voltageSame = sameVoltagePart(next, s.design);
    const splitter = opts.opened ? null : splitterRefusal(next, s.design, s.registry, !voltageSame);
    if (splitter) return splitter;
    const light = opts.light ?? false;
    const patch: Partial<WorkbenchState> = {};
    // Each stage is analysed only when its part of the design changed, or to
    // follow a light pass with the full one; the stage not on the bench gets
    // the light analysis only (its costly figures wait until it is shown), so
    // dragging or typing in one stage never pays for the other.
    // The follower rides on the gain stage: showing it shows the voltage part.
    const showsVoltage = next.stageKind !== 'output';
    if (!voltageSame || opts.force || (!light && showsVoltage && s.analysis.signal.stale)) {
      const voltageLight = light || !showsVoltage;
      const extent = opts.extent ?? (s.chartWindow === 'load-line' ? loadLineExtent(next.bplus, next.ra, next.rk) : sharedWindow(next, s.registry, s.rival));
      const a = analyze(next, s.registry, s.analysis, extent, voltageLight, s.curveCount);
      if (!a.ok) return a;
      patch.analysis = a;
      patch.rivalAnalysis = analyzeRival(next, s.registry, s.rival, s.rivalAnalysis, a.sheet.extent, voltageLight, s.curveCount);
    }
    // The follower on the bench follows every pass of the stage it rides on (a light one while dragged: it is cheap).
    if (next.stageKind === 'follower' || s.followerBench) {
      const f = analyzeFollowerBench(next, s.registry, patch.analysis ?? s.analysis, { bench: s.followerBench, rival: s.followerRival }, s.rival, s.curveCount, opts.followerExtent);
      if (!f.ok) return f;
      patch.followerBench = f.bench;
      patch.followerRival = f.rival;
    }
    // A driven output stage is part of the amplifier on screen (strip, ratings, build sheet) even with the voltage stage shown.
    const outputShown = !showsVoltage || next.drivesOutput;
    // Where the supply feeds the screens is the output stage's too (a dropper, or their own node).
    const screensMoved = screensOnNode(next) !== screensOnNode(s.design);
    // So is the potential of its heaters, when they share the small tubes' winding held above ground.
    const heatersMoved = next.heaters !== s.design.heaters && outputHeaterVolts(next, s.registry) !== outputHeaterVolts(s.design, s.registry);
    if (next.output !== s.design.output || screensMoved || heatersMoved || opts.force || (!light && outputShown && s.outputBench.light)) {
      const outputLight = light || !outputShown;
      const window = opts.outputExtent ?? sharedOutputWindow(next.output, s.outputRival);
      const ob = analyzeOutputBench(outputPlaced(next, next.output, s.registry), s.outputBench, { light: outputLight, maxCurves: s.curveCount, ...(window ? { extent: window } : {}) });
      if (!ob.ok) return ob;
      patch.outputBench = ob;
      const prevRival = s.outputRivalBench && s.outputRivalBench.ok ? s.outputRivalBench : null;
      patch.outputRivalBench = s.outputRival.on ? analyzeOutputBench(rivalOutputDesign(outputPlaced(next, next.output, s.registry), s.outputRival), prevRival, { light: outputLight, maxCurves: s.curveCount, extent: ob.analysis.sheet.extent }) : null;
    }
    // The whole amplifier follows every full pass; a drag or keystroke shows the last one, marked as behind.
    if (next !== s.design || opts.force || s.amplifier?.stale) {
      // Marked once: a drag's later frames keep the same object, so the strip is not drawn again on every move.
      patch.amplifier = !light ? analyzeAmplifier(next, s.registry) : s.amplifier && (s.amplifier.stale ? s.amplifier : { ...s.amplifier, stale: true });
      // And with the second tube in the bench's socket, when compared: what the swap does to the whole amplifier.
      patch.rivalAmplifier = !light ? analyzeRivalAmplifier(next, s.registry, s.rival) : s.rivalAmplifier && (s.rivalAmplifier.stale ? s.rivalAmplifier : { ...s.rivalAmplifier, stale: true });
    }
    const drafts = draftsFor(next);
    // Keep what the user is typing in the box they are typing in.
    if (opts.typedField) drafts[opts.typedField] = s.drafts[opts.typedField];
    const errors = { ...s.errors };
    for (const f of FIELD_NAMES) if (FIELDS[f].get(next) !== FIELDS[f].get(s.design) || f === opts.typedField) delete errors[f];
    // A box whose text was refused keeps that text beside its message until its value changes: a pass that follows
    // (the full analysis after typing pauses) must not put the last good value back under a message about another.
    for (const f of FIELD_NAMES) if (errors[f] !== undefined) drafts[f] = s.drafts[f];
    // A supply changed from outside its boxes (undo, an opened file) shows its own values.
    if (next.supply !== s.design.supply) patch.supplyDrafts = supplyDraftsFor(next.supply);
    set({ ...patch, design: next, drafts, errors, undoStep: opts.derived ? 'joins' : opts.step ? 'own' : 'merges', ...(s.titleTyped ? {} : { title: autoTitle(next) }) });
    return null;
  },

  editField: (field, text) => {
    const s = get();
    set({ drafts: { ...s.drafts, [field]: text } });
    const read = FIELDS[field].read(text);
    if (!read.ok) {
      set({ errors: { ...get().errors, [field]: read.message } });
      return;
    }
    // Like a drag: the light analysis follows each keystroke; the signal views catch up when typing pauses.
    const failure = get().commit(FIELDS[field].put(s.design, read.value), { typedField: field, light: true });
    if (failure) set({ errors: { ...get().errors, [field]: failure.message } });
    else scheduleFullAnalysis(get);
  },

  settleField: (field) => {
    const s = get();
    if (s.errors[field]) return;
    set({ drafts: { ...s.drafts, [field]: FIELDS[field].show(FIELDS[field].get(s.design)) } });
  },

  chooseTube: (id) => {
    const s = get();
    if (id === s.design.tubeId) return;
    // Same parts, new tube: what a tube swap in the same socket does.
    const failure = s.commit({ ...s.design, tubeId: id }, { step: true });
    set({ errors: failure ? { ...get().errors, tube: `The ${id} cannot run with these parts: ${failure.message}` } : withoutError(get().errors, 'tube') });
  },

  curveCount: 12,
  setCurveCount: (n) => {
    set({ curveCount: n });
    get().commit(get().design, { force: true });
  },

  setStage2: (patch) => {
    const s = get();
    // Adding a second stage puts it on the other half of stage 1's envelope when stage 1 is a twin triode (common practice).
    const adding = s.design.stage2.kind === 'none' && patch.kind !== undefined && patch.kind !== 'none' && patch.tubeId === undefined;
    const sameEnvelope = adding && (s.analysis.tube.sections ?? 1) === 2 ? { tubeId: s.design.tubeId } : {};
    let failure = s.commit({ ...s.design, stage2: { ...s.design.stage2, ...sameEnvelope, ...patch } });
    // A newly added stage whose held Rk cannot run (a 12AX7 follower on a 12AU7's 22 kΩ draws grid current)
    // takes the first of a few cathode resistors up the decade that does.
    for (const rk of adding ? [47e3, 100e3, 220e3] : []) {
      if (!failure || rk <= s.design.stage2.rk) continue;
      failure = get().commit({ ...s.design, stage2: { ...s.design.stage2, ...sameEnvelope, ...patch, rk } });
    }
    set({ errors: failure ? { ...get().errors, tube: undefined, stage2: failure.message } : withoutError(get().errors, 'stage2') });
  },

  settleAnalysis: () => {
    const s = get();
    const behind = (s.design.stageKind === 'output' ? s.outputBench.light : s.analysis.signal.stale) || s.amplifier?.stale === true;
    if (behind && !s.dragging) s.commit(s.design);
  },

  loadDocument: (doc) => {
    const failure = get().commit(doc.design, { opened: true });
    if (failure) return failure;
    // A title that is the design's own automatic one keeps following it; any other was typed.
    const typed = doc.title.trim() !== '' && doc.title !== autoTitle(doc.design);
    // A new document: every box shows its value, no refused text or message is carried over.
    set({ title: typed ? doc.title.slice(0, MAX_TITLE_CHARS) : autoTitle(doc.design), titleTyped: typed, errors: {}, drafts: draftsFor(get().design) });
    return null;
  },

  setBypassed: (on) => {
    get().commit({ ...get().design, bypassed: on });
  },
  setSeries: (series) => {
    get().commit({ ...get().design, series });
  },
  setSnap: (on) => {
    get().commit({ ...get().design, snap: on });
  },
  setHeaters: (patch) => {
    const d = get().design;
    get().commit({ ...d, heaters: { ...d.heaters, ...patch } });
  },
  setReading: (stage, reading) => {
    get().commit(withReading(get().design, stage, reading));
  },
  setOutputReading: (tube, reading) => {
    get().commit(withOutputReading(get().design, tube, reading));
  },
};
};
