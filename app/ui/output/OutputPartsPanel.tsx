import { useId } from 'react';
import { screensNodeLine } from './screenNodeWords';
import { milliamps, ohms, percentOf, volts, watts } from '../../format';
import type { WindingInductance } from '../../../src/index';
import { windingLines } from './windingWords';
import { biasLines } from './biasWords';
import { stopperLine } from './stopperWords';
import { PartsTables } from '../panels/PartsTables';
import { outputPartsOf, type OutputStageParts } from '../../store/outputParts';
import { useWorkbench } from '../../store/StoreProvider';
import { StagesParts } from '../panels/StagesParts';
import { IdleVoltages } from '../panels/IdleVoltages';
import { MeterReadings } from '../panels/MeterReadings';
import { TubesToOrder } from '../panels/TubesToOrder';
import { SupplyPartsList } from '../supply/SupplyPartsList';
import { BiasPartsList } from '../supply/BiasPartsList';

/** The parts to order on screen with the output stage on the bench, as the card lists them: every stage's when driven, then its transformer, resistors, capacitors, heater. */
export function OutputPartsPanel() {
  const id = useId();
  // Driven, the output stage is the end of an amplifier: its parts list is the amplifier's.
  const driven = useWorkbench((s) => (s.design.drivesOutput ? s.design.output.tubeId : null));
  return (
    <section className="panel build-sheet output-parts" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Parts to order</h2>
      <TubesToOrder />
      {driven ? (
        <>
          <StagesParts />
          <h3 className="subhead">{`Output stage, ${driven} (on the bench)`}</h3>
        </>
      ) : null}
      <OutputPartsLines />
      <SupplyPartsList />
      <BiasPartsList />
      <IdleVoltages outputAlone />
      <MeterReadings outputAlone />
    </section>
  );
}

/** The transformer (and a fixed bias's supply and adjustment) in words, as the panel and the card print them. */
export function transformerLines(parts: OutputStageParts, winding: WindingInductance = {}): string[] {
  const tap = (x: number | null) => (x !== null ? `, screen taps at ${percentOf(x)} of each half` : '');
  const wound = windingLines(winding);
  if (parts.pair === 'push-pull') {
    const t = parts.transformer;
    return [
      `Output transformer, centre-tapped: ${ohms(t.primary)} plate to plate to ${ohms(t.secondary)}, primary DC resistance ${ohms(t.primaryDcr)}, ${milliamps(t.dcPerHalf)} DC in each half (${milliamps(t.dcUncancelled)} uncancelled), at least ${watts(t.power)}${tap(t.screenTap)}.`,
      ...wound,
      ...(parts.biasSupply !== null ? [`Bias supply ${volts(parts.biasSupply)} with a balance adjustment for each tube (set each to the same idle current).`] : []),
      ...biasLines(parts.biasAdjustment, 2),
      stopperLine(parts.gridStopper, 2),
    ];
  }
  const t = parts.transformer;
  return [`Output transformer: ${ohms(t.primary)} to ${ohms(t.secondary)}, primary DC resistance ${ohms(t.primaryDcr)}, ${milliamps(t.dcCurrent)} DC in the primary, at least ${watts(t.power)}${t.screenTap !== null ? `, screen tap at ${percentOf(t.screenTap)} of the primary` : ''}.`, ...wound, ...biasLines(parts.biasAdjustment, 1), stopperLine(parts.gridStopper, 1)];
}

/** The output stage's lines, also shown in the amplifier's build sheet when the voltage stages drive it. */
export function OutputPartsLines() {
  const parts = useWorkbench(outputPartsOf);
  const winding = useWorkbench((s) => s.design.output);
  const heater = useWorkbench((s) => s.outputBench.settled.solution.tube.heater);
  const screens = useWorkbench((s) => screensNodeLine(s.design));
  return (
    <>
      {transformerLines(parts, winding).map((line, k) => <p key={k} data-part-line={k === 0 ? 'OPT' : undefined}>{line}</p>)}
      {screens ? <p data-part-line="screens">{screens}</p> : null}
      <PartsTables resistors={parts.resistors} capacitors={parts.capacitors} />
      <p>{parts.pair === 'push-pull' ? `Heaters: two tubes, each ${heater.volts} V, ${heater.amps} A.` : `Heater: ${heater.volts} V, ${heater.amps} A.`}</p>
    </>
  );
}
