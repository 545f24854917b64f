/**
 * The Illinois variant of regula falsi (M. Dowell and P. Jarratt, BIT 11,
 * 1971): secant steps inside a bracket, halving the stale end's value when
 * the same end is kept twice, so it converges superlinearly and never leaves
 * [a, b]. Used where each evaluation is costly and the function is smooth
 * and monotone (a corner frequency, a drive level). Bounded: maxIterations.
 */
export function illinois(g: (x: number) => number, a: number, b: number, absTol: number, options: { fa?: number; fb?: number; start?: number; maxIterations?: number } = {}): number {
  let fa = options.fa ?? g(a);
  let fb = options.fb ?? g(b);
  let side = 0;
  let x = options.start !== undefined && options.start > Math.min(a, b) && options.start < Math.max(a, b) ? options.start : (a * fb - b * fa) / (fb - fa);
  for (let k = 0; k < (options.maxIterations ?? 60); k++) {
    const fx = g(x);
    if (Math.abs(fx) <= absTol) return x;
    if (fx * fa > 0) {
      a = x;
      fa = fx;
      if (side === -1) fb /= 2;
      side = -1;
    } else {
      b = x;
      fb = fx;
      if (side === 1) fa /= 2;
      side = 1;
    }
    x = (a * fb - b * fa) / (fb - fa);
    if (!(x > Math.min(a, b) && x < Math.max(a, b))) x = 0.5 * (a + b);
    if (Math.abs(b - a) <= absTol) return x;
  }
  return x;
}
