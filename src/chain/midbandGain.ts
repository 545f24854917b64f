import type { LinkSample } from './stageKind';

/**
 * A stage's midband gain from its own large-signal transfer, by a central
 * difference over ±1 mV at the grid: it takes in what the plate's slopes
 * alone leave out (an ultralinear screen's share of the turns, a pair's
 * second grid driven by the splitter).
 */
export function midbandGain(sample: (vin: number, out: LinkSample) => void): number {
  const probe: LinkSample = { vout: 0, vgk: 0, ia: 0, vout2: 0 };
  const h = 1e-3;
  sample(h, probe);
  const up = probe.vout;
  sample(-h, probe);
  return (up - probe.vout) / (2 * h);
}
