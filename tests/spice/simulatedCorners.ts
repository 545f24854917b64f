/**
 * The simulator's -3 dB points from its sweep, by log interpolation between samples, against its highest point, or
 * against the sample nearest `referenceHz` when given (an amplifier's band is read against 1 kHz).
 */
export function simulatedCorners(data: string, referenceHz?: number): { low: number | null; high: number | null } {
  const rows = data.trim().split('\n').map((l) => l.trim().split(/\s+/).map(Number)).map((c) => ({ f: c[0]!, m: c[1]! }));
  let peak = 0;
  rows.forEach((r, k) => {
    if (referenceHz === undefined ? r.m > rows[peak]!.m : Math.abs(Math.log(r.f / referenceHz)) < Math.abs(Math.log(rows[peak]!.f / referenceHz))) peak = k;
  });
  const level = rows[peak]!.m / Math.SQRT2;
  const cross = (a: { f: number; m: number }, b: { f: number; m: number }) => Math.exp(Math.log(a.f) + ((level - a.m) / (b.m - a.m)) * (Math.log(b.f) - Math.log(a.f)));
  let low: number | null = null;
  for (let k = peak; k > 0; k--) if (rows[k - 1]!.m < level) { low = cross(rows[k - 1]!, rows[k]!); break; }
  let high: number | null = null;
  for (let k = peak; k < rows.length - 1; k++) if (rows[k + 1]!.m < level) { high = cross(rows[k]!, rows[k + 1]!); break; }
  return { low, high };
}
