import { DEFAULT_GRID_RESISTANCE, korenParamsProblem, LIBRARY_TUBE_IDS, triode, type KorenTriodeParams, type TubeRecord, type TypicalPoint } from '../../src/index';
import { loadKept, saveKept } from './keptTubes';

/**
 * Tubes the user made by fitting points: kept in this browser, exportable and
 * importable as JSON (format "quiescent-tubes", version 1), and usable wherever
 * a library tube is. Each is marked user-made.
 */
export interface CustomTubeSpec {
  readonly name: string;
  readonly params: KorenTriodeParams;
  readonly maxPlateVoltage: number;
  readonly maxPlateDissipation: number;
  readonly maxHeaterCathodeVoltage: number;
  /** The points it was fitted to, SI units, for showing the fit again. */
  readonly points: readonly { va: number; vg: number; ia: number }[];
  readonly rmsPercent: number;
  /** The datasheet typical figures it was fitted to, if any (SI units). */
  readonly typical?: readonly TypicalPoint[];
  /** Heater, V and A; interelectrode capacitances, F. Optional: unknown when not given. */
  readonly heater?: { readonly volts: number; readonly amps: number };
  readonly caps?: { readonly cgk: number; readonly cgp: number; readonly cpk: number };
}

export const TUBES_FORMAT = 'quiescent-tubes';
/**
 * Points kept with a tube, at most: enough to redraw the fit over them. A fit
 * of more keeps an even selection (the first and last included), so a
 * 100,000-point import cannot fill the browser's storage.
 */
export const MAX_KEPT_POINTS = 400;
/** Largest tubes file read, bytes. */
export const MAX_TUBES_FILE_BYTES = 20_000_000;

export function customRecord(spec: CustomTubeSpec): TubeRecord {
  const record: TubeRecord = {
    kind: 'tube',
    id: spec.name,
    description: `Yours: fitted to ${spec.points.length} points${spec.typical?.length ? ` and ${spec.typical.length} typical figures` : ''} (RMS error ${spec.rmsPercent.toFixed(1)} %).`,
    model: triode(spec.params, DEFAULT_GRID_RESISTANCE),
    fit: { method: 'fitted in Quiescent to the user\'s points', rmsPercent: spec.rmsPercent, worst: '' },
    directlyHeated: false,
    heaters: [{ wiring: 'single', volts: spec.heater?.volts ?? 6.3, amps: spec.heater?.amps ?? 0, source: spec.heater ? 'entered by the user' : 'not given' }],
    ratings: { maxPlateVoltage: spec.maxPlateVoltage, maxPlateDissipation: spec.maxPlateDissipation, maxHeaterCathodeVoltage: spec.maxHeaterCathodeVoltage, source: 'entered by the user' },
    capacitances: spec.caps ? { ...spec.caps, source: 'entered by the user' } : { cgk: 0, cgp: 0, cpk: 0, source: 'not given' },
    typical: spec.typical?.length ? spec.typical : spec.points.length > 0 ? [{ va: spec.points[0]!.va, vg: spec.points[0]!.vg, ia: spec.points[0]!.ia, source: 'user point' }] : [],
    userMade: true,
  };
  return Object.freeze(record);
}

/**
 * The user's tubes in this page, kept here (persisted in this browser) and
 * looked up through the store's registry (app/store/tubeRegistry.ts), which
 * takes their records on each change. Filled by loadCustomTubes at start-up (the
 * browser's store is asynchronous); saving and removing change it at once
 * and persist in the background.
 */
let specs: CustomTubeSpec[] = [];
/** Each user tube's record, built once when the list changes, never per look-up (a drag looks up every frame). */
let records: ReadonlyMap<string, TubeRecord> = new Map();

function recordsOf(list: readonly CustomTubeSpec[]): ReadonlyMap<string, TubeRecord> {
  return new Map(list.map((spec) => [spec.name, customRecord(spec)]));
}

function setSpecs(next: CustomTubeSpec[]): Promise<boolean> {
  specs = next;
  records = recordsOf(next);
  return saveKept(next);
}

/**
 * Reads the kept tubes into the page: every record that reads is kept, and
 * each that does not is named in the returned problems (the rest still load).
 */
export async function loadCustomTubes(): Promise<string[]> {
  const kept = await loadKept();
  const read = 'records' in kept ? readTubeList(kept.records) : 'legacy' in kept ? readTubesFile(kept.legacy) : { specs: [], problems: [] };
  const problems = 'message' in read ? [read.message] : read.problems;
  const loaded = 'specs' in read ? read.specs : [];
  // Tubes saved in this page before the load finished win over kept ones of the same name.
  const names = new Set(specs.map((x) => x.name));
  specs = [...loaded.filter((x) => !names.has(x.name)), ...specs];
  records = recordsOf(specs);
  if ('legacy' in kept && loaded.length > 0) await saveKept(specs); // move them to IndexedDB
  return problems;
}

export function customTubes(): TubeRecord[] {
  return [...records.values()];
}

export function customSpecs(): readonly CustomTubeSpec[] {
  return specs;
}


/** Checks a name for a new custom tube: a message, or null when it may be used. */
export function nameProblem(name: string): string | null {
  const n = name.trim();
  if (n.length === 0) return 'Give the tube a name';
  if (n.length > 40) return 'A tube name is at most 40 characters';
  if (LIBRARY_TUBE_IDS.some((id) => id.toUpperCase() === n.toUpperCase())) return `“${n}” is a library tube; choose another name`;
  return null;
}

/** Saves a tube (its points bounded to MAX_KEPT_POINTS); resolves false when the browser would not keep it. */
export function saveCustomTube(spec: CustomTubeSpec): Promise<boolean> {
  return saveCustomTubes([spec]);
}

export function saveCustomTubes(list: readonly CustomTubeSpec[]): Promise<boolean> {
  const names = new Set(list.map((x) => x.name));
  return setSpecs([...specs.filter((s) => !names.has(s.name)), ...list.map(bounded)]);
}

export function removeCustomTube(name: string): Promise<boolean> {
  return setSpecs(specs.filter((s) => s.name !== name));
}

/** Test hook: forget every custom tube (storage included). */
export function resetCustomTubes(): Promise<boolean> {
  return setSpecs([]);
}

/** Test hook: forget the page's list only, as a reload does, leaving the browser's store as it is. */
export function removeFromPageForTests(): void {
  specs = [];
  records = new Map();
}

/** A spec whose points are at most MAX_KEPT_POINTS, evenly chosen. */
export function bounded(spec: CustomTubeSpec): CustomTubeSpec {
  const n = spec.points.length;
  if (n <= MAX_KEPT_POINTS) return spec;
  const points = Array.from({ length: MAX_KEPT_POINTS }, (_, k) => spec.points[Math.round((k * (n - 1)) / (MAX_KEPT_POINTS - 1))]!);
  return { ...spec, points };
}

export function writeTubesFile(list: readonly CustomTubeSpec[]): string {
  return JSON.stringify({ format: TUBES_FORMAT, version: 1, tubes: list }, null, 2);
}

/**
 * Reads a tubes file. Every tube that reads is returned; each that does not
 * is named with what is wrong, and the others still come through.
 */
export function readTubesFile(text: string, maxTubes = Infinity): { ok: true; specs: CustomTubeSpec[]; problems: string[] } | { ok: false; message: string } {
  if (text.length > MAX_TUBES_FILE_BYTES) return { ok: false, message: `A tubes file is at most ${MAX_TUBES_FILE_BYTES / 1e6} MB (this one is ${(text.length / 1e6).toFixed(1)} MB).` };
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (e) {
    return { ok: false, message: `The file is not complete JSON: ${(e as Error).message}` };
  }
  const r = raw as { format?: unknown; version?: unknown; tubes?: unknown };
  if (!r || r.format !== TUBES_FORMAT) return { ok: false, message: 'This is not a Quiescent tubes file (its "format" is not "quiescent-tubes").' };
  if (r.version !== 1) return { ok: false, message: `Tubes file version ${String(r.version)} is not one this Quiescent reads (version 1).` };
  if (!Array.isArray(r.tubes)) return { ok: false, message: 'The file has no "tubes" list.' };
  // Past the most one file may bring, tubes are not read at all (nor sent back from the worker): named as a count.
  const read = readTubeList(r.tubes.slice(0, maxTubes));
  const over = r.tubes.length - Math.min(r.tubes.length, maxTubes);
  return { ok: true, specs: read.specs, problems: over > 0 ? [...read.problems, `${over} tubes past the first ${maxTubes} were not read (at most ${maxTubes} a file)`] : read.problems };
}

/** Reads a list of raw tube records: the ones that read, and a problem naming each that does not. */
export function readTubeList(list: readonly unknown[]): { specs: CustomTubeSpec[]; problems: string[] } {
  const specs: CustomTubeSpec[] = [];
  const problems: string[] = [];
  list.forEach((t, k) => {
    const r = readTubeSpec(t, k);
    if (typeof r === 'string') problems.push(r);
    else specs.push(bounded(r));
  });
  return { specs, problems };
}

const num = (v: unknown, lo: number, hi: number) => typeof v === 'number' && Number.isFinite(v) && v >= lo && v <= hi;

/** One tube record: the spec, or a message naming the tube (or its place) and what is wrong. */
function readTubeSpec(raw: unknown, k: number): CustomTubeSpec | string {
  const t = (typeof raw === 'object' && raw !== null ? raw : {}) as Record<string, unknown>;
  const where = `Tube ${k + 1}`;
  if (typeof t.name !== 'string' || nameProblem(t.name)) return `${where}: ${typeof t.name === 'string' ? nameProblem(t.name) : 'has no name'}`;
  const p = t.params as KorenTriodeParams | undefined;
  if (!p || typeof p !== 'object' || korenParamsProblem(p)) return `${where} (${t.name}): its Koren parameters are not usable`;
  if (!num(t.maxPlateVoltage, 1, 10000) || !num(t.maxPlateDissipation, 0.01, 1000) || !num(t.maxHeaterCathodeVoltage, 0, 1000) || !num(t.rmsPercent, 0, 1e6)) {
    return `${where} (${t.name}): ratings must be numbers in range`;
  }
  if (!Array.isArray(t.points) || !t.points.every((q: { va?: unknown; vg?: unknown; ia?: unknown }) => num(q?.va, 0, 1e4) && num(q?.vg, -1e3, 1e3) && num(q?.ia, 0, 100))) {
    return `${where} (${t.name}): its points must be { va, vg, ia } numbers`;
  }
  const heater = t.heater as { volts?: unknown; amps?: unknown } | undefined;
  if (heater !== undefined && !(num(heater?.volts, 0.5, 200) && num(heater?.amps, 0, 50))) return `${where} (${t.name}): its heater must give volts and amps in range`;
  const caps = t.caps as { cgk?: unknown; cgp?: unknown; cpk?: unknown } | undefined;
  if (caps !== undefined && !(num(caps?.cgk, 0, 1e-9) && num(caps?.cgp, 0, 1e-9) && num(caps?.cpk, 0, 1e-9))) return `${where} (${t.name}): its capacitances must be cgk, cgp, cpk in farads`;
  const typical = t.typical as TypicalPoint[] | undefined;
  if (typical !== undefined && !(Array.isArray(typical) && typical.every((q) => num(q?.va, 0, 1e4) && num(q?.vg, -1e3, 1e3) && num(q?.ia, 1e-9, 100)))) return `${where} (${t.name}): its typical figures must be { va, vg, ia } numbers`;
  return {
    name: t.name,
    params: { mu: p.mu, ex: p.ex, kg1: p.kg1, kp: p.kp, kvb: p.kvb },
    maxPlateVoltage: t.maxPlateVoltage as number,
    maxPlateDissipation: t.maxPlateDissipation as number,
    maxHeaterCathodeVoltage: t.maxHeaterCathodeVoltage as number,
    points: (t.points as CustomTubeSpec['points']).map((q) => ({ va: q.va, vg: q.vg, ia: q.ia })),
    rmsPercent: t.rmsPercent as number,
    ...(typical ? { typical: typical.map((q) => ({ ...q, source: 'entered by the user' })) } : {}),
    ...(heater ? { heater: { volts: heater.volts as number, amps: heater.amps as number } } : {}),
    ...(caps ? { caps: { cgk: caps.cgk as number, cgp: caps.cgp as number, cpk: caps.cpk as number } } : {}),
  };
}
