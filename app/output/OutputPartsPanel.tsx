import { useId } from 'react';
import { milliamps, ohms, percentOf, watts } from '../format';
import { PartsTables } from '../panels/PartsTables';
import { outputPartsOf } from '../store/outputParts';
import { useWorkbench } from '../store/StoreProvider';

/** The output stage's parts to order on screen, as the card lists them: transformer, resistors, capacitors, heater. */
export function OutputPartsPanel() {
  const id = useId();
  return (
    <section className="panel build-sheet output-parts" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Parts to order</h2>
      <OutputPartsLines />
    </section>
  );
}

/** The output stage's lines, also shown in the amplifier's build sheet when the voltage stages drive it. */
export function OutputPartsLines() {
  const parts = useWorkbench(outputPartsOf);
  const heater = useWorkbench((s) => s.outputBench.settled.solution.tube.heater);
  const t = parts.transformer;
  return (
    <>
      <p data-part-line="OPT">{`Output transformer: ${ohms(t.primary)} to ${ohms(t.secondary)}, primary DC resistance ${ohms(t.primaryDcr)}, ${milliamps(t.dcCurrent)} DC in the primary, at least ${watts(t.power)}${t.screenTap !== null ? `, screen tap at ${percentOf(t.screenTap)} of the primary` : ''}.`}</p>
      <PartsTables resistors={parts.resistors} capacitors={parts.capacitors} />
      <p>{`Heater: ${heater.volts} V, ${heater.amps} A.`}</p>
    </>
  );
}
