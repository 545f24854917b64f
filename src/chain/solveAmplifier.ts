import { stopperOf } from './stopperOf';
import { volumeOf } from './volumeOf';
import type { Result } from '../result';
import { amplifierFindings } from '../stage/stageFindings';
import { sineLevel } from '../signal/levels';
import { atLevelOf, type AmplifierAtLevel, type AmplifierLevel } from './amplifierAtLevel';
import { chainCorners, type ChainNetwork } from './chainResponse';
import { noiseFigures } from './chainNoise';
import type { ChainInput, ChainResult, ChainStage, StageResult } from './chainTypes';
import { prepareAmplifier, type PreparedAmplifier } from './prepareAmplifier';
import { STAGE_KIND_LABELS } from './stageKinds';

export { checkChain, prepareAmplifier, solveStagesInPlace, stagesInPlaceProblem, MAX_CHAIN_STAGES, type PreparedAmplifier, type PlacedStages } from './prepareAmplifier';

/**
 * Solves an amplifier of 1 to 8 stages: each stage's operating point (a
 * direct-coupled grid at the DC of the output before it), its gain into the
 * load the next grid really presents, the chain's −3 dB points with every
 * network in it, and its clean limit from the large-signal transfers
 * composed sample by sample, naming the stage that clips first and each
 * stage's headroom there.
 */
export function solveAmplifier(input: ChainInput, level?: AmplifierLevel): Result<ChainResult & { readonly atLevel?: Result<AmplifierAtLevel> }> {
  return amplifierOf(input, prepareAmplifier(input), level);
}

/** The amplifier's figures from its prepared solve (solveOnSupply prepares it from the stages its rounds already placed). */
export function amplifierOf(input: ChainInput, a: Result<PreparedAmplifier>, level?: AmplifierLevel): Result<ChainResult & { readonly atLevel?: Result<AmplifierAtLevel> }> {
  if (!a.ok) return a;
  const { stages } = input;
  const { links, clips, first, inputPeak, gain } = a;
  const outputPeak = a.cleanOutputPeak();
  const last = stages[stages.length - 1]!;
  // Power into the speaker at the fundamental, as data sheets and the output stage's own figures state it.
  const speaker = last.kind === 'single-ended-output' || last.kind === 'push-pull-output' ? last.speakerOhms : null;
  const outputPower = speaker !== null ? a.cleanFundamental() ** 2 / (2 * speaker) : null;

  const network = networkOf(input, a);
  const { lowHz, highHz } = chainCorners(network);
  const noise = noiseFigures(network);
  const names = stages.map((s, i) => `Stage ${i + 1}, ${STAGE_KIND_LABELS[s.kind].toLowerCase()}, ${tubeName(s)}`);
  const tagged = amplifierFindings(links.map((l, i) => ({ name: names[i]!, findings: l.findings })));
  const results: StageResult[] = links.map((l, i) => ({
    kind: stages[i]!.kind,
    op: l.op,
    outputDc: l.outputDc,
    pins: { plate: l.op.va, cathode: l.op.vk, grid: l.op.vk + l.op.vgk, screen: l.pins?.screen ?? null, plate2: l.pins?.plate2 ?? null, plate2Current: l.pins?.plate2Current ?? null },
    supplyCurrent: l.supplyCurrent,
    ...(l.fullPowerCurrent !== undefined ? { fullPowerCurrent: l.fullPowerCurrent } : {}),
    gain: a.gains[i]!,
    zin: Number.isFinite(a.inputs[i]!) ? a.inputs[i]! : null,
    zout: l.zout,
    clipsAt: clips[i] ?? null,
    headroomDb: clips[i] ? 20 * Math.log10(clips[i]!.inputPeak / inputPeak) : null,
    findings: tagged.filter((f) => f.stage === i),
  }));
  return {
    ok: true,
    stages: results,
    gain,
    inverting: gain < 0,
    lowHz,
    highHz,
    noise,
    clipsFirst: { stage: first, by: clips[first]!.by },
    inputPeak,
    outputPeak,
    input: sineLevel(inputPeak),
    output: sineLevel(outputPeak),
    outputPower,
    speakerRms: outputPower === null || speaker === null ? null : Math.sqrt(outputPower * speaker),
    findings: tagged,
    ...(level === undefined ? {} : { atLevel: atLevelOf(a, input, level) }),
  };
}

/** The amplifier's linearised network, for its response: every stage at its operating point, each coupling as given. */
export function networkOf(input: ChainInput, a: PreparedAmplifier): ChainNetwork {
  return {
    rsource: input.source.rsource,
    stages: input.stages.map((s, i) => ({
      linear: a.links[i]!.linear,
      coupling: s.coupling.kind === 'capacitor' ? { cc: s.coupling.cc, rg: s.coupling.rg, ...(volumeOf(s) < 1 ? { volume: volumeOf(s) } : {}) } : null,
      gin: a.gridConductances[i]!,
      stopper: stopperOf(s),
    })),
    rl: input.load?.rl ?? Infinity,
    loadCc: input.load?.cc ?? null,
  };
}

function tubeName(s: ChainStage): string {
  if (s.kind === 'single-ended-output' || s.kind === 'push-pull-output') return s.tube.id;
  const t = s.tube as { id?: unknown };
  return typeof t.id === 'string' ? t.id : 'own model';
}
