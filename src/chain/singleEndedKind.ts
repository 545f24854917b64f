import { checkOutputInput } from '../output/checkOutput';
import { outputFindings } from '../output/outputFindings';
import { cleanLimit, CUTOFF_SHARE, SETTLE_TOL, solveInstant, SWEEP_SAMPLES, type Instant } from '../output/outputSignal';
import type { OutputDesign } from '../output/outputDesign';
import { linearWinding } from '../output/windingInductance';
import { pentodePartials, solveOutput, type OutputSolution } from '../output/solveOutput';
import { emptyCurrents, screenVoltage, stageCurrentsInto } from '../output/electrodes';
import { singleEndedPins } from '../output/outputPins';
import { checkNumber, LIMITS } from '../stage/checkInput';
import { classA1GridCurrent, POWER_GRID_RESISTANCE } from '../tube/gridCurrent';
import type { SingleEndedLink } from './chainTypes';
import { checkCoupling, couplingImpedance } from './checkCoupling';
import { midbandGain } from './midbandGain';
import type { LinearStage, LinkSample, MagnetisingState, StageKind } from './stageKind';

/** d(Ik − coupled current)/dVgk at the operating point: the screen current's share that the cathode carries but the winding does not. */
function screenTransconductance(s: OutputSolution): number {
  const c = emptyCurrents();
  const h = 1e-3;
  stageCurrentsInto(s.tube, s.op.feed, s.op.vpk, s.op.vgk + h, c, 0);
  const up = c.ik - c.mmf;
  stageCurrentsInto(s.tube, s.op.feed, s.op.vpk, s.op.vgk - h, c, 0);
  return Math.max(0, (up - (c.ik - c.mmf)) / (2 * h));
}

/**
 * An ultralinear screen, or a pentode's fed straight from a supply node: the
 * slopes the chain's network needs to follow that node (LinearStage.screen).
 * A screen on its own source or its dropper's capacitor has none.
 */
function linearScreen(s: OutputSolution, link: SingleEndedLink): { screen: NonNullable<LinearStage['screen']> } | Record<string, never> {
  const law = s.tube.law;
  const feed = s.op.feed;
  if (law.kind !== 'pentode' || !(feed.kind === 'tap' || (feed.kind === 'fixed' && link.screenFromNode === true))) return {};
  const { b, c, d } = pentodePartials(law.params, s.op.vpk, s.op.vgk, screenVoltage(feed, s.op.vpk, 0));
  return { screen: { x: feed.kind === 'tap' ? feed.fraction : 0, plateByScreen: b, screenByPlate: c, screenByScreen: d } };
}

/** The output stage's own design record, its grid resistor being the coupling's grid leak. */
export function designOf(s: SingleEndedLink): OutputDesign {
  const { kind: _kind, tube, coupling, ck: _ck, ...parts } = s;
  // The tube's own check names a missing tube; its id is not read from nothing first.
  const id = typeof tube === 'object' && tube !== null ? tube.id : '';
  return { ...parts, tubeId: id, rg: typeof coupling === 'object' && coupling !== null && coupling.kind === 'capacitor' ? coupling.rg : 0 };
}

/**
 * The single-ended output stage in the chain. Its output is the speaker's
 * voltage, phased as the plate (the winding's sense is the builder's choice);
 * the transformer is ideal apart from the primary's DC resistance, which is
 * in series with the reflected load for signal too, and its magnetising
 * current, which the chain settles for each cycle as the stage's own figures
 * do (`magnetising`).
 */
export const singleEndedKind: StageKind<SingleEndedLink> = {
  kind: 'single-ended-output',
  check(s) {
    return (
      checkCoupling(s.coupling, false) ??
      checkOutputInput(s.tube, designOf(s)) ??
      (s.ck === undefined ? null : checkNumber('ck', 'Ck', s.ck, 'F', LIMITS.minFarads, LIMITS.maxFarads))
    );
  },
  inputImpedance: (s) => couplingImpedance(s.coupling),
  solve(s) {
    const design = designOf(s);
    const solved = solveOutput(s.tube, design);
    if (!solved.ok) return solved;
    const { op } = solved;
    const zp = design.zPrimary;
    const ratio = Math.sqrt(design.speakerOhms / zp);
    const series = zp + design.rPrimary;
    const scale = (ratio * zp) / series;
    const instant: Instant = { vpk: 0, ip: 0, winding: 0, m: 0 };
    // The plate's peak at the stage's own clean limit, for the insulation note (64 points find a peak to well under a volt).
    const limit = cleanLimit(solved, zp, SWEEP_SAMPLES);
    const peak = limit.at.vpkMax + op.vk;
    const magnetising: MagnetisingState = { value: op.mmf, coupled: op.mmf, near: undefined, idle: op.mmf, guess: op.mmf, gridOnly: false, tol: SETTLE_TOL * (op.mmf + op.supply / zp) };
    const sample = (vin: number, out: LinkSample) => {
      if (magnetising.gridOnly) {
        out.vgk = op.vgk + vin;
        return;
      }
      solveInstant(solved, op.vgk + vin, zp, instant, magnetising.near, magnetising.value);
      magnetising.coupled = instant.m;
      out.vout = -instant.winding * ratio;
      out.vgk = op.vgk + vin;
      out.ia = instant.ip;
    };
    const gain = midbandGain(sample);
    const rgrid = s.tube.law.kind === 'triode' ? s.tube.law.tube.model.gridResistance : POWER_GRID_RESISTANCE;
    const rLoad = (op.rp * series) / (op.rp + series);
    return {
      ok: true,
      op: { va: op.vpk + op.vk, vk: op.vk, ia: op.ip, vgk: op.vgk },
      pins: { screen: singleEndedPins(op).screen! },
      supplyCurrent: op.ik,
      // The cathode's average at the clean limit: the plate's shifts under drive (the law's curvature rectifies), and a
      // screen's rises as the plate swings low.
      fullPowerCurrent: limit.averages.ik,
      ...(op.feed.kind === 'fixed' ? { screenCurrent: op.ig2, fullPowerScreenCurrent: limit.averages.ig2 } : {}),
      outputDc: 0,
      gain,
      zin: couplingImpedance(s.coupling),
      zout: (op.rp + design.rPrimary) * ratio * ratio,
      sample,
      cutoffCurrent: CUTOFF_SHARE * op.ip,
      magnetising,
      cutoffSwing: limit.cutoffDrive,
      gridLimit: 0,
      gridLaw: (vgk) => classA1GridCurrent(rgrid, vgk),
      findings: outputFindings(solved, peak),
      linear: {
        // The transconductance that gives the same midband gain in the linear network.
        gm: -gain / (scale * rLoad),
        rp: op.rp,
        plateLoad: series,
        rk: design.bias === 'cathode' ? design.rk : 0,
        ck: design.bias === 'cathode' ? (s.ck ?? null) : null,
        cathodeGrounded: design.bias === 'fixed' || s.ck === undefined,
        gScreen: screenTransconductance(solved),
        caps: s.tube.capacitances,
        output: 'plate',
        outputScale: scale,
        winding: linearWinding(design, design.rPrimary, zp, 1, ratio),
        ...linearScreen(solved, s),
      },
    };
  },
};
