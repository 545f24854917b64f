import type { ChainStage } from './chainTypes';

/**
 * A gain stage's volume control, as the share of its grid leak's signal its
 * wiper passes (1: none, or a pot at full). The leak is then the pot's
 * track: the coupling feeds its top, its bottom is at ground, and the grid
 * (behind its stopper, if any) hangs from the wiper, `volume` of the way up.
 * Only a capacitor-coupled gain stage has a leak to make a pot of.
 */
export function volumeOf(stage: ChainStage): number {
  return stage.kind === 'common-cathode' && stage.coupling.kind === 'capacitor' ? (stage.volume ?? 1) : 1;
}
