import type { StateCreator } from 'zustand/vanilla';
import { bleederForSupply, capacitorForRipple, humOnSupply, parseValue, supplyLowEnd, supplyPartsList, type SupplyLowEnd, type HumAtOutput, type AmplifierOnSupply, type AmplifierOnSupplyResult, type Bleeder, type FilterSection, type Result, type SupplyParts } from '../../src/index';
import { namedAsCards, type ChainCardName } from './amplifierChain';
import type { BenchDesign } from './analysis';
import { checkPlan, checkStageNodes, onSupplyInputOf, type SupplyPlan } from './supplyPlan';
import { compact } from './fields';
import { withNodeBplus, withStageNode, withStageNodesMoved } from './stagePlans';
import { DEMO_DESIGN } from './demoDesign';
import type { BiasView } from './biasSupply';
import type { WorkbenchState, WorkbenchStore } from './workbenchStore';

/** What the supply view shows: the amplifier solved on its supply, and the bleeder its capacitors need. */
export interface SupplyView {
  readonly result: Result<AmplifierOnSupplyResult>;
  /** The chain's stages, in order, and the node each draws from. */
  readonly names: readonly ChainCardName[];
  readonly feeds: readonly number[];
  /** The node feeding each stage's screens straight (a pentode output stage's, when the plan names one), else null. */
  readonly screenFeeds: readonly (number | null)[];
  /** The supply's own loads at each node as solved, A: the heater elevation divider's (elevationLoadOf), else none. */
  readonly ownLoads: readonly number[];
  readonly bleeder: Result<Bleeder> | null;
  /** The supply's parts to order (filter capacitors, resistors, chokes, bleeder, rectifier), when it was solved. */
  readonly parts: Result<SupplyParts> | null;
  /** The hum each stage's B+ ripple gives at the amplifier's output, when it was solved. */
  readonly hum: Result<HumAtOutput> | null;
  /** True while the design has moved on and the new solve has not come back. */
  readonly stale: boolean;
  /** The capacitor that brings the hum budget's node within it (capacitorForRipple), when the node is over it. */
  readonly humCure: { readonly node: number; readonly farads: number } | null;
  /**
   * The amplifier's low end on this supply and whether the loop through it
   * is stable (supplyLowEnd), worked out after each settled solve (null
   * until it comes back, and for a drag's live answers).
   */
  readonly lowEnd: Result<SupplyLowEnd> | null;
}

/** The supply's typed values: the plan's path ("secondaryRms", "input.c", "sections.1.r") to the text in its box. */
export type SupplyDrafts = Readonly<Record<string, string>>;

export interface SupplySlice {
  supplyView: SupplyView | null;
  /** A fixed-bias output stage's grid supply, as last solved (watchBias in biasSupply.ts); null when none is needed. */
  biasView: BiasView | null;
  supplyDrafts: SupplyDrafts;
  /** Messages by the same paths, and "supply" for the plan as a whole. */
  supplyErrors: Readonly<Record<string, string>>;
  /** Types a value into one of the supply's boxes: held when the model can use it, else a message beside it. */
  editSupplyValue: (path: string, text: string) => void;
  /** Changes the plan's choices (rectifier, input kind, feeds, channels, on); a plan the model refuses leaves a message. */
  setSupply: (patch: Partial<SupplyPlan>) => void;
  addSection: (kind: FilterSection['kind']) => void;
  removeSection: (index: number) => void;
  /** Sets each stage's B+ to what its node delivers under the whole amplifier's current. */
  useSupplyVolts: () => void;
  /** Feeds voltage stage i (a follower: its gain stage) from supply node `node` (0 the reservoir); one undo step. */
  setStageNode: (i: number, node: number) => void;
}

/**
 * What the node feeding stage i gives under the whole amplifier's current, V:
 * the node's own DC, as the supply's table shows it (the B+ the stages were
 * last solved at agrees with it within 10 mV, and could round to another volt).
 */
export function nodeVoltsOf(view: SupplyView, r: AmplifierOnSupplyResult, i: number): number {
  return r.supply.nodes[view.feeds[i]!]?.dc ?? r.bplus[i]!;
}

/** What node k feeds, as the table and drawing name it: its stages, then any output stage's screens on it ("Output screens"). */
export function fedFrom(view: Pick<SupplyView, 'names' | 'feeds' | 'screenFeeds'>, k: number): { readonly title: string; readonly tube: string }[] {
  const stages = view.names.filter((_, i) => view.feeds[i] === k);
  const screens = view.names.filter((_, i) => view.screenFeeds[i] === k).map((n) => ({ title: `${n.title} screens`, tube: n.tube }));
  return [...stages, ...screens];
}

/** Where the supply feeds the output stage's screens from their own node: which node, and what it gives under the whole amplifier's current (its own DC), V; null otherwise. */
export function screensOf(view: SupplyView, r: AmplifierOnSupplyResult): { node: number; volts: number; tube: string } | null {
  const i = view.screenFeeds.findIndex((k) => k !== null);
  if (i < 0) return null;
  const node = view.screenFeeds[i]!;
  return { node, volts: r.supply.nodes[node]?.dc ?? r.screenVolts[i] ?? 0, tube: view.names[i]!.tube };
}

/** The bench's B+ that the supply's solution gives (rounded to the volt, as B+ is typed), or null where it says nothing. */
export function supplyBplusOf(d: BenchDesign, view: SupplyView): BenchDesign | null {
  const r = view.result;
  if (!r.ok) return null;
  const at = (role: 'splitter' | 'output') => {
    const i = view.names.findIndex((n) => n.role === role);
    return i < 0 ? null : Math.round(nodeVoltsOf(view, r, i));
  };
  const o = at('output');
  const sp = at('splitter');
  const sc = screensOf(view, r);
  const screens = sc !== null ? Math.round(sc.volts) : null;
  // Each gain stage takes its own node's voltage (a follower rides on its gain stage's B+).
  const hasVoltage = view.names.some((n) => n.role === 'voltage');
  const voltage = hasVoltage ? withNodeBplus(d, (node) => { const n = r.supply.nodes[node]; return n ? Math.round(n.dc) : null; }) : d;
  const splitter = sp !== null && sp !== d.output.splitter.bplus ? { ...d.output.splitter, bplus: sp } : d.output.splitter;
  const output = { ...d.output, ...(o !== null ? { bplus: o } : {}), ...(screens !== null ? { screenVolts: screens } : {}), splitter };
  return o !== null || screens !== null || splitter !== d.output.splitter ? { ...voltage, output } : voltage;
}

/** The plan's values that have boxes, by path, with how each is shown. */
export function supplyDraftsFor(p: SupplyPlan): Record<string, string> {
  const out: Record<string, string> = {
    secondaryRms: compact(p.secondaryRms),
    windingOhms: compact(p.windingOhms),
    'input.c': compact(p.input.c),
    secondaryAmps: p.secondaryAmps === null ? 'none' : compact(p.secondaryAmps),
    humRms: p.humRms === null ? 'none' : compact(p.humRms),
    regulation: p.regulation === null ? 'none' : compact(p.regulation / TYPED_SCALE.regulation!),
    'bias.secondaryRms': compact(p.bias.secondaryRms),
    'bias.windingOhms': compact(p.bias.windingOhms),
    'bias.reservoir': compact(p.bias.reservoir),
    'bias.r': compact(p.bias.r),
    'bias.c': compact(p.bias.c),
  };
  if (p.input.kind === 'choke') {
    out['input.l'] = compact(p.input.l);
    out['input.rdc'] = compact(p.input.rdc);
  }
  p.sections.forEach((s, k) => {
    out[`sections.${k}.c`] = compact(s.c);
    if (s.kind === 'rc') out[`sections.${k}.r`] = compact(s.r);
    else {
      out[`sections.${k}.l`] = compact(s.l);
      out[`sections.${k}.rdc`] = compact(s.rdc);
    }
  });
  return out;
}

/** The plan with one value replaced at its path. */
function putAt(p: SupplyPlan, path: string, value: number | null): SupplyPlan {
  const [head, index, key] = path.split('.');
  if (head === 'input' && index) return { ...p, input: { ...p.input, [index]: value } as SupplyPlan['input'] };
  if (head === 'bias' && index) return { ...p, bias: { ...p.bias, [index]: value } };
  if (head === 'sections' && index !== undefined && key) {
    const k = Number(index);
    return { ...p, sections: p.sections.map((s, i) => (i === k ? ({ ...s, [key]: value } as FilterSection) : s)) };
  }
  return { ...p, [path]: value };
}

/** Where a value may be left empty ("none"): the ratings the builder may not know. */
const MAY_BE_NONE = new Set(['secondaryAmps', 'humRms', 'regulation']);
/** Values typed in a display unit: regulation in percent, held as a fraction. */
const TYPED_SCALE: Readonly<Record<string, number>> = { regulation: 0.01 };

/** A new section's values: a 10 kΩ, 47 µF R–C, or a 10 H, 200 Ω choke into 47 µF (common practice). */
const NEW_SECTION: Record<FilterSection['kind'], FilterSection> = {
  rc: { kind: 'rc', r: 10e3, c: 47e-6 },
  lc: { kind: 'lc', l: 10, rdc: 200, c: 47e-6 },
};

export const createSupplySlice: StateCreator<WorkbenchState, [], [], SupplySlice> = (set, get) => {
  /** Puts a plan in the design when the model accepts it; otherwise the message goes to `at` (or the field the model names). */
  const tryPlan = (plan: SupplyPlan, at: string, stages: (d: BenchDesign) => BenchDesign = (d) => d): boolean => {
    const s = get();
    const problem = checkPlan(plan) ?? checkStageNodes(stages({ ...s.design, supply: plan }));
    if (problem) {
      set({ supplyErrors: { ...s.supplyErrors, [problem.field && s.supplyDrafts[problem.field] !== undefined ? problem.field : at]: problem.message } });
      return false;
    }
    const failure = s.commit(stages({ ...s.design, supply: plan }));
    if (failure) {
      set({ supplyErrors: { ...get().supplyErrors, [at]: failure.message } });
      return false;
    }
    return true;
  };
  return {
    supplyView: null,
    biasView: null,
    supplyDrafts: supplyDraftsFor(DEMO_DESIGN.supply),
    supplyErrors: {},

    editSupplyValue: (path, text) => {
      const s = get();
      set({ supplyDrafts: { ...s.supplyDrafts, [path]: text } });
      const t = text.trim().toLowerCase();
      let value: number | null;
      if (MAY_BE_NONE.has(path) && (t === '' || t === 'none')) value = null;
      else {
        const read = parseValue(text);
        if (!read.ok) {
          set({ supplyErrors: { ...get().supplyErrors, [path]: read.message } });
          return;
        }
        value = read.value * (TYPED_SCALE[path] ?? 1);
      }
      const errors = { ...get().supplyErrors };
      delete errors[path];
      delete errors.supply;
      set({ supplyErrors: errors });
      if (tryPlan(putAt(s.design.supply, path, value), path)) set({ supplyDrafts: { ...supplyDraftsFor(get().design.supply), [path]: text } });
    },

    setSupply: (patch) => {
      const s = get();
      const errors = { ...s.supplyErrors };
      delete errors.supply;
      set({ supplyErrors: errors });
      if (tryPlan({ ...s.design.supply, ...patch }, 'supply')) set({ supplyDrafts: supplyDraftsFor(get().design.supply) });
    },

    addSection: (kind) => {
      const p = get().design.supply;
      if (tryPlan({ ...p, sections: [...p.sections, NEW_SECTION[kind]] }, 'supply')) set({ supplyDrafts: supplyDraftsFor(get().design.supply) });
    },

    removeSection: (index) => {
      const p = get().design.supply;
      const last = p.sections.length - 1;
      // A stage fed from a node that goes moves to the node before it.
      const node = (k: number) => (k > index ? k - 1 : k);
      const feeds = {
        output: Math.min(node(p.feeds.output), last),
        voltage: Math.min(node(p.feeds.voltage), last),
        ...(p.feeds.splitter !== undefined ? { splitter: Math.min(node(p.feeds.splitter), last) } : {}),
        ...(p.feeds.screens !== undefined ? { screens: Math.min(node(p.feeds.screens), last) } : {}),
      };
      const plan = { ...p, sections: p.sections.filter((_, i) => i !== index), feeds };
      if (tryPlan(plan, 'supply', (d) => withStageNodesMoved(d, (k) => Math.min(node(k), last)))) set({ supplyDrafts: supplyDraftsFor(get().design.supply) });
    },

    setStageNode: (i, node) => {
      const s = get();
      const errors = { ...s.supplyErrors };
      delete errors.supply;
      set({ supplyErrors: errors });
      const next = withStageNode(s.design, i, node);
      tryPlan(next.supply, 'supply', () => next);
    },

    useSupplyVolts: () => {
      const s = get();
      const view = s.supplyView;
      const next = view && !view.stale ? supplyBplusOf(s.design, view) : null;
      if (!next) return;
      const failure = s.commit(next);
      if (failure) set({ supplyErrors: { ...get().supplyErrors, supply: `These B+ cannot be used: ${failure.message}` } });
    },
  };
};

/** Works out the amplifier's low end on its solved supply, asynchronously (the page's: in the model worker). */
export type LowEndSolver = (input: AmplifierOnSupply, solved: AmplifierOnSupplyResult) => Promise<Result<SupplyLowEnd>>;

/** In place, on the thread that asks (the tests', and a browser without workers). */
export const inPlaceLowEnd: LowEndSolver = async (input, solved) => supplyLowEnd(input, solved);

/** Solves the amplifier on its supply, asynchronously (the page's: supplyBetweenFrames). */
export type SupplySolver = (input: AmplifierOnSupply) => Promise<Result<AmplifierOnSupplyResult> | 'cancelled'>;

/** Between the supply's answers while a drag runs, ms: each redraws the supply's table on the page's thread. */
export const LIVE_SUPPLY_PAUSE_MS = 250;

/** How long the design must hold still before the supply is solved again, ms. */
export const SUPPLY_SETTLE_MS = 150;

/** What the supply view shows for an answer: the result, the bleeder the capacitors need and the parts to order. */
function viewOf(chain: { input: AmplifierOnSupply; names: readonly ChainCardName[] }, r: Result<AmplifierOnSupplyResult>, stale: boolean): SupplyView {
  const bleeder = r.ok ? bleederForSupply(chain.input.supply, r.supply.nodes[0]!.dc) : null;
  const needed = bleeder?.ok && bleeder.needed ? bleeder : null;
  const parts = r.ok ? supplyPartsList(chain.input.supply, r, needed) : null;
  const screenFeeds = chain.input.screenFeeds ?? chain.names.map(() => null);
  const budget = chain.input.supply.ratings?.hum;
  const farads = r.ok && budget ? capacitorForRipple(chain.input.supply, r.supply, budget.node, budget.maxRippleRms) : null;
  const humCure = farads !== null && budget ? { node: budget.node, farads } : null;
  return { result: r, names: chain.names, feeds: chain.input.feeds, screenFeeds, ownLoads: chain.input.supply.loads ?? [], bleeder, parts, hum: r.ok ? humOnSupply(chain.input, r) : null, humCure, stale, lowEnd: null };
}

/**
 * Keeps the supply view following the design: solved once the design holds
 * still (SUPPLY_SETTLE_MS after the last full analysis), marked stale while
 * a drag or typing runs ahead of it; a late answer to an older design is
 * dropped. Without a solver (tests that do not ask for one) nothing runs.
 */
export function watchSupply(store: WorkbenchStore, solver: SupplySolver | null, lowEnd: LowEndSolver = inPlaceLowEnd): void {
  if (!solver) return;
  let job = 0;
  let timer: ReturnType<typeof setTimeout> | undefined;
  const schedule = () => {
    clearTimeout(timer);
    timer = setTimeout(() => {
      const { design: d, registry } = store.getState();
      const chain = d.supply.on ? onSupplyInputOf(d, registry) : null;
      if (!chain) {
        store.setState({ supplyView: null });
        return;
      }
      const mine = ++job;
      // From the last steady state when there is one: a change to the stages settles in fewer rounds.
      const last = store.getState().supplyView?.result;
      // Its tangent comes back with it: the drag that may follow solves the supply along it, frame by frame.
      void solver({ ...chain.input, ...(last?.ok ? { start: last.supply.nodes.map((n) => n.dc) } : {}), keepTangent: true }).then((r) => {
        if (r === 'cancelled' || mine !== job || store.getState().design !== d) return;
        // A stage's failure named as its card is ("Phase splitter (12AU7): …"), not by its place in the model's list.
        const view = viewOf(chain, r.ok ? r : namedAsCards(r, chain.names), false);
        store.setState({ supplyView: view });
        // The low end and the loop through the supply: tens of milliseconds of sweeps, after the figures are shown.
        if (r.ok) {
          void lowEnd(chain.input, r).then((le) => {
            if (store.getState().supplyView === view) store.setState({ supplyView: { ...view, lowEnd: le } });
          });
        }
        // Following: the stages take their nodes' B+. The solve after that gives the same nodes (they do not depend on
        // the typed B+, but for the heater elevation divider's current, which moves them by millivolts), so this settles
        // at once; an undo lands on a design that already agreed, and changes nothing.
        const next = d.supply.follow ? supplyBplusOf(d, view) : null;
        // B+ follow to the volt; a 1 V step alone is the rounding of a node solved from another start (to 10 mV), not a move.
        const far = (a: number, b: number) => Math.abs(a - b) > 1;
        const bplusOf = (p: BenchDesign['before'][number]) => (p.kind === 'common-cathode' ? p.bplus : null);
        const moved = (a: BenchDesign['before'], b: BenchDesign['before']) => a.some((p, i) => p !== b[i] && (bplusOf(p) === null || bplusOf(b[i]!) === null || far(bplusOf(p)!, bplusOf(b[i]!)!)));
        if (next && (far(next.bplus, d.bplus) || far(next.output.bplus, d.output.bplus) || far(next.output.screenVolts, d.output.screenVolts) || far(next.output.splitter.bplus, d.output.splitter.bplus) || moved(next.before, d.before) || moved(next.after, d.after))) store.getState().commit(next, { derived: true });
      });
    }, SUPPLY_SETTLE_MS);
  };
  /**
   * While a drag runs: the amplifier and its supply solved again and again
   * (off the page's thread with the page's solver), one at a time, the
   * newest design each time, so the nodes follow the drag. The supply is
   * taken along the last settled solve's tangent (a few milliseconds a
   * solve; in full when the currents stray from it). Its answers show but
   * are never committed (following B+ waits for the release's full solve).
   */
  let live = false;
  /** When the last live answer was shown, ms: answers are paced by it, however fast the solver answers. */
  let lastLive = -Infinity;
  const follow = async () => {
    if (live) return;
    live = true;
    try {
      for (;;) {
        // A few times a second is live enough to read, and leaves the drag's frames to the drag: each answer redraws the
        // supply's table and the ratings list (measured: answered as fast as the tangent allows, every few frames, the
        // drag's median went from 3 to 4.6 ms and its p95 past the 8 ms frame).
        const wait = lastLive + LIVE_SUPPLY_PAUSE_MS - performance.now();
        if (wait > 0) await new Promise((resume) => setTimeout(resume, wait));
        const s = store.getState();
        const last = s.supplyView?.result;
        if (!s.dragging || !last?.ok) return;
        const d = s.design;
        const chain = d.supply.on ? onSupplyInputOf(d, s.registry) : null;
        if (!chain) return;
        const r = await solver({ ...chain.input, start: last.supply.nodes.map((n) => n.dc), ...(last.tangent ? { around: last.tangent } : {}), keepTangent: true });
        const now = store.getState();
        if (r === 'cancelled' || !r.ok || !now.dragging) return;
        store.setState({ supplyView: viewOf(chain, r, now.design !== d) });
        lastLive = performance.now();
        if (now.design === d) return;
      }
    } finally {
      live = false;
    }
  };
  store.subscribe((s, prev) => {
    if (s.design === prev.design && s.amplifier === prev.amplifier) return;
    const view = s.supplyView;
    if (view && !view.stale) store.setState({ supplyView: { ...view, stale: true } });
    // A keystroke shows the amplifier marked behind: the supply waits for the full pass; a drag has it follow live.
    if (!s.amplifier?.stale) schedule();
    else if (s.dragging && s.design !== prev.design) void follow();
  });
  schedule();
}
