import type { StageFinding } from '../../../src/index';
import { benchFindings, sameFindings } from '../../store/amplifierFindings';
import { useDragPaced } from './useDragPaced';

const WORD = { danger: 'Danger', warning: 'Warning', note: 'Note' } as const;

/** Which checks are listed at which severity: what must never wait. */
const signature = (fs: readonly StageFinding[]) => fs.map((f) => `${f.stage}:${f.kind}:${f.severity}`).join(' ');

/**
 * The model's ratings findings for every stage of the amplifier, most severe
 * first, each tagged with its stage, in plain words. During a drag the
 * sentences' numbers refresh at the comparison table's pace (the figures
 * strip carries them live), but a check that appears, goes, or changes
 * severity shows at once.
 */
export function FindingsList() {
  const findings = useDragPaced(benchFindings, { equal: sameFindings, urgent: (shown, next) => signature(shown) !== signature(next) });
  const stages = new Set(findings.map((f) => f.stage)).size;
  return (
    <section className="panel findings" aria-label="Ratings checks">
      <h2>Ratings{stages > 1 ? ', every stage' : ''}</h2>
      <ul>
        {findings.map((f, i) => (
          // A check can appear more than once in a stage (the supply's capacitors, one per node).
          <li key={`${f.stage}:${f.kind}:${i}`} className={`finding ${f.severity}`} data-stage={f.stage}>
            <span className="severity">{WORD[f.severity]}</span> <span className="finding-stage">{f.stageName}:</span> {f.message}
          </li>
        ))}
      </ul>
    </section>
  );
}
