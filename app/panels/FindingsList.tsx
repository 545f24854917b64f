import type { Finding } from '../../src/index';
import type { WorkbenchState } from '../store/workbenchStore';
import { useDragPaced } from './useDragPaced';

const benchFindings = (s: WorkbenchState) => (s.design.stageKind === 'output' ? s.outputBench.analysis.findings : s.analysis.solution.findings);

const WORD = { danger: 'Danger', warning: 'Warning', note: 'Note' } as const;

/** Which checks are listed at which severity: what must never wait. */
const signature = (fs: readonly Finding[]) => fs.map((f) => `${f.kind}:${f.severity}`).join(' ');

/**
 * The model's ratings findings for the stage on the bench, most severe first,
 * in plain words. During a drag the sentences' numbers refresh at the
 * comparison table's pace (the figures strip carries them live), but a check
 * that appears, goes, or changes severity shows at once.
 */
export function FindingsList() {
  const findings = useDragPaced(benchFindings, { urgent: (shown, next) => signature(shown) !== signature(next) });
  return (
    <section className="panel findings" aria-label="Ratings checks">
      <h2>Ratings</h2>
      <ul>
        {findings.map((f) => (
          <li key={f.kind} className={`finding ${f.severity}`}>
            <span className="severity">{WORD[f.severity]}</span> {f.message}
          </li>
        ))}
      </ul>
    </section>
  );
}
