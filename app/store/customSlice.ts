import type { StateCreator } from 'zustand/vanilla';
import type { CsvLineError, PlateCurve, TriodeFit, TypicalPoint } from '../../src/index';
import { customSpecs, MAX_TUBES_FILE_BYTES, nameProblem, removeCustomTube, saveCustomTube, saveCustomTubes, writeTubesFile } from '../keep/customTubes';
import { createOffThread } from '../work/offThread';
import type { WorkbenchState } from './workbenchStore';

/** Making a tube of one's own: points in, a fitted model out, saved under a name. */
export interface CustomSlice {
  custom: {
    readonly csv: string;
    /** Typical figures, one per line: Va, Vg, Ia (mA), mu, rp (Ω), gm (mA/V). */
    readonly typicalCsv: string;
    readonly lineErrors: readonly CsvLineError[];
    readonly fit: ({ ok: true } & TriodeFit) | { ok: false; message: string } | null;
    /** The fitted model's curves at the grid voltages of the points, for drawing over them. */
    readonly curves: readonly PlateCurve[];
    readonly points: readonly { va: number; vg: number; ia: number }[];
    readonly typical: readonly TypicalPoint[];
    readonly note: string | null;
    /** A fit or an import running off the page's thread: what it is and how far it has got; null when idle. */
    readonly busy: { readonly what: 'fit' | 'import'; readonly done: number; readonly of: number } | null;
  };
  setCustomCsv: (csv: string) => void;
  /**
   * A paste into the points box between `start` and `end` of what it holds: a
   * paste that would overfill it keeps the whole lines that fit and says how
   * many were left out, before the page ever lays the rest out.
   */
  pastePoints: (text: string, start: number, end: number) => void;
  setTypicalCsv: (text: string) => void;
  /** Fits off the page's thread; resolves when the fit is in (or was cancelled). */
  fitCustom: () => Promise<void>;
  /** Stops a running fit or import; nothing it would have changed is changed. */
  cancelCustomWork: () => void;
  saveCustom: (
    name: string,
    ratings: { maxPlateVoltage: number; maxPlateDissipation: number; maxHeaterCathodeVoltage: number },
    extras?: { heater?: { volts: number; amps: number }; caps?: { cgk: number; cgp: number; cpk: number } },
  ) => void;
  removeCustom: (name: string) => void;
  importCustomTubes: (text: string) => Promise<void>;
  exportCustomTubes: () => string;
}

const EXAMPLE = '# Va (V), Vg (V), Ia (mA), read off a curve sheet\n';

/**
 * The points box holds at most this many characters, about 10,000 points (the
 * most a fit takes). A larger paste is refused with a message and the box
 * keeps what it had: a 100,000-line box made every keystroke cost a second.
 */
export const MAX_POINTS_TEXT = 400_000;
/** Tubes read from one file, at most. */
export const MAX_IMPORT_TUBES = 500;

export const createCustomSlice: StateCreator<WorkbenchState, [], [], CustomSlice> = (set, get) => {
  // Per store: the worker that fits and imports off the page's thread.
  const work = createOffThread();
  // The running job's number: a progress report that arrives after its job ended or was cancelled (the worker's
  // reports travel on their own channel and can land after the answer) must not mark the bench busy again.
  let currentJob = 0;
  const patch = (p: Partial<CustomSlice['custom']>) => set({ custom: { ...get().custom, ...p } });
  return {
  custom: { csv: EXAMPLE, typicalCsv: '', lineErrors: [], fit: null, curves: [], points: [], typical: [], note: null, busy: null },

  setCustomCsv: (csv) => {
    if (csv.length > MAX_POINTS_TEXT) return patch({ note: `The points box holds at most ${MAX_POINTS_TEXT.toLocaleString('en')} characters (about 10,000 points); this is ${csv.length.toLocaleString('en')}. Thin the points or fit them in parts.` });
    // The box's maxLength cuts a larger paste where the browser inserts it (so the page never lays out a 100,000-line box): say so.
    patch({ csv, ...(csv.length === MAX_POINTS_TEXT ? { note: `The points box is full (${MAX_POINTS_TEXT.toLocaleString('en')} characters, about 10,000 points): a longer paste was cut there. Thin the points or fit them in parts.` } : {}) });
  },
  pastePoints: (text, start, end) => {
    const held = get().custom.csv;
    const before = held.slice(0, Math.max(0, start));
    const after = held.slice(Math.max(start, end));
    const room = MAX_POINTS_TEXT - before.length - after.length;
    if (text.length <= room) return patch({ csv: before + text + after, note: null });
    // Whole lines only: a line cut in the middle would read as a wrong point.
    const cut = room > 0 ? text.lastIndexOf('\n', room - 1) : -1;
    const kept = cut > 0 ? text.slice(0, cut + 1) : '';
    const lines = (t: string) => (t === '' ? 0 : t.split('\n').filter((l) => l.trim() !== '').length);
    patch({
      csv: before + kept + after,
      note: `The paste had ${lines(text).toLocaleString('en')} lines (${text.length.toLocaleString('en')} characters); the points box holds ${MAX_POINTS_TEXT.toLocaleString('en')} characters (about 10,000 points), so the first ${lines(kept).toLocaleString('en')} lines were kept. Thin the points or fit them in parts.`,
    });
  },
  setTypicalCsv: (typicalCsv) => patch({ typicalCsv: typicalCsv.slice(0, MAX_POINTS_TEXT) }),

  fitCustom: async () => {
    const c = get().custom;
    if (c.busy) return;
    const job = ++currentJob;
    patch({ busy: { what: 'fit', done: 0, of: 9 }, note: null });
    const outcome = await work.fit(c.csv, c.typicalCsv, (done, of) => {
      if (job === currentJob) patch({ busy: { what: 'fit', done, of } });
    });
    if (job === currentJob) currentJob = 0;
    if (outcome === 'cancelled') return patch({ busy: null, note: 'Fit cancelled: nothing changed.' });
    patch({ ...outcome, busy: null });
  },

  cancelCustomWork: () => {
    currentJob = 0;
    work.cancel();
  },

  saveCustom: (name, ratings, extras = {}) => {
    const c = get().custom;
    const problem = nameProblem(name);
    if (problem) return set({ custom: { ...c, note: problem } });
    if (!c.fit?.ok) return set({ custom: { ...c, note: 'Fit the points first.' } });
    const kept = saveCustomTube({ name: name.trim(), params: c.fit.params, ...ratings, points: c.points, rmsPercent: c.fit.rmsPercent, typical: c.typical, ...extras });
    get().refreshTubes();
    set({ custom: { ...get().custom, note: `Saved “${name.trim()}”: choose it in the tube list (marked “yours”).` } });
    void kept.then((ok) => ok || set({ custom: { ...get().custom, note: `“${name.trim()}” is usable in this page, but this browser would not keep it (storage full or blocked): export your tubes to a file to keep them.` } }));
  },

  removeCustom: (name) => {
    void removeCustomTube(name);
    get().refreshTubes();
  },

  importCustomTubes: async (text) => {
    if (get().custom.busy) return;
    if (text.length > MAX_TUBES_FILE_BYTES) return patch({ note: `Nothing imported: a tubes file is at most ${MAX_TUBES_FILE_BYTES / 1e6} MB (this one is ${(text.length / 1e6).toFixed(1)} MB).` });
    patch({ busy: { what: 'import', done: 0, of: 1 }, note: null });
    const r = await work.readTubes(text, MAX_IMPORT_TUBES);
    patch({ busy: null });
    if (r === 'cancelled') return patch({ note: 'Import cancelled: nothing imported.' });
    if (!r.ok) return set({ custom: { ...get().custom, note: `Nothing imported: ${r.message}` } });
    if (r.specs.length === 0) return set({ custom: { ...get().custom, note: `Nothing imported: ${r.problems.slice(0, 5).join('; ')}` } });
    const kept = saveCustomTubes(r.specs);
    get().refreshTubes();
    const skipped = r.problems.length > 0 ? ` Not imported: ${r.problems.slice(0, 5).join('; ')}${r.problems.length > 5 ? `; and ${r.problems.length - 5} more` : ''}.` : '';
    set({ custom: { ...get().custom, note: `Imported ${r.specs.length} tube${r.specs.length === 1 ? '' : 's'}.${skipped}` } });
    void kept.then((ok) => ok || set({ custom: { ...get().custom, note: `${get().custom.note} This browser would not keep them (storage full or blocked): keep the file.` } }));
  },

  exportCustomTubes: () => writeTubesFile(customSpecs()),
  };
};
