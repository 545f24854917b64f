import type { StateCreator } from 'zustand/vanilla';
import { fitTriode, parseCurveCsv, parseTypicalCsv, plateFamily, type CsvLineError, type PlateCurve, type TriodeFit, type TypicalPoint } from '../../src/index';
import { customSpecs, nameProblem, readTubesFile, removeCustomTube, saveCustomTube, saveCustomTubes, writeTubesFile } from '../keep/customTubes';
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
  };
  setCustomCsv: (csv: string) => void;
  setTypicalCsv: (text: string) => void;
  fitCustom: () => void;
  saveCustom: (
    name: string,
    ratings: { maxPlateVoltage: number; maxPlateDissipation: number; maxHeaterCathodeVoltage: number },
    extras?: { heater?: { volts: number; amps: number }; caps?: { cgk: number; cgp: number; cpk: number } },
  ) => void;
  removeCustom: (name: string) => void;
  importCustomTubes: (text: string) => void;
  exportCustomTubes: () => string;
}

const EXAMPLE = '# Va (V), Vg (V), Ia (mA), read off a curve sheet\n';

export const createCustomSlice: StateCreator<WorkbenchState, [], [], CustomSlice> = (set, get) => ({
  custom: { csv: EXAMPLE, typicalCsv: '', lineErrors: [], fit: null, curves: [], points: [], typical: [], note: null },

  setCustomCsv: (csv) => set({ custom: { ...get().custom, csv } }),
  setTypicalCsv: (typicalCsv) => set({ custom: { ...get().custom, typicalCsv } }),

  fitCustom: () => {
    const c = get().custom;
    const { points, errors } = parseCurveCsv(c.csv);
    const typ = parseTypicalCsv(c.typicalCsv);
    const lineErrors = [...errors, ...typ.errors.map((e) => ({ ...e, message: `typical figures: ${e.message}` }))];
    const fit = fitTriode(points, { typical: typ.typical });
    const grids = [...new Set([...points, ...typ.typical].map((p) => p.vg))].sort((a, b) => b - a);
    const vmax = Math.max(...[...points, ...typ.typical].map((p) => p.va), 1) * 1.15;
    const curves = fit.ok ? plateFamily({ kind: 'triode-model', params: fit.params, gridResistance: 2000 }, grids, vmax, 80) : [];
    set({ custom: { ...c, lineErrors, fit, curves, points, typical: typ.typical, note: null } });
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

  importCustomTubes: (text) => {
    const r = readTubesFile(text);
    if (!r.ok) return set({ custom: { ...get().custom, note: `Nothing imported: ${r.message}` } });
    if (r.specs.length === 0) return set({ custom: { ...get().custom, note: `Nothing imported: ${r.problems.slice(0, 5).join('; ')}` } });
    const kept = saveCustomTubes(r.specs);
    get().refreshTubes();
    const skipped = r.problems.length > 0 ? ` Not imported: ${r.problems.slice(0, 5).join('; ')}${r.problems.length > 5 ? `; and ${r.problems.length - 5} more` : ''}.` : '';
    set({ custom: { ...get().custom, note: `Imported ${r.specs.length} tube${r.specs.length === 1 ? '' : 's'}.${skipped}` } });
    void kept.then((ok) => ok || set({ custom: { ...get().custom, note: `${get().custom.note} This browser would not keep them (storage full or blocked): keep the file.` } }));
  },

  exportCustomTubes: () => writeTubesFile(customSpecs()),
});
