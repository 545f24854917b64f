import type { StateCreator } from 'zustand/vanilla';
import type { Failure } from '../../src/index';
import type { BenchDesign } from './analysis';
import { addGainStage, canAddFollower, gainIndexOf, MAX_VOLTAGE_STAGES, moveStage, removeStage, selectStage, voltageStages } from './stagePlans';
import type { WorkbenchState } from './workbenchStore';

/**
 * The amplifier's shape: which voltage stage is on the bench, and adding,
 * removing and reordering stages. Each is one commit of a new design, so each
 * is an undo step and autosave, files and links carry it.
 */
export interface ChainSlice {
  /** Why the last change to the chain's shape could not be made; null after one that could. */
  chainNote: string | null;
  /** Puts voltage stage i on the bench (a follower's gain stage, for a follower). */
  showStage: (i: number) => void;
  /** Adds a gain stage after stage i, or a cathode follower direct-coupled to gain stage i. */
  addStage: (i: number, kind: 'common-cathode' | 'follower') => void;
  dropStage: (i: number) => void;
  shiftStage: (i: number, dir: -1 | 1) => void;
}

/** A chain the bench cannot hold, whatever the model says of its values. */
export function chainProblem(d: BenchDesign): Failure | null {
  if (d.before.length > 0 && d.cin === null) {
    return { ok: false, reason: 'invalid-input', message: 'Cin must be a coupling capacitor: only the first stage may be direct-coupled (to the source)', field: 'cin' };
  }
  return null;
}

export const createChainSlice: StateCreator<WorkbenchState, [], [], ChainSlice> = (set, get) => {
  const apply = (next: BenchDesign | null, refused: string) => {
    if (!next) {
      set({ chainNote: refused });
      return;
    }
    const failure = get().commit(next, { step: true });
    set({ chainNote: failure ? `${refused}: ${failure.message}` : null });
  };
  return {
    chainNote: null,
    showStage: (i) => {
      const d = get().design;
      const next = selectStage(d, i);
      if (next.before.length === d.before.length && next.stageKind === d.stageKind) return;
      apply(next, 'That stage cannot go on the bench');
    },
    addStage: (i, kind) => {
      const d = get().design;
      const list = voltageStages(d);
      if (list.length >= MAX_VOLTAGE_STAGES) {
        set({ chainNote: `An amplifier here has at most ${MAX_VOLTAGE_STAGES} voltage stages before its output stage` });
        return;
      }
      if (kind === 'common-cathode') {
        apply(addGainStage(d, i), 'No stage was added');
        return;
      }
      const g = gainIndexOf(list, i);
      if (!canAddFollower(list, g)) {
        set({ chainNote: 'That stage already has its cathode follower' });
        return;
      }
      // The follower joins its gain stage on the bench, with the bench's own rules for a new follower's Rk.
      apply(selectStage(d, g), 'No follower was added');
      // Direct-coupled, as the menu says: a coupling the bench held from an earlier follower is not carried over.
      if (get().chainNote === null) get().setStage2({ kind: 'follower', coupling: undefined });
    },
    dropStage: (i) => apply(removeStage(get().design, i), 'The amplifier keeps at least one gain stage'),
    shiftStage: (i, dir) => apply(moveStage(get().design, i, dir), dir < 0 ? 'The first stage has nothing before it' : 'The last stage has nothing after it'),
  };
};
