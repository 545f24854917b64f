import { findRectifierTube, type FilterSection, type Rectifier, type SupplyDesign } from '../../src/index';
import { checkPlan, DEMO_BIAS, DEMO_SUPPLY, type SupplyPlan } from '../store/supplyPlan';

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
const quote = (v: unknown) => (v === undefined ? 'nothing' : JSON.stringify(v) ?? String(v));

/**
 * A design file's `supply` section: its shape checked here, its values by
 * the same checks as typing them (checkPlan: the model's own limits). A file
 * written before the supply was part of a design opens with the bench's
 * default supply, which changes none of the design's values.
 */
export function readSupplyPlan(raw: unknown): { ok: true; plan: SupplyPlan } | { ok: false; message: string } {
  if (raw === undefined) return { ok: true, plan: DEMO_SUPPLY };
  const bad = (path: string, what: string, found: unknown) => ({ ok: false as const, message: `design.supply${path} ${what} (found ${quote(found)}). Nothing was opened.` });
  if (!isRecord(raw)) return bad('', 'must be an object', raw);
  if (typeof raw.on !== 'boolean') return bad('.on', 'must be true or false', raw.on);
  for (const key of ['mainsHz', 'secondaryRms', 'windingOhms', 'channels'] as const) if (!isNum(raw[key])) return bad(`.${key}`, 'must be a number', raw[key]);
  for (const key of ['secondaryAmps', 'humRms'] as const) if (raw[key] !== null && !isNum(raw[key])) return bad(`.${key}`, 'must be a number or null', raw[key]);
  if (raw.follow !== undefined && typeof raw.follow !== 'boolean') return bad('.follow', 'must be true or false', raw.follow);
  // Regulation came after the supply itself: a file without it gives the winding's resistance.
  if (raw.regulation !== undefined && raw.regulation !== null && !isNum(raw.regulation)) return bad('.regulation', 'must be a number or null', raw.regulation);
  const r = raw.rectifier;
  let rectifier: Rectifier;
  if (isRecord(r) && (r.kind === 'silicon-bridge' || r.kind === 'silicon-full-wave' || r.kind === 'silicon-half-wave')) rectifier = { kind: r.kind };
  else if (isRecord(r) && r.kind === 'tube' && typeof r.tubeId === 'string' && findRectifierTube(r.tubeId)) rectifier = { kind: 'tube', tubeId: findRectifierTube(r.tubeId)!.id };
  else return bad('.rectifier', 'must be a silicon bridge, silicon full wave, silicon half wave or a known rectifier tube', r);
  const i = raw.input;
  let input: SupplyDesign['input'];
  if (isRecord(i) && i.kind === 'capacitor' && isNum(i.c)) input = { kind: 'capacitor', c: i.c };
  else if (isRecord(i) && i.kind === 'choke' && isNum(i.c) && isNum(i.l) && isNum(i.rdc)) input = { kind: 'choke', l: i.l, rdc: i.rdc, c: i.c };
  else return bad('.input', 'must be a capacitor (c) or a choke (l, rdc, c)', i);
  if (!Array.isArray(raw.sections)) return bad('.sections', 'must be a list', raw.sections);
  const sections: FilterSection[] = [];
  for (const [k, s] of raw.sections.entries()) {
    if (isRecord(s) && s.kind === 'rc' && isNum(s.r) && isNum(s.c)) sections.push({ kind: 'rc', r: s.r, c: s.c });
    else if (isRecord(s) && s.kind === 'lc' && isNum(s.l) && isNum(s.rdc) && isNum(s.c)) sections.push({ kind: 'lc', l: s.l, rdc: s.rdc, c: s.c });
    else return bad(`.sections[${k}]`, 'must be an R–C (r, c) or L–C (l, rdc, c) section', s);
  }
  const f = raw.feeds;
  if (!isRecord(f) || !isNum(f.output) || !isNum(f.voltage)) return bad('.feeds', 'must name the output and voltage stages\' nodes', f);
  if (f.splitter !== undefined && !isNum(f.splitter)) return bad('.feeds.splitter', 'must be the phase splitter\'s node (a number), or left out', f.splitter);
  if (f.screens !== undefined && !isNum(f.screens)) return bad('.feeds.screens', 'must be the output stage\'s screens\' node (a number), or left out', f.screens);
  // The bias supply came after the supply itself: a file without it opens with the bench's own, which changes nothing
  // it designed (a cathode-biased stage has no use for one).
  const b = raw.bias;
  if (b !== undefined && !isRecord(b)) return bad('.bias', 'must be an object, or left out', b);
  if (b !== undefined) for (const key of ['secondaryRms', 'windingOhms', 'reservoir', 'r', 'c'] as const) if (!isNum(b[key])) return bad(`.bias.${key}`, 'must be a number', b[key]);
  const bias = b === undefined ? DEMO_BIAS : { secondaryRms: b.secondaryRms as number, windingOhms: b.windingOhms as number, reservoir: b.reservoir as number, r: b.r as number, c: b.c as number };
  // The mains voltage came after the supply itself: a file without it opens at 230 V, which changes nothing it designed.
  if (raw.mainsVolts !== undefined && !isNum(raw.mainsVolts)) return bad('.mainsVolts', 'must be a number, or left out', raw.mainsVolts);
  const plan: SupplyPlan = {
    on: raw.on,
    mainsHz: raw.mainsHz as number,
    mainsVolts: (raw.mainsVolts as number | undefined) ?? DEMO_SUPPLY.mainsVolts,
    secondaryRms: raw.secondaryRms as number,
    windingOhms: raw.windingOhms as number,
    rectifier,
    input,
    sections,
    // A file from before the splitter had its own node feeds it from the voltage stages', as it was designed.
    // And from before the screens could have a node of their own hangs them from their plates' node.
    feeds: { output: f.output, voltage: f.voltage, ...(f.splitter !== undefined ? { splitter: f.splitter as number } : {}), ...(f.screens !== undefined ? { screens: f.screens as number } : {}) },
    channels: raw.channels as number,
    // Following came after the supply itself: a file without it keeps its typed B+.
    follow: raw.follow === true,
    secondaryAmps: raw.secondaryAmps as number | null,
    humRms: raw.humRms as number | null,
    regulation: (raw.regulation ?? null) as number | null,
    bias,
  };
  const problem = checkPlan(plan);
  return problem ? { ok: false, message: `design.supply: ${problem.message}. Nothing was opened.` } : { ok: true, plan };
}
