import { useWorkbench } from '../store/StoreProvider';

const WORD = { danger: 'Danger', warning: 'Warning', note: 'Note' } as const;

/** The model's ratings findings for the stage on the bench, most severe first, in plain words. */
export function FindingsList() {
  const findings = useWorkbench((s) => (s.design.stageKind === 'output' ? s.outputBench.analysis.findings : s.analysis.solution.findings));
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
