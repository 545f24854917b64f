import type { OutputDesign, PushPullDesign } from '../../src/index';

/** Our own EL34 single-ended design: pentode-connected, its screens 30 V under the plate's B+, on cathode bias. */
export const EL34_SCREEN_DROPPED: OutputDesign = {
  tubeId: 'EL34', connection: 'pentode', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130,
  bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05,
};

/** A 6L6GC pair at the RCA sheet's class AB1 voltages (450 V plates, 400 V screens; from memory, as in dataSheetPushPull.test.ts), on fixed bias. */
export const PAIR_6L6GC_AB1: PushPullDesign = {
  tubeId: '6L6GC', connection: 'pentode', bplus: 450, screenVolts: 400, ulTap: 0.43, raa: 5600, rPrimary: 0,
  bias: 'fixed', rk: 0, vg: -37, rg: 100e3, speakerOhms: 8, thdLimit: 0.05,
};
