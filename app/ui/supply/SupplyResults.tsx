import { SAFE_DC_VOLTS } from '../../../src/index';
import { farads, milliamps, ohms, plain, smallAmps, smallVolts, volts, watts } from '../../format';
import { SupplyHumLine } from './SupplyHumLine';
import { useWorkbench } from '../../store/StoreProvider';
import { ROLE_NAME } from '../../store/amplifierChain';
import { fedFrom, screensOf } from '../../store/supplySlice';
import { compact } from '../../store/fields';
import { bplusGroups, type BplusRole } from '../../store/supplyBplus';
import { voltageStages } from '../../store/stagePlans';
import { SupplyWaves } from './SupplyWaves';
import { oneWinding } from './rectifierWords';
import { lowEndWords } from './lowEndWords';

const SAME_BPLUS_SHARE = 0.01;

/**
 * The amplifier solved on its supply: every node's voltage, ripple and load
 * and which stages it feeds, the rectifier's and winding's currents, what
 * each capacitor sees cold, the ratings, the bleeder, and each stage's B+
 * beside what the bench holds (with a button to take the supply's).
 */
export function SupplyResults() {
  const view = useWorkbench((s) => s.supplyView);
  const plan = useWorkbench((s) => s.design.supply);
  // The three B+ only (voltage stages, splitter, output stage) and the screens': the whole design changes on every drag frame, and this table need not follow it.
  // Each voltage stage's B+ as designed (a follower's is its gain stage's), as one string so the table follows them alone.
  const voltageBplus = useWorkbench((s) => voltageStages(s.design).map((p) => (p.kind === 'common-cathode' ? p.bplus : '')).join(' '));
  const outputBplus = useWorkbench((s) => s.design.output.bplus);
  const splitterBplus = useWorkbench((s) => s.design.output.splitter.bplus);
  const screenVolts = useWorkbench((s) => s.design.output.screenVolts);
  const useVolts = useWorkbench((s) => s.useSupplyVolts);
  const setSupply = useWorkbench((s) => s.setSupply);
  const editValue = useWorkbench((s) => s.editSupplyValue);
  if (!plan.on) return <div className="supply-results"><p className="field-hint">Not solved: tick “Solve the amplifier on this supply” to see every node’s B+ and ripple.</p></div>;
  if (!view) return <div className="supply-results"><p className="field-hint" role="status">Solving the supply…</p></div>;
  const r = view.result;
  if (!r.ok) {
    return (
      <div className="supply-results">
        <p className="finding danger" role="alert">{r.reason === 'supply-too-low' ? r.message : `The amplifier could not be solved on this supply: ${r.message}`}</p>
      </div>
    );
  }
  const sup = r.supply;
  const full = r.atFullPower;
  const caps = [plan.input.c, ...plan.sections.map((s) => s.c)];
  const feeding = (k: number) => fedFrom(view, k).map((n) => `${n.title} (${n.tube})`);
  const stageBplus = voltageBplus.split(' ').map((t) => (t === '' ? null : Number(t)));
  const held = (role: BplusRole, index: number | null) => (role === 'splitter' ? splitterBplus : role === 'output' ? outputBplus : index === null ? null : stageBplus[index] ?? null);
  // One line a node and B+: the voltage stages together where they share them; a driven pair's splitter has its own B+ and node.
  const byRole = bplusGroups(view, r, held, stageBplus.filter((b) => b !== null).length).map((g) => ({ key: g.key, who: g.role === 'voltage' ? g.who : ROLE_NAME[g.role], node: g.node, supply: g.supplied, bench: g.held }));
  // Screens on a node of their own are held at a voltage of their own.
  const screens = screensOf(view, r);
  const offBy = screens ? [...byRole, { key: 'screens', who: `${ROLE_NAME.output}'s screens`, node: screens.node, supply: screens.volts, bench: screenVolts }] : byRole;
  // Within 1 % is as close as the parts and the mains hold it (common practice: mains ±10 %, resistors ±5 %).
  const differs = offBy.some((x) => Math.abs(x.supply - x.bench) > SAME_BPLUS_SHARE * x.supply);
  const b = view.bleeder;
  return (
    <div className={`supply-results${view.stale ? ' stale' : ''}`} data-testid="supply-results">
      {view.stale ? <p className="stale-note" role="status">Solving again for the changed design; these figures are from before it.</p> : null}
      <table className="parts-table supply-nodes">
        <caption>Every node under the whole amplifier's current{plan.channels > 1 ? ` (${plan.channels} channels)` : ''}</caption>
        <thead>
          <tr><th scope="col">Node</th><th scope="col">Capacitor</th><th scope="col">B+</th><th scope="col">Ripple p-p</th><th scope="col">Ripple rms</th>{full ? <th scope="col" title="with the output stage driven to its clean limit">At full power</th> : null}<th scope="col">Load</th><th scope="col">Capacitor ripple</th><th scope="col">Feeds</th></tr>
        </thead>
        <tbody>
          {sup.nodes.map((node, k) => (
            <tr key={k} data-node={k + 1}>
              <th scope="row">{k + 1}</th>
              <td>{farads(caps[k]!)}</td>
              <td data-figure="node-dc">{volts(node.dc)}</td>
              <td>{smallVolts(node.ripplePp)}</td>
              <td>{smallVolts(node.rippleRms)}</td>
              {full ? <td data-figure="node-full">{volts(full.volts[k]!)}</td> : null}
              <td>{milliamps(r.loads[k]!)}</td>
              <td>{smallAmps(node.capacitorRippleRms)} rms</td>
              <td>{[...feeding(k), ...(k === 0 && r.bleederAmps > 0 ? [`the bleeder (${milliamps(r.bleederAmps)})`] : []), ...((view.ownLoads[k] ?? 0) > 0 ? [`the heater elevation divider (${smallAmps(view.ownLoads[k]!)})`] : [])].join(', ') || '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <dl className="figure-group supply-figures">
        <div className="figure"><dt>Rectifier peak</dt><dd>{milliamps(sup.rectifierPeak)}</dd></div>
        <div className="figure"><dt>Rectifier rms</dt><dd>{milliamps(sup.rectifierRms)}</dd></div>
        <div className="figure"><dt>Conducts</dt><dd>{plain(sup.conductionDegrees)}° of {plan.rectifier.kind === 'silicon-half-wave' ? 360 : 180}°</dd></div>
        <div className="figure"><dt>Winding rms{oneWinding(plan.rectifier) ? '' : ' (each half)'}</dt><dd>{milliamps(sup.secondaryRmsCurrent)}</dd></div>
        <div className="figure"><dt>Secondary</dt><dd>{plain(sup.secondaryVa)} VA</dd></div>
        <div className="figure"><dt>Cold (no load)</dt><dd>{volts(sup.noLoadVolts)}</dd></div>
        {sup.criticalInductance !== null ? <div className="figure"><dt>Critical L</dt><dd>{plain(sup.criticalInductance)} H</dd></div> : null}
      </dl>
      <SupplyWaves />
      <p className="field-hint">
        Every capacitor sees {volts(sup.noLoadVolts)} when the tubes are cold or pulled{plan.rectifier.kind === 'tube' ? ' (a rectifier tube warms with the heaters and softens this)' : ' (silicon brings B+ up before the heaters warm)'}: rate each above it (common practice).
      </p>
      {sup.findings.length > 0 ? (
        <ul className="findings-compact" aria-label="The supply against its ratings">
          {sup.findings.map((f, i) => (
            <li key={i} className={`finding ${f.severity}`}>
              <span className="severity">{f.severity === 'danger' ? 'Danger' : f.severity === 'warning' ? 'Warning' : 'Note'}</span>
              {f.message}
            </li>
          ))}
        </ul>
      ) : (
        <p className="field-hint">No ratings given to check the supply against (the winding's current, a hum budget).</p>
      )}
      {view.humCure && !view.stale ? (
        <p className="option-row">
          <button type="button" onClick={() => editValue(view.humCure!.node === 0 ? 'input.c' : `sections.${view.humCure!.node - 1}.c`, compact(view.humCure!.farads))}>
            Use {farads(view.humCure.farads)} at node {view.humCure.node + 1}
          </button>
          <span className="field-hint">the hum budget's capacitor, rounded up to E12</span>
        </p>
      ) : null}
      <SupplyHumLine view={view} />
      <p className={`supply-low-end${view.lowEnd?.ok && view.lowEnd.unstablePoles ? ' finding danger' : view.lowEnd?.ok && view.lowEnd.thinLoop ? ' finding warning' : ''}`} data-testid="supply-low-end" role="status">
        {lowEndWords(view) ?? 'Working out the low end on this supply…'}
      </p>
      <div className="supply-bplus">
        <ul>
          {offBy.map((x) => (
            <li key={x.key}>
              {x.who}: node {x.node + 1} gives <strong>{volts(x.supply)}</strong> under load; the bench holds {volts(x.bench)}.
            </li>
          ))}
        </ul>
        <label className="supply-follow">
          <input type="checkbox" checked={plan.follow} onChange={(e) => setSupply({ follow: e.currentTarget.checked })} />
          The stages' B+ follow their nodes
        </label>
        {plan.follow ? (
          <p className="field-hint">The bench's B+ follow their nodes: they are set from each solve.</p>
        ) : differs ? (
          <button type="button" onClick={useVolts} disabled={view.stale}>Use these B+ on the bench</button>
        ) : (
          <p className="field-hint">The bench's B+ are the supply's (within 1 %).</p>
        )}
        {!view.names.some((n) => n.bench === 'output') ? <p className="field-hint">The output stage is not joined to the voltage stages (the box at the top), so only they draw from the supply here.</p> : null}
      </div>
      {b && b.ok ? (
        <p className="supply-bleeder" data-testid="bleeder">
          {b.needed
            ? <>Bleeder: {ohms(b.ohms)} across node 1 brings every capacitor under {SAFE_DC_VOLTS} V in {plain(b.seconds, 2)} s; it dissipates up to {watts(b.watts)} (use a {watts(b.partWatts)} part, twice that or more: common practice) and draws {milliamps(b.amps)}.</>
            : <>The supply never exceeds {SAFE_DC_VOLTS} V: no bleeder is needed for safety.</>}
        </p>
      ) : null}
    </div>
  );
}
