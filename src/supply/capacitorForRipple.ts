import { E12 } from '../parts/preferredValues';
import type { SupplyDesign, SupplySolution } from './supplyTypes';

/** The largest capacitor suggested, F: past it, another filter section is the cure (our threshold: a can that size is rare in tube gear). */
export const MAX_SUGGESTED_FARADS = 0.01;

/** The least E12 value at or above `x` (IEC 60063), or null for a value that is not positive and finite. */
function e12AtLeast(x: number): number | null {
  if (!(x > 0) || !Number.isFinite(x)) return null;
  const decade = Math.pow(10, Math.floor(Math.log10(x)));
  for (const m of [...E12, 10]) {
    const v = Number((m * decade).toPrecision(3));
    if (v >= x * (1 - 1e-9)) return v;
  }
  return null;
}

/** |H|² of the section into a node at ω: its series R (and L) into the node's capacitor C, the node's load a constant current. */
const gain2 = (w: number, r: number, l: number, c: number) => 1 / ((1 - w * w * l * c) ** 2 + (w * r * c) ** 2);

/**
 * The capacitor at node `node` that brings its ripple within `maxRms`
 * (V rms), rounded up to the E12 series; null when it is within already,
 * when no capacitor up to MAX_SUGGESTED_FARADS would do, or the node is
 * not in the design. From the solved ripple: the capacitor's share of the
 * section feeding it is scaled, at the ripple's fundamental (twice the
 * mains behind a full-wave rectifier), by how far the node is over: an R–C
 * or L–C section's |H| = 1/|1 − ω²LC + jωRC| (the textbook low-pass,
 * Ohm's law for impedances), solved for C; a reservoir behind a capacitor
 * input, whose ripple is the load's charge between pulses over C
 * (ΔV ≈ I/(2f·C) behind full wave, the textbook relation), scaled as 1/C. Its harmonics fall
 * faster than the fundamental as C grows, so the answer errs on the large
 * side; the tests solve the supply again with it.
 */
export function capacitorForRipple(d: SupplyDesign, s: SupplySolution, node: number, maxRms: number): number | null {
  // A design or solution that is not one (the model's promise: no throw) asks for nothing.
  if (!d || typeof d !== 'object' || !d.input || typeof d.input !== 'object' || !Array.isArray(d.sections) || !s || typeof s !== 'object' || !Array.isArray(s.nodes)) return null;
  if (!Number.isInteger(node) || !(typeof maxRms === 'number' && Number.isFinite(maxRms))) return null;
  const now = s.nodes[node]?.rippleRms;
  if (!(typeof now === 'number' && Number.isFinite(now) && now > maxRms && maxRms > 0)) return null;
  if (!(typeof d.mainsHz === 'number' && d.mainsHz > 0 && Number.isFinite(d.mainsHz))) return null;
  const ratio = maxRms / now;
  const w = 2 * Math.PI * d.mainsHz * (d.rectifier.kind === 'silicon-half-wave' ? 1 : 2);
  const section = node === 0 ? null : d.sections[node - 1];
  const c0 = node === 0 ? d.input.c : section?.c;
  if (!(typeof c0 === 'number' && c0 > 0 && Number.isFinite(c0))) return null;
  const feed = section ? (section.kind === 'rc' ? { r: section.r, l: 0 } : { r: section.rdc, l: section.l }) : d.input.kind === 'choke' ? { r: d.input.rdc, l: d.input.l } : null;
  if (feed && !(Number.isFinite(feed.r) && feed.r >= 0 && Number.isFinite(feed.l) && feed.l >= 0)) return null;
  let c: number;
  if (feed === null) c = c0 / ratio;
  else {
    // |H'|² = ratio²·|H|²: (1 − ω²Lx)² + (ωRx)² = 1/|H'|², a quadratic in x whose larger root is the capacitor.
    const target = 1 / (ratio * ratio * gain2(w, feed.r, feed.l, c0));
    const a = w ** 4 * feed.l ** 2 + (w * feed.r) ** 2;
    const b = -2 * w * w * feed.l;
    const disc = b * b - 4 * a * (1 - target);
    if (!(a > 0) || disc < 0) return null;
    c = (-b + Math.sqrt(disc)) / (2 * a);
  }
  const chosen = e12AtLeast(Math.max(c, c0));
  return chosen !== null && chosen <= MAX_SUGGESTED_FARADS ? chosen : null;
}
