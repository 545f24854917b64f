import type { ChainStage, StageKindName } from './chainTypes';
import { commonCathodeKind } from './commonCathodeKind';
import { followerKind } from './followerKind';
import { singleEndedKind } from './singleEndedKind';
import { splitLoadKind } from './splitLoadKind';
import { longTailedPairKind } from './longTailedPairKind';
import { pushPullKind } from './pushPullKind';
import type { StageKind } from './stageKind';

/** Every kind of stage the chain knows, by name: adding a kind means one adapter and one line here. */
export const STAGE_KINDS: { readonly [K in StageKindName]: StageKind<Extract<ChainStage, { kind: K }>> } = {
  'common-cathode': commonCathodeKind,
  follower: followerKind,
  'single-ended-output': singleEndedKind,
  'split-load': splitLoadKind,
  'long-tailed-pair': longTailedPairKind,
  'push-pull-output': pushPullKind,
};

/** A builder's name for each kind, for messages and cards. */
export const STAGE_KIND_LABELS: { readonly [K in StageKindName]: string } = {
  'common-cathode': 'Common cathode',
  follower: 'Cathode follower',
  'single-ended-output': 'Single-ended output',
  'split-load': 'Split-load phase splitter',
  'long-tailed-pair': 'Long-tailed pair phase splitter',
  'push-pull-output': 'Push-pull output',
};

/** The adapter for a stage's kind; null for a name that is not one (own keys only: "toString" is not a kind). */
export function kindOf<S extends ChainStage>(stage: S): StageKind<S> | null {
  const name: unknown = stage.kind;
  if (typeof name !== 'string' || !Object.hasOwn(STAGE_KINDS, name)) return null;
  return (STAGE_KINDS as Record<string, StageKind<ChainStage>>)[name] as unknown as StageKind<S>;
}
