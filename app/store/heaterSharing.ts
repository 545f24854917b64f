import { findOutputTube } from '../../src/index';
import type { BenchDesign } from './analysis';
import { elevationOf } from './heaterChoice';
import { drivesPair, outputOnSupply, type OutputPlan } from './outputPlan';
import { voltageStages } from './stagePlans';
import type { TubeRegistry } from './tubeRegistry';

/**
 * True when the driven output tubes' heaters share the small tubes' AC
 * winding: the small tubes run on AC and the output tube's heater is wired
 * for the voltage one of theirs is (the windings are grouped by voltage, as
 * the supply lists them). A DC heater supply, or a winding of another
 * voltage, leaves the output tubes on their own.
 */
export function outputSharesSmallWinding(d: BenchDesign, registry: TubeRegistry): boolean {
  if (d.heaters.voltageStages !== 'ac' || !d.drivesOutput) return false;
  const output = findOutputTube(d.output.tubeId);
  if (!output) return false;
  const ids = [...voltageStages(d).map((p) => p.tubeId), ...(drivesPair(d) ? [d.output.splitter.tubeId] : [])];
  return ids.some((id) => {
    const tube = registry.lookup(id);
    const chosen = tube?.heaters.find((h) => h.wiring === d.heaters.wiring[id]) ?? tube?.heaters[0];
    return chosen !== undefined && chosen.volts === output.heater.volts;
  });
}

/** The potential the driven output tubes' heaters sit at: the small tubes' elevation on a shared winding, else ground (0 V). */
export function outputHeaterVolts(d: BenchDesign, registry: TubeRegistry): number {
  const held = elevationOf(d.heaters);
  return held !== 0 && outputSharesSmallWinding(d, registry) ? held : 0;
}

/** The output design as the amplifier places it: its screens on their node when the supply feeds them, its heaters at their winding's potential. */
export function outputPlaced<O extends OutputPlan>(d: BenchDesign, output: O, registry: TubeRegistry): O {
  const onSupply = outputOnSupply(d, output);
  const heaterVolts = outputHeaterVolts(d, registry);
  return heaterVolts !== 0 ? { ...onSupply, heaterVolts } : onSupply;
}

/** The heaters' potential for the stage on the bench: the output tubes' winding with the output stage shown, else the small tubes' elevation. */
export const benchHeaterVolts = (s: { readonly design: BenchDesign; readonly registry: TubeRegistry }): number =>
  s.design.stageKind === 'output' ? outputHeaterVolts(s.design, s.registry) : elevationOf(s.design.heaters);
