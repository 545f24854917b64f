import { farads, ohms } from '../../format';
import { useWorkbench } from '../../store/StoreProvider';
import { ValueField } from '../panels/ValueField';
import { FEEDBACK_CAVEAT, feedbackBandWords, feedbackWords } from './feedbackWords';
import { LoopSquareWaves } from './LoopSquareWaves';

/**
 * Global negative feedback under the amplifier's figures, with the stages
 * driving the output stage: Rf from the speaker to the first stage's cathode
 * (empty or "none" for none), and the closed loop's figures beside it.
 */
export function GlobalFeedbackRow() {
  const view = useWorkbench((s) => s.amplifier);
  const driven = useWorkbench((s) => s.design.drivesOutput);
  const rf = useWorkbench((s) => s.design.feedbackRf);
  const cf = useWorkbench((s) => s.design.feedbackCf);
  const winding = useWorkbench((s) => s.design.output);
  const on = rf !== null;
  if (!driven || !view) return null;
  const words = feedbackWords(view, winding.speakerOhms);
  const failed = view.feedback !== null && !view.feedback.ok;
  return (
    <div className="global-feedback" data-testid="global-feedback">
      <ValueField field="feedbackRf" hint="from the speaker to stage 1's unbypassed cathode resistor; none for no feedback" />
      {on ? <ValueField field="feedbackCf" hint="phase lead: its corner with Rf near the loop's crossover; none for none" /> : null}
      {on && words ? (
        <p className={failed ? 'field-error' : 'feedback-figures'} data-testid="feedback-figures">
          {failed ? words : <><strong>{`With feedback (Rf ${rf === null ? '' : ohms(rf)}${cf === null ? '' : ` ∥ ${farads(cf)}`}):`}</strong> {words}. <span className="feedback-caveat">{FEEDBACK_CAVEAT}</span></>}
        </p>
      ) : null}
      {on && !failed && view.feedback?.ok ? (
        <p className={`feedback-band verdict-${view.feedback.band.verdict}`} data-testid="feedback-band">{feedbackBandWords(view, winding)}</p>
      ) : null}
      {on && !failed && view.feedback?.ok ? <LoopSquareWaves waves={view.feedback.band.squareWaves} /> : null}
    </div>
  );
}
