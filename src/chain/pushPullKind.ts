import { emptyCurrents, stageCurrentsInto } from '../output/electrodes';
import { pushPullPins } from '../output/outputPins';
import { SWEEP_SAMPLES } from '../output/outputSignal';
import { linearWinding } from '../output/windingInductance';
import { checkPushPull, type PushPullDesign } from '../pushpull/pushPullDesign';
import { pushPullDriveOf, pushPullInstant, screensAtDrive } from '../pushpull/pushPullDrive';
import { plateToPlateImpedance } from '../pushpull/pushPullFigures';
import { pushPullFindings } from '../pushpull/pushPullFindings';
import { solvePushPull, type PushPullSolution } from '../pushpull/solvePushPull';
import type { PushPullLink } from './chainTypes';
import { checkCoupling, couplingImpedance } from './checkCoupling';
import { midbandGain } from './midbandGain';
import type { LinkSample, StageKind } from './stageKind';

/** The pair's own design record, each grid's resistor being the coupling's grid leak. */
export function pairDesignOf(s: PushPullLink): PushPullDesign {
  const { kind: _kind, tube, coupling, ...parts } = s;
  // The tube's own check names a missing tube; its id is not read from nothing first.
  const id = typeof tube === 'object' && tube !== null ? tube.id : '';
  return { ...parts, tubeId: id, rg: typeof coupling === 'object' && coupling !== null && coupling.kind === 'capacitor' ? coupling.rg : 0 };
}

/** One tube's plate resistance at idle, its grid held (numerical slope of the charted current), Ω. */
function plateResistance(s: PushPullSolution): number {
  const c = emptyCurrents();
  const { vpk } = s.idle[0];
  const h = 0.05;
  stageCurrentsInto(s.tube, s.feed, vpk + h, s.vgk, c, -h);
  const up = c.ip;
  stageCurrentsInto(s.tube, s.feed, vpk - h, s.vgk, c, h);
  const slope = (up - c.ip) / (2 * h);
  return slope > 0 ? 1 / slope : Infinity;
}

/**
 * The push-pull output stage in the chain. Its first grid takes the chain's
 * signal, its second the phase splitter's other output, instant by instant,
 * so the splitter's imbalance reaches the pair as it is; the pair is solved
 * with the transformer coupling the two tubes' currents (pushPullInstant).
 * Its output is the speaker's voltage, phased as the first plate. A pair in
 * class AB cuts a tube off by design: only grid current ends its swing.
 */
export const pushPullKind: StageKind<PushPullLink> = {
  kind: 'push-pull-output',
  check: (s) => checkCoupling(s.coupling, false) ?? checkPushPull(s.tube, pairDesignOf(s)),
  inputImpedance: (s) => couplingImpedance(s.coupling),
  solve(s, env) {
    const design = pairDesignOf(s);
    const solved = solvePushPull(s.tube, design);
    if (!solved.ok) return solved;
    const instant = pushPullInstant(solved);
    const quarter = design.raa / 4;
    const ratio = Math.sqrt(design.speakerOhms / quarter);
    const antiphase = env.antiphase ?? -1;
    const { vgk, vgk2 } = solved;
    const sample = (vin: number, out: LinkSample, vin2?: number) => {
      const g1 = vgk + vin;
      const g2 = vgk2 + (vin2 ?? antiphase * vin);
      const w = instant.solve(g1, g2);
      out.vout = -w * ratio;
      out.vout2 = 0;
      out.vgk = Math.max(g1, g2);
      // Cutoff of one tube is class AB, not clipping: the current reported never reaches the cutoff mark.
      out.ia = 1;
    };
    const gain = midbandGain(sample);
    const full = pushPullDriveOf(solved, Math.min(-vgk, -vgk2), SWEEP_SAMPLES);
    const zpp = plateToPlateImpedance(solved);
    // Each tube, linearised for the response: it sees half the plate-to-plate load while both conduct (Langford-Smith, RDH4 ch. 13).
    const series = design.raa / 2 + design.rPrimary / 2;
    const scale = (ratio * (design.raa / 2)) / series;
    // Each tube as a source in its half circuit: half the plate-to-plate impedance, less its half of the primary's
    // resistance (an ultralinear pair's screen current coupled through the taps, as the speaker's impedance counts it).
    const rp = zpp !== null && zpp / 2 > design.rPrimary / 2 ? zpp / 2 - design.rPrimary / 2 : plateResistance(solved);
    const rLoad = Number.isFinite(rp) ? (rp * series) / (rp + series) : series;
    const peak = Math.max(...Array.from(full.winding, Math.abs));
    return {
      ok: true,
      op: { va: solved.idle[0].vpk + solved.vk, vk: solved.vk, ia: solved.idle[0].ip, vgk },
      pins: { screen: pushPullPins(solved).screen! },
      supplyCurrent: solved.supplyCurrent,
      // A pentode pair's screens, at idle and averaged with the grids driven to 0 V.
      ...(solved.feed.kind === 'fixed' ? { screenCurrent: solved.idle[0].ig2 + solved.idle[1].ig2, fullPowerScreenCurrent: screensAtDrive(solved, full) ?? solved.idle[0].ig2 + solved.idle[1].ig2 } : {}),
      fullPowerCurrent: full.supplyCurrent,
      outputDc: 0,
      gain,
      zin: couplingImpedance(s.coupling),
      zout: zpp === null ? Infinity : (zpp * design.speakerOhms) / design.raa,
      sample,
      cutoffCurrent: 0,
      gridLimit: 0,
      findings: pushPullFindings(solved, null, solved.supply + peak),
      linear: {
        gm: -gain / (scale * rLoad),
        rp: Number.isFinite(rp) ? rp : 1e12,
        plateLoad: series,
        rk: 0,
        ck: null,
        cathodeGrounded: true,
        gScreen: 0,
        caps: s.tube.capacitances,
        output: 'plate',
        outputScale: scale,
        winding: linearWinding(design, design.rPrimary, design.raa, 0.5, ratio),
        // Both grids driven, the second at `antiphase` times the first: (1 − antiphase)/2 of the first's drive each way.
        pair: { gm: (-gain / (scale * rLoad)) * (antiphase < 0 ? 2 / (1 - antiphase) : 1) },
      },
    };
  },
};
