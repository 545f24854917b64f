import type { ChainStage, StageKindName } from './chainTypes';
import { commonCathodeKind } from './commonCathodeKind';
import { followerKind } from './followerKind';
import { singleEndedKind } from './singleEndedKind';
import type { StageKind } from './stageKind';

/** Every kind of stage the chain knows, by name: adding a kind means one adapter and one line here. */
export const STAGE_KINDS: { readonly [K in StageKindName]: StageKind<Extract<ChainStage, { kind: K }>> } = {
  'common-cathode': commonCathodeKind,
  follower: followerKind,
  'single-ended-output': singleEndedKind,
};

/** A builder's name for each kind, for messages and cards. */
export const STAGE_KIND_LABELS: { readonly [K in StageKindName]: string } = {
  'common-cathode': 'Common cathode',
  follower: 'Cathode follower',
  'single-ended-output': 'Single-ended output',
};

export function kindOf<S extends ChainStage>(stage: S): StageKind<S> | null {
  const k = (STAGE_KINDS as Record<string, StageKind<ChainStage>>)[stage.kind];
  return (k ?? null) as StageKind<S> | null;
}
