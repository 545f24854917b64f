import * as v from 'valibot';
import { CONNECTIONS, findOutputTube, MAX_CHAIN_STAGES, MAX_SECTIONS } from '../../src/index';
import { DESIGN_LIMITS as L, type Limit } from '../store/designLimits';

/**
 * The design file's fields as one schema (valibot), each with the range the
 * bench types it in (DESIGN_LIMITS) and the words a builder reads when a
 * file breaks it. `firstProblem` turns the first broken field into one
 * sentence naming it by its path and what was found. The file's envelope
 * (format, version, title) and the rules between fields (a driven output's
 * grid resistor is RL, the chain's order) are checked in designFile.ts.
 */

/** A number in the field's range: the same as typing it. */
const ranged = ({ min, max, unit, minPart }: Limit) => {
  const u = unit === '' ? '' : ` ${unit}`;
  if (minPart !== undefined) {
    return v.custom<number>((x) => x === 0 || (typeof x === 'number' && Number.isFinite(x) && x >= minPart && x <= max), `must be 0 or a number from ${minPart} to ${max}${u}`);
  }
  return v.custom<number>((x) => typeof x === 'number' && Number.isFinite(x) && x >= min && x <= max, `must be a number from ${min} to ${max}${u}`);
};
const rangedOrNull = (l: Limit) => v.union([v.null(), ranged(l)], ranged(l).message as string);
const yesNo = () => v.boolean('must be true or false');
const oneOf = <const T extends readonly [string, ...string[]]>(options: T) => v.picklist(options, `must be one of ${options.join(', ')}`);
/** A tube's name; whether this browser knows it is settled on opening (withKnownTubes), so a missing tube never loses the design. */
const tubeName = () => v.custom<string>((x) => typeof x === 'string' && x.trim().length > 0 && x.length <= 60, 'must name a tube (text of at most 60 characters)');
/** A supply node feeding a gain stage: 0 the reservoir, then one per filter section (whether the supply has it is checked in designFile.ts). */
const supplyNode = () => v.optional(v.custom<number>((x) => typeof x === 'number' && Number.isInteger(x) && x >= 0 && x <= MAX_SECTIONS, `must be a supply node, a whole number from 0 (the reservoir) to ${MAX_SECTIONS}, or left out`));
const section = <T extends v.ObjectEntries>(entries: T) => v.object(entries, 'must be an object');

/** A capacitor-coupled follower's coupling (came within version 3: absent, the follower is direct-coupled). */
const FOLLOWER_COUPLING = v.optional(section({ cc: ranged(L.stage2.cc), rg: ranged(L.stage2.rg), vbias: ranged(L.stage2.vbias) }));

/** A stage's targets: each box a value or null (off). */
const TARGETS = section({
  minGain: rangedOrNull(L.targets.gain),
  minCleanOutputRms: rangedOrNull(L.targets.level),
  thdLevelRms: rangedOrNull(L.targets.level),
  maxThd: rangedOrNull(L.targets.thd),
  maxDissipationFraction: rangedOrNull(L.targets.dissipation),
  maxZout: rangedOrNull(L.targets.ohms),
  raMin: rangedOrNull(L.targets.ohms),
  raMax: rangedOrNull(L.targets.ohms),
  rkMin: rangedOrNull(L.targets.ohms),
  rkMax: rangedOrNull(L.targets.ohms),
  minGridHeadroom: rangedOrNull(L.targets.headroom),
  heaterCathodeWithinRating: yesNo(),
  // Came later within version 3 (the output stage's targets): absent, off.
  minPowerW: v.optional(rangedOrNull(L.targets.power)),
  powerThd: v.optional(rangedOrNull(L.targets.thd)),
  thdPowerW: v.optional(rangedOrNull(L.targets.power)),
  maxThdAtPower: v.optional(rangedOrNull(L.targets.thd)),
  bplusMin: v.optional(rangedOrNull(L.output.bplus)),
  bplusMax: v.optional(rangedOrNull(L.output.bplus)),
});

/** The voltage stage on the bench and the amplifier's own values (every version). */
export const BENCH_STAGE = v.object({
  tubeId: tubeName(),
  bplus: ranged(L.bplus),
  ra: ranged(L.ra),
  rk: ranged(L.rk),
  bypassed: yesNo(),
  rl: rangedOrNull(L.rl),
  series: oneOf(['E12', 'E24', 'E96']),
  snap: yesNo(),
  rsource: ranged(L.rsource),
  cin: rangedOrNull(L.cin),
  rg: ranged(L.rg),
  // Came later within version 3: absent, none.
  rstopper: v.optional(ranged(L.rstopper)),
  volume: v.optional(rangedOrNull(L.volume)),
  // Came later within version 3: absent, the voltage stages' node.
  node: supplyNode(),
  ck: rangedOrNull(L.ck),
  cout: rangedOrNull(L.cout),
  levelRms: ranged(L.levelRms),
  // Came within version 3: absent, the published tables' 5 %.
  thdLimit: v.optional(ranged(L.output.thdLimit)),
  // Came within version 3: absent, no targets.
  targets: v.optional(TARGETS),
  // Came later within version 3 (global feedback): absent, none.
  feedbackRf: v.optional(rangedOrNull(L.feedbackRf)),
  feedbackCf: v.optional(rangedOrNull(L.feedbackCf)),
  // Came later within version 3 (the follower's and the output stage's own targets): absent, none.
  followerTargets: v.optional(TARGETS),
  outputTargets: v.optional(TARGETS),
  stage2: section({
    kind: oneOf(['none', 'follower', 'common-cathode']),
    tubeId: tubeName(),
    ra: ranged(L.stage2.ra),
    rk: ranged(L.stage2.rk),
    rg: ranged(L.stage2.rg),
    coupling: FOLLOWER_COUPLING,
    // Came later within version 3: absent, none.
    rstopper: v.optional(ranged(L.rstopper)),
  }),
});

/** The output stage (version 2 on). */
export const OUTPUT_STAGE = v.object({
  stageKind: oneOf(['voltage', 'follower', 'output']),
  output: section({
    tubeId: v.custom<string>((x) => typeof x === 'string' && findOutputTube(x) !== undefined, 'must name an output tube in the library'),
    connection: oneOf(CONNECTIONS as unknown as readonly [string, ...string[]]),
    bplus: ranged(L.output.bplus),
    screenVolts: ranged(L.output.screenVolts),
    ulTap: ranged(L.output.ulTap),
    zPrimary: ranged(L.output.zPrimary),
    rPrimary: ranged(L.output.rPrimary),
    // The transformer's inductances came within version 3: absent (or null), the ideal transformer.
    primaryInductance: v.optional(rangedOrNull(L.output.primaryInductance)),
    leakageInductance: v.optional(rangedOrNull(L.output.leakageInductance)),
    bias: oneOf(['cathode', 'fixed']),
    rk: ranged(L.output.rk),
    vg: ranged(L.output.vg),
    rg: ranged(L.output.rg),
    speakerOhms: ranged(L.output.speakerOhms),
    thdLimit: ranged(L.output.thdLimit),
    // The push-pull pair came within version 3: absent, the stage is single-ended with the pair's defaults.
    pair: v.optional(oneOf(['single-ended', 'push-pull'])),
    raa: v.optional(ranged(L.output.raa)),
    mismatch: v.optional(ranged(L.output.mismatch)),
    idleMismatch: v.optional(ranged(L.output.mismatch)),
    splitter: v.optional(
      section({
        kind: oneOf(['split-load', 'long-tailed-pair']),
        tubeId: tubeName(),
        bplus: ranged(L.splitter.bplus),
        ra: ranged(L.splitter.ra),
        ra2: ranged(L.splitter.ra),
        rk: ranged(L.splitter.rk),
        rtail: ranged(L.splitter.rtail),
        vgrid: ranged(L.splitter.vgrid),
        rg: ranged(L.splitter.rg),
        cc: ranged(L.splitter.cc),
        coupling: v.optional(oneOf(['capacitor', 'direct'])),
        // Came later within version 3: absent, none.
        rstopper: v.optional(ranged(L.rstopper)),
      }),
    ),
  }),
});

/** Whether the voltage stages drive the output stage (added within version 2; absent: apart). */
export const JOIN = v.object({ drivesOutput: v.optional(yesNo()) });

/**
 * The builder's meter readings (came later within version 3: absent, none):
 * one per stage at most, each naming its stage's place (1 the input stage)
 * and the tube it was read on; the supply and a second plate where the
 * stage is read from its plate side.
 */
export const READINGS = v.object({
  readings: v.optional(
    v.pipe(
      v.array(
        section({
          stage: v.custom<number>((x) => typeof x === 'number' && Number.isInteger(x) && x >= 1 && x <= MAX_CHAIN_STAGES, `must be a stage’s place, a whole number from 1 (the input stage) to ${MAX_CHAIN_STAGES}`),
          tubeId: tubeName(),
          plate: ranged(L.meter),
          cathode: ranged(L.meter),
          supply: v.optional(ranged(L.meter)),
          plate2: v.optional(ranged(L.meter)),
        }),
        'must be a list of readings',
      ),
      v.check((list) => new Set(list.map((r) => r.stage)).size === list.length, 'must hold one reading per stage'),
    ),
  ),
});

/**
 * The builder's meter readings on the output tubes (came later within
 * version 3: absent, none): one per tube at most, each naming the tube (1 or
 * 2), its type and the stage's form and bias it was read on.
 */
export const OUTPUT_READINGS = v.object({
  outputReadings: v.optional(
    v.pipe(
      v.array(
        section({
          tube: v.picklist([1, 2], 'must be 1 or 2 (which tube of a pair; 1 for a single tube)'),
          tubeId: tubeName(),
          pair: oneOf(['single-ended', 'push-pull']),
          bias: oneOf(['cathode', 'fixed']),
          plate: ranged(L.meter),
          screen: rangedOrNull(L.meter),
          grid: v.custom<number>((x) => typeof x === 'number' && Number.isFinite(x) && x >= L.meterGrid.min && x <= L.meterGrid.max, `must be a number from ${L.meterGrid.min} to ${L.meterGrid.max} V`),
          cathode: ranged(L.meter),
        }),
        'must be a list of readings',
      ),
      v.check((list) => new Set(list.map((r) => r.tube)).size === list.length, 'must hold one reading per tube'),
    ),
  ),
});

/**
 * How the small tubes' heaters are fed (came later within version 3: absent,
 * the bench's default). A wiring names one of the tube's heater wirings; a
 * name the tube does not have reads as its first, as a tube can change.
 */
export const HEATERS = v.object({
  heaters: v.optional(
    section({
      voltageStages: oneOf(['ac', 'dc']),
      dcVolts: ranged(L.heaterDcVolts),
      // Came later within version 3 (heater elevation): absent, at ground.
      elevationVolts: v.optional(ranged(L.heaterElevationVolts)),
      wiring: v.record(
        v.custom<string>((x) => typeof x === 'string' && x.length <= 60, 'must be keyed by tube names of at most 60 characters'),
        v.custom<string>((x) => typeof x === 'string' && x.length <= 60, 'must name a heater wiring (text of at most 60 characters)'),
        'must be an object of tube names and their heater wirings',
      ),
    }),
  ),
});

/** A stage of the chain off the bench (version 3): its kind first, then its parts. */
export const STAGE_KIND = v.object({ kind: oneOf(['common-cathode', 'follower']) });
export const GAIN_STAGE = v.object({
  tubeId: tubeName(),
  bplus: ranged(L.bplus),
  ra: ranged(L.ra),
  rk: ranged(L.rk),
  bypassed: yesNo(),
  ck: rangedOrNull(L.ck),
  cc: rangedOrNull(L.cin),
  rg: ranged(L.rg),
  // Came later within version 3: absent, none.
  rstopper: v.optional(ranged(L.rstopper)),
  volume: v.optional(rangedOrNull(L.volume)),
  node: supplyNode(),
});
export const FOLLOWER_STAGE = v.object({ tubeId: tubeName(), rk: ranged(L.stage2.rk), coupling: FOLLOWER_COUPLING, rstopper: v.optional(ranged(L.rstopper)) });

/** Values quoted in messages are cut short and shown as JSON text, never interpreted. */
export const quote = (x: unknown) => {
  const t = JSON.stringify(x) ?? String(x);
  return t.length > 40 ? `${t.slice(0, 40)}…` : t;
};

/**
 * The first field of `input` the schema refuses, as a sentence ("design.ra
 * must be a number from 100 to 10000000 Ω (found -5). Nothing was opened."),
 * or null when every field is good. `at` names where the input sits in the
 * file ("design", "design.after[0]").
 */
export function firstProblem(schema: v.GenericSchema, input: unknown, at: string): string | null {
  const r = v.safeParse(schema, input, { abortEarly: true });
  if (r.success) return null;
  const issue = r.issues[0];
  const keys = (issue.path ?? []).map((p) => p.key);
  const path = keys.map((k) => (typeof k === 'number' ? `[${k}]` : `.${String(k)}`)).join('');
  // An absent key: a whole section reads as missing; a value as what its own schema says of nothing.
  if (issue.input === undefined) {
    const field = keys.reduce<v.GenericSchema | undefined>((sch, k) => (sch as { entries?: Record<string, v.GenericSchema> } | undefined)?.entries?.[String(k)], schema);
    if (field && 'entries' in field) return `${at}${path} is missing. Nothing was opened.`;
    const own = field ? v.safeParse(field, undefined) : null;
    if (own && !own.success) return `${at}${path} ${own.issues[0].message} (found undefined). Nothing was opened.`;
  }
  return `${at}${path} ${issue.message} (found ${quote(issue.input)}). Nothing was opened.`;
}
