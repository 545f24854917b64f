/** The schematic's one ink. */
export const INK = '#1d2329';
