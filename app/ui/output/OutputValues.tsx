import { useId } from 'react';
import { BplusField } from '../supply/BplusField';
import { useShallow } from 'zustand/react/shallow';
import { connectionsOf, outputTubeLibrary, type Connection } from '../../../src/index';
import { ValueField } from '../panels/ValueField';
import { WantedPoint } from './WantedPoint';
import { SplitterValues } from './SplitterValues';
import { useWorkbench } from '../../store/StoreProvider';

/** What each connection's figures can be trusted for, said plainly beside the choice. */
export const CONNECTION_NOTES: Record<Connection, string> = {
  pentode: 'Screen at a fixed supply. Koren\'s pentode law: plate current and power as fitted; screen current is the idle figure and reads low near full drive.',
  triode: 'Screen tied to the plate: the pentode law with Vg2 = Va. Against recalled triode-connection figures its current is within 5 % for the EL34 and EL84; the other types are unchecked.',
  ultralinear: 'Screen on a primary tap. The law with Vg2 following the plate by the tap share: as good as the pentode fit between the two other modes.',
};

const CONNECTION_LABEL: Record<Connection, string> = { pentode: 'Pentode', triode: 'Triode-connected', ultralinear: 'Ultralinear' };

/** The output stage's values: tube, connection, bias and the transformer, each with its message beside it. */
export function OutputValues() {
  // Only the choices that shape the form: a drag changes values, which the fields follow themselves.
  const o = useWorkbench(useShallow(({ design: { output } }) => ({ tubeId: output.tubeId, connection: output.connection, bias: output.bias, pair: output.pair })));
  const setOutputPair = useWorkbench((s) => s.setOutputPair);
  const pushPull = o.pair === 'push-pull';
  const tubeError = useWorkbench((s) => s.errors.outputTube);
  const pairError = useWorkbench((s) => s.errors.outputPair);
  const chooseOutputTube = useWorkbench((s) => s.chooseOutputTube);
  const changeOutput = useWorkbench((s) => s.changeOutput);
  const tube = useWorkbench((s) => s.outputBench.analysis.solution.tube);
  const id = useId();
  const connections = connectionsOf(tube);
  const setBias = useWorkbench((s) => s.setOutputBias);
  return (
    <section className="panel circuit-values output-values" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Output stage</h2>
      <fieldset className="option-row" aria-label="Tubes in the output stage">
        <label>
          <input type="radio" name={`${id}-pair`} checked={!pushPull} onChange={() => setOutputPair('single-ended')} /> Single-ended (one tube)
        </label>
        <label>
          <input type="radio" name={`${id}-pair`} checked={pushPull} onChange={() => setOutputPair('push-pull')} /> Push-pull pair
        </label>
      </fieldset>
      {pairError ? <p className="field-error" role="alert">{pairError}</p> : null}
      {pushPull ? (
        <p className="field-hint">
          Two tubes on a centre-tapped transformer, the grids driven in antiphase by the phase splitter below. The pair&apos;s own figures here take an ideal drive, the same on each grid; the amplifier&apos;s (the strip above) take the splitter&apos;s two outputs as they are.
          Solved instant by instant with the transformer coupling the two tubes&apos; currents (composite characteristics).
        </p>
      ) : (
        <p className="field-hint" data-testid="single-ended-steady-state">
          Power and distortion are for a sustained drive, as a data sheet quotes them: the drive&apos;s own shift of the average plate current settles into the primary&apos;s magnetising current, and the plate swings about B+ again. They are at the idle bias; a cathode resistor&apos;s bias under full drive, and the power there, are in the figures.
        </p>
      )}
      <div className="value-field">
        <label htmlFor={`${id}-tube`} className="field-label">Output tube</label>
        <select id={`${id}-tube`} value={o.tubeId} onChange={(e) => chooseOutputTube(e.target.value)} aria-describedby={`${id}-tube-note`}>
          {outputTubeLibrary.map((t) => (
            <option key={t.id} value={t.id}>
              {t.id} — {t.construction}, {t.ratings.maxPlateDissipation} W
            </option>
          ))}
        </select>
        {tubeError ? <p className="field-error" role="alert">{tubeError}</p> : <p id={`${id}-tube-note`} className="field-hint">{tube.description} Law: {tube.lawSource.replace(/\.$/, '')}.</p>}
      </div>
      <fieldset className="option-row" aria-label="Screen connection">
        {(['pentode', 'triode', 'ultralinear'] as const).map((c) => (
          <label key={c}>
            <input type="radio" name={`${id}-conn`} value={c} checked={(tube.law.kind === 'triode' ? 'triode' : o.connection) === c} disabled={!connections.includes(c)} onChange={() => changeOutput({ connection: c })} />
            {CONNECTION_LABEL[c]}
          </label>
        ))}
      </fieldset>
      <p className="field-hint">{tube.law.kind === 'triode' ? 'A power triode: no screen to connect.' : CONNECTION_NOTES[o.connection]}</p>
      <div className="value-grid">
        <BplusField field="oBplus" bench="output" hint="at the primary's B+ end" />
        {tube.law.kind === 'pentode' && o.connection === 'pentode' ? <ValueField field="oScreen" hint="to ground; below B+ the parts list drops it from B+ through Rs" /> : null}
        {tube.law.kind === 'pentode' && o.connection === 'ultralinear' ? <ValueField field="oTap" hint="share of primary turns from B+" /> : null}
        {pushPull ? <ValueField field="oRaa" hint="plate to plate" /> : <ValueField field="oZ" hint="reflected load, plate to B+" />}
        <ValueField field="oRpri" hint="primary DC resistance" />
        <ValueField field="oLp" hint="primary inductance at its DC current (plate to plate for a pair); none: ideal" />
        <ValueField field="oLl" hint="leakage inductance, the primary's with the secondary shorted; none: ideal" />
      </div>
      <fieldset className="option-row" aria-label="Bias">
        <label>
          <input type="radio" name={`${id}-bias`} checked={o.bias === 'cathode'} onChange={() => setBias('cathode')} /> {pushPull ? 'Cathode bias (one Rk shared, bypassed)' : 'Cathode bias (Rk, bypassed)'}
        </label>
        <label>
          <input type="radio" name={`${id}-bias`} checked={o.bias === 'fixed'} onChange={() => setBias('fixed')} /> Fixed bias
        </label>
      </fieldset>
      <div className="value-grid">
        {o.bias === 'cathode' ? <ValueField field="oRk" {...(pushPull ? { hint: 'shared by both cathodes' } : {})} /> : <ValueField field="oVg" hint="grid supply" />}
        <ValueField field="oRg" hint={pushPull ? 'each grid\'s resistor' : 'grid resistor'} />
        {pushPull ? <ValueField field="oMismatch" hint="second tube's gm above the first's (0: matched)" /> : null}
        {pushPull ? <ValueField field="oIdleMismatch" hint="its idle current above the first's after the bias (0: trimmed equal)" /> : null}
        <ValueField field="oSpeaker" />
        <ValueField field="oThd" hint="for the power-at-distortion figures" />
      </div>
      {pushPull ? <SplitterValues /> : <WantedPoint />}
    </section>
  );
}
