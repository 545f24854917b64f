/** Two resistances in parallel, Ω. Infinity stands for "absent" (an open circuit). */
export function parallel(a: number, b: number): number {
  if (a === Infinity) return b;
  if (b === Infinity) return a;
  if (a + b === 0) return 0;
  return (a * b) / (a + b);
}
