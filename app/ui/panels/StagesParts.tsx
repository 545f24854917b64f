import { useWorkbench } from '../../store/StoreProvider';
import { buildSheetOf } from '../../store/buildSheet';
import { PartsTables } from './PartsTables';

/**
 * Every voltage stage's and the splitter's parts, in chain order, each under
 * its stage's title: the same list on the build sheet and, with the output
 * stage on the bench, above its own parts, so either bench lists the whole
 * amplifier.
 */
export function StagesParts() {
  const sheet = useWorkbench(buildSheetOf);
  const onOutput = useWorkbench((s) => s.design.stageKind === 'output');
  return (
    <>
      {sheet.partial ? <p className="field-error">{`Only the bench's stage is listed: ${sheet.partial}`}</p> : null}
      {sheet.stages.map((st) => (
        <div key={st.index} className="stage-parts">
          <h3 className="subhead">{`${st.title}${st.shown && !onOutput ? ' (on the bench)' : ''}`}</h3>
          <PartsTables resistors={st.resistors} capacitors={st.capacitors} />
        </div>
      ))}
    </>
  );
}
