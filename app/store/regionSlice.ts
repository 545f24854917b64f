import type { StateCreator } from 'zustand/vanilla';
import { feasibleRegion, followerRegion, judgeDesign, preferredBest, judgeFollower, judgeOutput, outputRegion, rankFollowers, rankOutputTubes, rankTubes, type DesignVerdict, type FeasibleRegion, type FollowerRegion, type FollowerTargetStage, type OutputRank, type OutputRegion, type OutputTargetStage, type PlaneRegion, type RegionGrid, type RegionStage, type Result, type Targets, type TubeRank, type TubeRecord } from '../../src/index';
import { outputRequestOf } from './outputTargets';
import { DESIGN_LIMITS } from './designLimits';
import { loadAfterBench } from './stagePlans';
import { stageDesignOf } from './analysis';
import { heaterField } from './heaterChoice';
import { anyTarget, NO_TARGETS, targetPlanOf, targetsOf, withTargetPlan } from './targetPlan';
import type { WorkbenchState, WorkbenchStore } from './workbenchStore';

/** Where the region is worked out: in a Web Worker on the page (regionThread), in place in tests. */
export interface RegionSolver {
  region(stage: RegionStage, targets: Targets, grid: RegionGrid): Promise<Result<FeasibleRegion>>;
  rank(targets: Targets, stage: Omit<RegionStage, 'tube'>, tubes: readonly TubeRecord[]): Promise<Result<{ ranks: TubeRank[] }>>;
  /** A follower's targets along its line, and every tube as that follower. */
  followerRegion(stage: FollowerTargetStage, targets: Targets, samples: number, rkRange: readonly [number, number]): Promise<Result<FollowerRegion>>;
  rankFollowers(targets: Targets, stage: Omit<FollowerTargetStage, 'tube'>, tubes: readonly TubeRecord[]): Promise<Result<{ ranks: TubeRank[] }>>;
  /** An output stage's targets over its plate plane, and every output tube in its socket. */
  outputRegion(stage: OutputTargetStage, targets: Targets, grid: RegionGrid): Promise<Result<OutputRegion>>;
  rankOutputs(targets: Targets, stage: Omit<OutputTargetStage, 'tube'>): Promise<Result<{ ranks: OutputRank[] }>>;
}

/** The model's own calls, run on the page's thread: for tests and platforms with no workers. */
export const inPlaceRegionSolver: RegionSolver = {
  region: async (stage, targets, grid) => feasibleRegion(stage, targets, grid),
  rank: async (targets, stage, tubes) => rankTubes(targets, stage, tubes),
  followerRegion: async (stage, targets, samples, rkRange) => followerRegion(stage, targets, samples, rkRange),
  rankFollowers: async (targets, stage, tubes) => rankFollowers(targets, stage, tubes),
  outputRegion: async (stage, targets, grid) => outputRegion(stage, targets, grid),
  rankOutputs: async (targets, stage) => rankOutputTubes(targets, stage),
};

/** Samples along a follower's line for its targets: a point every few pixels at chart sizes. */
export const FOLLOWER_REGION_SAMPLES = 64;

export interface FollowerRegionView {
  readonly key: string;
  readonly result: Result<FollowerRegion>;
}

/** The region on the chart: first coarse, then complete. */
export const COARSE_GRID = { nx: 30, ny: 20 } as const;
export const FULL_GRID = { nx: 60, ny: 40 } as const;

/** A region on the chart as the store holds it: the gain stage's (FeasibleRegion) or the output stage's (OutputRegion). */
export interface RegionView<R = FeasibleRegion> {
  /** What it was worked out for (the stage, its targets and the chart's window). */
  readonly key: string;
  readonly result: Result<R>;
  /** False for the coarse pass shown first. */
  readonly complete: boolean;
}

/** Every tube ranked for the targets, while it is worked out (null) and after. */
export interface RankingView<R = TubeRank> {
  readonly key: string;
  readonly result: Result<{ ranks: R[] }> | null;
}

export type OutputRegionView = RegionView<OutputRegion>;
export type OutputRankingView = RankingView<OutputRank>;

export interface RegionSlice {
  region: RegionView | null;
  /** With the follower on the bench: where along its line its targets hold. */
  followerRegion: FollowerRegionView | null;
  /** The design on the bench held against its targets (null with no targets, or on the output bench); kept from before while dragging. */
  verdict: Result<DesignVerdict> | null;
  ranking: RankingView | null;
  /** With the output stage on the bench: where on its plane its targets hold, and every output tube ranked in its socket. */
  outputRegion: OutputRegionView | null;
  outputRanking: OutputRankingView | null;
  /** Takes a ranked output tube at its best bias and B+. */
  takeOutputRank: (rank: OutputRank) => void;
  /** While on, a drag of the operating point stays inside the region. */
  keepInside: boolean;
  setKeepInside: (on: boolean) => void;
  setHeaterTarget: (on: boolean) => void;
  clearTargets: () => void;
  /** Ranks every tube (the library's and the user's) against the targets. */
  rankTubesNow: () => void;
  /** Takes a ranked tube and its design onto the bench. */
  takeRanked: (rank: TubeRank) => void;
  /** Moves the operating point to the region's best point. */
  moveToBest: () => void;
}

/** The region's inputs, or null when there is nothing to draw (no target, the output bench, an unknown tube). */
export function regionRequestOf(s: WorkbenchState): { key: string; stage: RegionStage; targets: Targets; extent: { vmax: number; iaMax: number } } | null {
  const d = s.design;
  if (d.stageKind !== 'voltage' || !anyTarget(d.targets)) return null;
  const tube = s.registry.lookup(d.tubeId);
  if (!tube) return null;
  const sd = stageDesignOf(d, tube, s.registry);
  const stage: RegionStage = { tube, bplus: sd.bplus, rl: sd.rl ?? Infinity, rsource: sd.rsource ?? 0, bypassed: sd.bypassed ?? true, ...(sd.rg !== undefined ? { rg: sd.rg } : {}), ...(sd.rstopper ? { rstopper: sd.rstopper } : {}), ...(sd.volume !== undefined ? { volume: sd.volume } : {}), ...(sd.heaterVolts ? { heaterVolts: sd.heaterVolts } : {}) };
  const targets = targetsOf(d.targets);
  const extent = s.analysis.sheet.extent;
  const key = JSON.stringify([tube.id, stage.bplus, stage.rl, stage.rsource, stage.bypassed, stage.rg ?? null, stage.rstopper ?? 0, stage.volume ?? 1, stage.heaterVolts ?? 0, targets, extent.vmax, extent.iaMax]);
  return { key, stage, targets, extent: { vmax: extent.vmax, iaMax: extent.iaMax } };
}

/** The follower's targets' inputs, while the follower is the stage shown and a target is set; else null. */
export function followerRequestOf(s: WorkbenchState): { key: string; stage: FollowerTargetStage; targets: Targets } | null {
  const d = s.design;
  const f = s.followerBench;
  if (d.stageKind !== 'follower' || !f || !anyTarget(d.followerTargets, 'follower')) return null;
  const stage: FollowerTargetStage = { tube: f.tube, bplus: f.bplus, vgrid: f.vgrid, rl: loadAfterBench(d).rl, ...heaterField(d.heaters) };
  const targets = targetsOf(d.followerTargets);
  return { key: JSON.stringify(['follower', f.tube.id, stage.bplus, stage.vgrid, stage.rl, stage.heaterVolts ?? 0, targets]), stage, targets };
}

/** The Rk range a follower's drag and its region keep to: the design's own limits. */
export const FOLLOWER_RK_RANGE: readonly [number, number] = [DESIGN_LIMITS.stage2.rk.min, DESIGN_LIMITS.stage2.rk.max];

/** The region along the follower's line, when it was worked out for the follower now shown. */
export function currentFollowerRegion(s: WorkbenchState): FollowerRegion | null {
  const r = s.followerRegion;
  return r?.result.ok && r.key === followerRequestOf(s)?.key ? r.result : null;
}

/** The cell of the region a plate-plane point falls in, or null outside the grid. */
export function regionCellAt(r: PlaneRegion, vpk: number, ia: number): { i: number; j: number } | null {
  const dv = r.va.length > 1 ? r.va[1]! - r.va[0]! : 0;
  const di = r.ia.length > 1 ? r.ia[1]! - r.ia[0]! : 0;
  if (!(dv > 0 && di > 0)) return null;
  const i = Math.floor(vpk / dv);
  const j = Math.floor(ia / di);
  return i >= 0 && i < r.va.length && j >= 0 && j < r.ia.length ? { i, j } : null;
}

/** The targets failing at a plate-plane point (empty inside the region), or null where the region does not reach. */
export function failingAt(r: PlaneRegion, vpk: number, ia: number): readonly string[] | null {
  const c = regionCellAt(r, vpk, ia);
  return c ? r.failing[c.i]![c.j]! : null;
}

/**
 * The nearest point inside the region to (vpk, ia), measured in cells (so a
 * volt and a milliamp weigh as the chart draws them): the point itself when
 * it is inside, else the centre of the nearest inside cell; null when no
 * cell is inside.
 */
export function nearestInside(r: PlaneRegion, vpk: number, ia: number): { vpk: number; ia: number } | null {
  const here = regionCellAt(r, vpk, ia);
  if (here && r.inside[here.i]![here.j]) return { vpk, ia };
  const dv = r.va[1]! - r.va[0]!;
  const di = r.ia[1]! - r.ia[0]!;
  let best: { vpk: number; ia: number; d: number } | null = null;
  for (let i = 0; i < r.va.length; i++) {
    for (let j = 0; j < r.ia.length; j++) {
      if (!r.inside[i]![j]) continue;
      const d = ((r.va[i]! - vpk) / dv) ** 2 + ((r.ia[j]! - ia) / di) ** 2;
      if (!best || d < best.d) best = { vpk: r.va[i]!, ia: r.ia[j]!, d };
    }
  }
  return best && { vpk: best.vpk, ia: best.ia };
}

export const createRegionSlice =
  (solver: RegionSolver): StateCreator<WorkbenchState, [], [], RegionSlice> =>
  (set, get) => ({
    region: null,
    followerRegion: null,
    verdict: null,
    ranking: null,
    outputRegion: null,
    outputRanking: null,
    keepInside: false,
    setKeepInside: (on) => set({ keepInside: on }),
    setHeaterTarget: (on) => {
      const d = get().design;
      get().commit(withTargetPlan(d, { ...targetPlanOf(d), heaterCathodeWithinRating: on }));
    },
    clearTargets: () => {
      const d = get().design;
      get().commit(withTargetPlan(d, NO_TARGETS));
    },
    rankTubesNow: () => {
      const output = outputRequestOf(get());
      if (output) {
        const { tube: _t, ...stage } = output.stage;
        const key = JSON.stringify(['output', stage, output.targets]);
        set({ outputRanking: { key, result: null } });
        void solver.rankOutputs(output.targets, stage).then((result) => {
          if (get().outputRanking?.key === key) set({ outputRanking: { key, result } });
        });
        return;
      }
      const follower = followerRequestOf(get());
      if (follower) {
        const { tube: _t, ...stage } = follower.stage;
        const key = JSON.stringify(['follower', stage, follower.targets]);
        set({ ranking: { key, result: null } });
        const tubes = get().tubes.flatMap((t) => get().registry.lookup(t.id) ?? []);
        void solver.rankFollowers(follower.targets, stage, tubes).then((result) => {
          if (get().ranking?.key === key) set({ ranking: { key, result } });
        });
        return;
      }
      const req = regionRequestOf(get());
      if (!req) return;
      const { tube: _t, ...stage } = req.stage;
      const key = JSON.stringify([stage, req.targets]);
      set({ ranking: { key, result: null } });
      const tubes = get().tubes.flatMap((t) => get().registry.lookup(t.id) ?? []);
      void solver.rank(req.targets, stage, tubes).then((result) => {
        if (get().ranking?.key === key) set({ ranking: { key, result } });
      });
    },
    takeRanked: (rank) => {
      const s = get();
      if (s.design.stageKind === 'follower') {
        s.setStage2({ tubeId: rank.tubeId });
        const d = get().design;
        get().commit({ ...d, stage2: { ...d.stage2, rk: rank.rk } });
        return;
      }
      s.chooseTube(rank.tubeId);
      const d = get().design;
      get().commit({ ...d, ra: rank.ra, rk: rank.rk });
    },
    takeOutputRank: (rank) => {
      const s = get();
      s.chooseOutputTube(rank.tubeId);
      if (get().design.output.tubeId === rank.tubeId) get().placeOutputPoint(rank.vpk, rank.ip);
    },
    moveToBest: () => {
      if (get().design.stageKind === 'output') {
        const o = get().outputRegion;
        const r = o?.result.ok ? o.result : null;
        if (r?.best) get().placeOutputPoint(r.va[r.best.i]!, r.ia[r.best.j]!);
        return;
      }
      const f = currentFollowerRegion(get());
      if (get().design.stageKind === 'follower') {
        const d = get().design;
        if (f?.best) get().commit({ ...d, stage2: { ...d.stage2, rk: f.best.rk } });
        return;
      }
      const r = get().region;
      if (!r?.result.ok || !r.result.best) return;
      const d = get().design;
      const exact = { ...d, ra: r.result.best.ra, rk: r.result.best.rk };
      // Snapping, the best point is taken as parts to order: the preferred pair around it whose weakest target holds best.
      const req = d.snap ? regionRequestOf(get()) : null;
      const tube = req?.stage.tube;
      const ordered = req && tube ? preferredBest(stageDesignOf(exact, tube as TubeRecord, get().registry), req.targets, d.series) : null;
      get().commit(ordered?.ok ? { ...exact, ra: ordered.ra, rk: ordered.rk } : exact);
    },
  });

/**
 * Keeps the region current: whenever its inputs change (a target, the tube,
 * B+ or the load; never Ra or Rk, which the region is a map of), the coarse
 * grid, then the full one. One job at a time; a change while one runs waits
 * and only the newest waiting is worked out, so a B+ drag never queues up.
 */
export function watchRegion(store: WorkbenchStore, solver: RegionSolver): void {
  let running = false;
  let waiting = false;
  /** The coarse grid, then the full one, each shown as it comes; dropped when the request has changed, cut short when a newer one waits. */
  const coarseThenFull = async <R,>(key: string, current: () => string | undefined, solve: (grid: RegionGrid) => Promise<Result<R>>, show: (view: RegionView<R>) => void) => {
    for (const [grid, complete] of [[COARSE_GRID, false], [FULL_GRID, true]] as const) {
      const result = await solve(grid);
      if (current() !== key) return;
      show({ key, result, complete });
      if (waiting) return;
    }
  };
  const run = async () => {
    if (running) {
      waiting = true;
      return;
    }
    running = true;
    try {
      do {
        waiting = false;
        const output = outputRequestOf(store.getState());
        if (output) {
          if (store.getState().outputRegion?.key === output.key && store.getState().outputRegion?.complete) break;
          await coarseThenFull(output.key, () => outputRequestOf(store.getState())?.key, (grid) => solver.outputRegion(output.stage, output.targets, { ...grid, extent: output.extent }), (outputRegion) => store.setState({ outputRegion }));
          continue;
        }
        if (store.getState().outputRegion) store.setState({ outputRegion: null });
        const follower = followerRequestOf(store.getState());
        if (follower) {
          if (store.getState().region) store.setState({ region: null });
          if (store.getState().followerRegion?.key === follower.key) break;
          const result = await solver.followerRegion(follower.stage, follower.targets, FOLLOWER_REGION_SAMPLES, FOLLOWER_RK_RANGE);
          if (followerRequestOf(store.getState())?.key === follower.key) store.setState({ followerRegion: { key: follower.key, result } });
          continue;
        }
        if (store.getState().followerRegion) store.setState({ followerRegion: null });
        const req = regionRequestOf(store.getState());
        if (!req) {
          if (store.getState().region) store.setState({ region: null });
          break;
        }
        if (store.getState().region?.key === req.key && store.getState().region?.complete) break;
        await coarseThenFull(req.key, () => regionRequestOf(store.getState())?.key, (grid) => solver.region(req.stage, req.targets, { ...grid, extent: req.extent }), (region) => store.setState({ region }));
      } while (waiting);
    } finally {
      running = false;
    }
  };
  /** The design on the bench against its targets: on every change that is not a drag frame (the drag's release judges it). */
  const judge = (s: WorkbenchState) => {
    const output = outputRequestOf(s);
    if (output) {
      store.setState({ verdict: judgeOutput(output.stage, output.targets) });
      return;
    }
    const follower = followerRequestOf(s);
    if (follower) {
      store.setState({ verdict: judgeFollower(follower.stage, s.design.stage2.rk, follower.targets) });
      return;
    }
    const req = regionRequestOf(s);
    const tube = req?.stage.tube;
    const verdict = req && tube ? judgeDesign(stageDesignOf(s.design, tube as TubeRecord, s.registry), req.targets) : null;
    if (verdict !== null || s.verdict !== null) store.setState({ verdict });
  };
  store.subscribe((s, prev) => {
    if ((s.design !== prev.design && !s.dragging) || (prev.dragging && !s.dragging)) judge(s);
    // A drag of the point moves only Ra and Rk, which the region is a map of: nothing to ask for on its frames.
    if (s.dragging === 'point' || s.dragging === 'follower-point' || s.dragging === 'output-point') return;
    if (s.design !== prev.design || s.analysis.sheet.extent !== prev.analysis.sheet.extent || s.outputBench !== prev.outputBench || s.followerBench !== prev.followerBench || (prev.dragging && !s.dragging)) {
      const output = outputRequestOf(s);
      if (output || s.outputRegion) {
        if (output?.key !== s.outputRegion?.key || !output) void run();
        if (output) return;
      }
      const follower = followerRequestOf(s);
      if (follower) {
        if (follower.key !== s.followerRegion?.key) void run();
        return;
      }
      const req = regionRequestOf(s);
      if (req?.key !== s.region?.key || !req || s.followerRegion) void run();
    }
  });
  judge(store.getState());
  void run();
}
