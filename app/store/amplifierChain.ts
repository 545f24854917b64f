import {
  findOutputTube,
  solveAmplifier,
  STAGE_KIND_LABELS,
  type AmplifierAtLevel,
  type ChainInput,
  type ChainResult,
  type ChainStage,
  type Failure,
} from '../../src/index';
import { lookupTube } from '../keep/customTubes';
import type { BenchDesign } from './analysis';

/**
 * A coupling capacitor the bench has no field for yet (between the first and
 * a second gain stage): taken as ideal, the largest value the model accepts,
 * so it adds no low-frequency corner of its own.
 */
const IDEAL_FARADS = 10;

/** A stage as the chain strip names it. */
export interface ChainCardName {
  readonly title: string;
  readonly tube: string;
  /** Which bench shows the stage's chart and values. */
  readonly bench: BenchDesign['stageKind'];
}

/** The bench's design as one amplifier: the voltage stage, its second stage if any, and the output stage when driven. */
export function chainInputOf(d: BenchDesign): { input: ChainInput; names: ChainCardName[] } | null {
  const tube = lookupTube(d.tubeId);
  if (!tube) return null;
  const stages: ChainStage[] = [
    {
      kind: 'common-cathode', tube, bplus: d.bplus, ra: d.ra, rk: d.rk, bypassed: d.bypassed,
      ...(d.bypassed && d.ck !== null && d.rk > 0 ? { ck: d.ck } : {}),
      coupling: d.cin === null ? { kind: 'direct' } : { kind: 'capacitor', cc: d.cin, rg: d.rg },
    },
  ];
  const names: ChainCardName[] = [{ title: 'Stage 1', tube: tube.id, bench: 'voltage' }];
  const s2 = d.stage2;
  const tube2 = s2.kind === 'none' ? null : lookupTube(s2.tubeId);
  if (s2.kind !== 'none') {
    if (!tube2) return null;
    stages.push(
      s2.kind === 'follower'
        ? { kind: 'follower', tube: tube2, bplus: d.bplus, rk: s2.rk, coupling: { kind: 'direct' } }
        : { kind: 'common-cathode', tube: tube2, bplus: d.bplus, ra: s2.ra, rk: s2.rk, bypassed: true, coupling: { kind: 'capacitor', cc: IDEAL_FARADS, rg: s2.rg } },
    );
    names.push({ title: 'Stage 2', tube: tube2.id, bench: 'voltage' });
  }
  const outputTube = d.drivesOutput ? findOutputTube(d.output.tubeId) : undefined;
  if (outputTube) {
    const { tubeId: _id, rg, ...parts } = d.output;
    stages.push({ ...parts, kind: 'single-ended-output', tube: outputTube, coupling: { kind: 'capacitor', cc: d.cout ?? IDEAL_FARADS, rg } });
    names.push({ title: 'Output', tube: outputTube.id, bench: 'output' });
  }
  const load = !outputTube && Number.isFinite(d.rl) ? { load: { rl: d.rl } } : {};
  return { input: { source: { rsource: d.rsource }, stages, ...load }, names };
}

/** What the chain strip shows: the whole amplifier, and it at a working level (1 W into the speaker, or the bench's output level). */
export interface AmplifierView {
  readonly names: readonly ChainCardName[];
  readonly kinds: readonly string[];
  readonly result: ({ ok: true } & ChainResult) | Failure;
  readonly atLevel: ({ ok: true } & AmplifierAtLevel) | Failure | null;
  /** The level `atLevel` is at, in words ("1 W", "2 V rms"). */
  readonly levelLabel: string;
  /** True while a drag or keystroke is in progress: these figures are from before it. */
  readonly stale: boolean;
}

/** One working level: 1 W for a chain ending in the output stage (common practice for sensitivity), else the bench's output level. */
export function analyzeAmplifier(d: BenchDesign): AmplifierView | null {
  const chain = chainInputOf(d);
  if (!chain) return null;
  const toSpeaker = d.drivesOutput;
  const result = solveAmplifier(chain.input, toSpeaker ? { power: 1 } : { outputRms: d.levelRms });
  const atLevel = result.ok ? (result.atLevel ?? null) : null;
  return {
    names: chain.names,
    kinds: chain.input.stages.map((s) => STAGE_KIND_LABELS[s.kind]),
    result,
    atLevel,
    levelLabel: toSpeaker ? '1 W' : `${d.levelRms} V rms`,
    stale: false,
  };
}
