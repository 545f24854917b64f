import { decibels, plain, smallVolts, watts, voltsRms } from '../../format';
import type { AmplifierView } from '../../store/amplifierChain';
import { useWorkbench } from '../../store/StoreProvider';
import { benchIndex } from '../../store/stagePlans';
import { atLevelWords } from '../chain/atLevelWords';
import { feedbackBrief } from '../chain/feedbackWords';

/** One row of the whole amplifier with each tube: its words for a solved amplifier. */
export interface AmplifierRow {
  readonly label: string;
  readonly key: string;
  readonly show: (v: AmplifierView & { result: { ok: true } }) => string;
}

export const AMPLIFIER_COMPARE_ROWS: readonly AmplifierRow[] = [
  { label: 'Gain', key: 'gain', show: (v) => `${plain(Math.abs(v.result.gain))} × (${decibels(v.result.gain)})` },
  { label: 'Clean to', key: 'clean', show: (v) => (v.result.outputPower !== null ? watts(v.result.outputPower) : voltsRms(v.result.output.rms)) },
  { label: 'Input for it', key: 'input', show: (v) => voltsRms(v.result.input.rms) },
  { label: 'Clips first', key: 'clips', show: (v) => `${v.names[v.result.clipsFirst.stage]?.title ?? `stage ${v.result.clipsFirst.stage + 1}`} (${v.result.clipsFirst.by === 'grid-current' ? 'grid current' : 'cutoff'})` },
  { label: 'Noise at the input', key: 'noise', show: (v) => (v.result.noise ? `${smallVolts(v.result.noise.inputRms)} rms` : '—') },
  { label: 'Band (−3 dB)', key: 'band', show: (v) => `${v.result.lowHz === null ? 'DC' : `${plain(v.result.lowHz)} Hz`} to ${v.result.highHz === null ? '—' : v.result.highHz >= 1000 ? `${plain(v.result.highHz / 1000)} kHz` : `${plain(v.result.highHz)} Hz`}` },
];

/**
 * A tube swap judged where it matters: the whole amplifier with the first
 * tube and with the second in the bench's socket, side by side (the gain
 * it adds, the clean limit, the input it needs, which stage clips first,
 * the level the amplifier works at). Shown when the bench is part of a chain.
 */
export function AmplifierCompare({ first, second }: { first: AmplifierView | null; second: AmplifierView | null }) {
  const bench = useWorkbench((s) => benchIndex(s.design));
  if (!first || !second) return null;
  if (!first.result.ok || !second.result.ok) {
    const failed = !second.result.ok ? second.result.message : !first.result.ok ? first.result.message : '';
    return <p className="field-error" data-testid="amplifier-compare-failure">{`The whole amplifier with the second tube: ${failed}`}</p>;
  }
  const a = first as AmplifierView & { result: { ok: true } };
  const b = second as AmplifierView & { result: { ok: true } };
  const name = a.names[bench]?.title ?? 'the bench\'s stage';
  return (
    <table className="compare-table amplifier-compare" data-stale={a.stale || b.stale || undefined}>
      <caption>{`The whole amplifier, each tube in ${name}'s socket`}</caption>
      <thead>
        <tr><th scope="col">In the amplifier</th><th scope="col">{a.names[bench]?.tube ?? ''}</th><th scope="col">{b.names[bench]?.tube ?? ''}</th></tr>
      </thead>
      <tbody>
        {AMPLIFIER_COMPARE_ROWS.map((row) => (
          <tr key={row.key} data-row={`amp-${row.key}`}><th scope="row">{row.label}</th><td>{row.show(a)}</td><td>{row.show(b)}</td></tr>
        ))}
        <tr data-row="amp-at-level"><th scope="row">{`At ${a.levelLabel}`}</th><td>{atLevelWords(a) ?? '—'}</td><td>{atLevelWords(b) ?? '—'}</td></tr>
        {a.feedback || b.feedback ? (
          // With global feedback the rows above are the open loop's: the loop evens out much of a swap's difference in gain.
          <tr data-row="amp-feedback"><th scope="row">With feedback</th><td>{feedbackBrief(a) ?? '—'}</td><td>{feedbackBrief(b) ?? '—'}</td></tr>
        ) : null}
      </tbody>
    </table>
  );
}
