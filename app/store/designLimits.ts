import { FEEDBACK_CF_LIMITS, FEEDBACK_RF_LIMITS, MAX_MISMATCH, OUTPUT_LIMITS, RAA_LIMITS, WINDING_LIMITS } from '../../src/index';

/** A design field's range: typing, files and links, drags and the sliders' aria bounds all read it from here. */
export interface Limit {
  readonly min: number;
  readonly max: number;
  readonly unit: string;
  /** Where 0 is allowed (no part) but a part must be at least this, as Rk (0: no cathode resistor). */
  readonly minPart?: number;
}

const limit = (min: number, max: number, unit: string, minPart?: number): Limit => (minPart === undefined ? { min, max, unit } : { min, max, unit, minPart });

/**
 * Every design field's range, one place. The output stage's come from the
 * model's own (OUTPUT_LIMITS), so the bench never accepts what the model
 * refuses. Values outside are typing slips, not designs.
 */
export const DESIGN_LIMITS = {
  bplus: limit(5, 1500, 'V'),
  ra: limit(100, 10e6, 'Ω'),
  rk: limit(0, 10e6, 'Ω', 1),
  rl: limit(100, 100e6, 'Ω'),
  rsource: limit(0, 10e6, 'Ω'),
  cin: limit(1e-12, 1, 'F'),
  rg: limit(1e3, 100e6, 'Ω'),
  /** A grid stopper: 0 (none), or from 10 Ω to 1 MΩ (past that it would eat the band with any grid's capacitance). */
  rstopper: limit(0, 1e6, 'Ω', 10),
  /** A volume control's setting, dB below full (0 at full): to −60 dB, where it is as good as off. */
  volume: limit(-60, 0, 'dB'),
  ck: limit(1e-9, 1, 'F'),
  cout: limit(1e-12, 1, 'F'),
  levelRms: limit(1e-4, 1000, 'V rms'),
  targets: {
    gain: limit(0.01, 10000, '×'),
    level: limit(1e-4, 1000, 'V rms'),
    thd: limit(1e-5, 0.5, ''),
    dissipation: limit(0.01, 1.5, ''),
    ohms: limit(1, 100e6, 'Ω'),
    headroom: limit(1e-3, 1000, 'V'),
    power: limit(0.01, 2000, 'W'),
  },
  stage2: {
    ra: limit(100, 10e6, 'Ω'),
    rk: limit(1, 10e6, 'Ω'),
    rg: limit(1e3, 100e6, 'Ω'),
    /** A capacitor-coupled follower's coupling capacitor and the grid voltage its divider holds. */
    cc: limit(1e-12, 1, 'F'),
    vbias: limit(0, 1000, 'V'),
  },
  /** Global feedback's resistor, from the speaker to the first cathode (the model's own range). */
  feedbackRf: limit(FEEDBACK_RF_LIMITS.min, FEEDBACK_RF_LIMITS.max, 'Ω'),
  feedbackCf: limit(FEEDBACK_CF_LIMITS.min, FEEDBACK_CF_LIMITS.max, 'F'),
  /** A meter's reading from chassis to an electrode, V. */
  meter: limit(0, 2000, 'V'),
  /** A fixed-bias grid's reading from chassis, V: at or below chassis. */
  meterGrid: limit(-1000, 0, 'V'),
  /** A DC heater supply: from a 1.5 V cell to a string of heaters in series. */
  heaterDcVolts: limit(0.5, 500, 'V'),
  /** The small tubes' heaters held above ground: 0 (at ground) up to where a divider from a high B+ node still divides. */
  heaterElevationVolts: limit(0, 500, 'V'),
  splitter: {
    bplus: limit(5, 1500, 'V'),
    ra: limit(100, 10e6, 'Ω'),
    rk: limit(1, 10e6, 'Ω'),
    rtail: limit(100, 10e6, 'Ω'),
    vgrid: limit(0, 1000, 'V'),
    rg: limit(1e3, 100e6, 'Ω'),
    cc: limit(1e-12, 1, 'F'),
  },
  output: {
    bplus: limit(OUTPUT_LIMITS.minBplus, OUTPUT_LIMITS.maxBplus, 'V'),
    screenVolts: limit(OUTPUT_LIMITS.minScreen, OUTPUT_LIMITS.maxBplus, 'V'),
    ulTap: limit(OUTPUT_LIMITS.minTap, OUTPUT_LIMITS.maxTap, ''),
    zPrimary: limit(OUTPUT_LIMITS.minZ, OUTPUT_LIMITS.maxZ, 'Ω'),
    raa: limit(RAA_LIMITS.min, RAA_LIMITS.max, 'Ω'),
    mismatch: limit(-MAX_MISMATCH, MAX_MISMATCH, ''),
    rPrimary: limit(0, OUTPUT_LIMITS.maxRPrimary, 'Ω'),
    primaryInductance: limit(WINDING_LIMITS.primaryInductance.min, WINDING_LIMITS.primaryInductance.max, 'H'),
    leakageInductance: limit(WINDING_LIMITS.leakageInductance.min, WINDING_LIMITS.leakageInductance.max, 'H'),
    rk: limit(OUTPUT_LIMITS.minRk, OUTPUT_LIMITS.maxRk, 'Ω'),
    vg: limit(OUTPUT_LIMITS.minVg, 0, 'V'),
    rg: limit(OUTPUT_LIMITS.minRg, OUTPUT_LIMITS.maxRg, 'Ω'),
    speakerOhms: limit(OUTPUT_LIMITS.minSpeaker, OUTPUT_LIMITS.maxSpeaker, 'Ω'),
    thdLimit: limit(OUTPUT_LIMITS.minThd, OUTPUT_LIMITS.maxThd, ''),
  },
} as const;

export const within = (v: number, l: Limit) => Math.min(Math.max(v, l.min), l.max);
