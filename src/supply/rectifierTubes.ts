/**
 * Rectifier tubes. The voltage drop is modelled by Child–Langmuir's law,
 * I = k·V^1.5 per plate, with k set from the drop the record gives at a
 * stated current. All figures are from memory of the makers' sheets (marked
 * so): check them against the sheet of the tube you hold.
 */
export interface RectifierTube {
  readonly id: string;
  readonly heaterVolts: number;
  readonly heaterAmps: number;
  /** Most DC output current with a capacitor input, A. */
  readonly maxDcAmps: number;
  /** Largest reservoir capacitor the sheet allows, F. */
  readonly maxReservoirFarads: number;
  /** Most peak plate current, A (each plate). */
  readonly maxPeakAmps: number;
  /** The tube's drop at `dropAtAmps` through one plate, V. */
  readonly dropVolts: number;
  readonly dropAtAmps: number;
  /** Directly heated tubes warm as fast as the amplifier's; indirectly heated ones bring B+ up slowly. */
  readonly directlyHeated: boolean;
  readonly source: string;
}

const FROM_MEMORY = 'from memory of the makers\' data sheets; not checked against a sheet here';

export const RECTIFIER_TUBES: readonly RectifierTube[] = [
  { id: '5AR4', heaterVolts: 5, heaterAmps: 1.9, maxDcAmps: 0.25, maxReservoirFarads: 60e-6, maxPeakAmps: 0.75, dropVolts: 17, dropAtAmps: 0.225, directlyHeated: false, source: FROM_MEMORY },
  { id: '5U4GB', heaterVolts: 5, heaterAmps: 3, maxDcAmps: 0.275, maxReservoirFarads: 40e-6, maxPeakAmps: 1.0, dropVolts: 44, dropAtAmps: 0.225, directlyHeated: true, source: FROM_MEMORY },
  { id: '5Y3GT', heaterVolts: 5, heaterAmps: 2, maxDcAmps: 0.125, maxReservoirFarads: 20e-6, maxPeakAmps: 0.44, dropVolts: 50, dropAtAmps: 0.125, directlyHeated: true, source: FROM_MEMORY },
  { id: 'EZ81', heaterVolts: 6.3, heaterAmps: 1, maxDcAmps: 0.15, maxReservoirFarads: 50e-6, maxPeakAmps: 0.45, dropVolts: 20, dropAtAmps: 0.15, directlyHeated: false, source: FROM_MEMORY },
];

export function findRectifierTube(id: string): RectifierTube | undefined {
  return RECTIFIER_TUBES.find((t) => t.id === id);
}

/** Child–Langmuir perveance of one plate, A/V^1.5, from the record's drop at its stated current. */
export function perveanceOf(t: RectifierTube): number {
  return t.dropAtAmps / Math.pow(t.dropVolts, 1.5);
}
