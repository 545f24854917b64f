import type { TargetName } from '../../../src/index';

/**
 * Each target's edge on the chart has its own dash pattern (one ink, so the
 * key reads in grayscale and whatever colours a reader sees); the chart key
 * shows the same patterns.
 */
export const TARGET_DASH: Readonly<Record<TargetName, string>> = {
  minGain: '8 3',
  minCleanOutputRms: '2 3',
  maxThdAt: '9 3 2 3',
  maxDissipationFraction: '12 3 2 3 2 3',
  maxZout: '18 3',
  raRange: '4 2 1 2',
  rkRange: '3 6',
  minGridHeadroom: '6 2 6 6',
  heaterCathodeWithinRating: '1 5 6 5',
  minPower: '10 2 2 2',
  maxThdAtPower: '5 3 1 3 1 3',
  bplusRange: '14 4 4 4',
};
