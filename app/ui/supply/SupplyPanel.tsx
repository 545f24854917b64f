import { useId } from 'react';
import { MAX_CHANNELS, MAX_SECTIONS, RECTIFIER_TUBES, SAFE_DC_VOLTS, type Rectifier } from '../../../src/index';
import { useWorkbench } from '../../store/StoreProvider';
import { SupplyField } from './SupplyField';
import { SupplyResults } from './SupplyResults';
import { HeaterWindings } from './HeaterWindings';
import { BiasSupply } from './BiasSupply';
import { MainsTransformer } from './MainsTransformer';
import { MAINS_VOLTS } from '../../store/mainsPlan';
import { SupplySchematic } from './SupplySchematic';
import { oneWinding } from './rectifierWords';
import { drivesPair } from '../../store/outputPlan';
import { nodeOf } from '../../store/supplyPlan';
import { nodeOfStage, voltageStages } from '../../store/stagePlans';

const rectifierKey = (r: Rectifier) => (r.kind === 'tube' ? `tube:${r.tubeId}` : r.kind);
const rectifierOf = (key: string): Rectifier => (key.startsWith('tube:') ? { kind: 'tube', tubeId: key.slice(5) } : { kind: key as 'silicon-bridge' | 'silicon-full-wave' | 'silicon-half-wave' });

/**
 * The B+ supply: transformer, rectifier and filter ladder, which node feeds
 * which stage, and (SupplyResults) the whole amplifier solved on it. The
 * cautions come first: this is where builders get hurt.
 */
export function SupplyPanel() {
  const plan = useWorkbench((s) => s.design.supply);
  const setSupply = useWorkbench((s) => s.setSupply);
  const addSection = useWorkbench((s) => s.addSection);
  const removeSection = useWorkbench((s) => s.removeSection);
  const error = useWorkbench((s) => s.supplyErrors.supply);
  const pairDriven = useWorkbench((s) => drivesPair(s.design));
  // A driven pentode-connected output stage's screens may hang from a node of their own.
  const screensFed = useWorkbench((s) => s.design.drivesOutput && s.design.output.connection === 'pentode');
  const setStageNode = useWorkbench((s) => s.setStageNode);
  // Each gain stage and the node feeding it (its follower rides on it), as one string so the panel follows them alone.
  const gainKey = useWorkbench((s) => {
    const list = voltageStages(s.design);
    return JSON.stringify(list.flatMap((p, i) => (p.kind === 'common-cathode' ? [{ index: i, tube: p.tubeId, node: nodeOfStage(s.design, list, i) }] : [])));
  });
  const gainFeeds = JSON.parse(gainKey) as { index: number; tube: string; node: number }[];
  const id = useId();
  const nodes = plan.sections.length + 1;
  const nodeOptions = Array.from({ length: nodes }, (_, k) => <option key={k} value={k}>{k === 0 ? 'node 1 (reservoir)' : `node ${k + 1}`}</option>);
  return (
    <section className="panel supply" aria-labelledby={`${id}-h`}>
      <div className="supply-head">
        <h2 id={`${id}-h`}>B+ supply</h2>
        <label>
          <input type="checkbox" checked={plan.on} onChange={(e) => setSupply({ on: e.currentTarget.checked })} />
          Solve the amplifier on this supply
        </label>
      </div>
      <p className="supply-caution" role="note">
        <strong>Lethal voltages.</strong> The mains wiring and the transformer's secondary can kill, and the filter capacitors hold their charge
        long after switch-off. Fit a bleeder (below), measure every capacitor before touching it (under {SAFE_DC_VOLTS} V), fuse the primary and
        earth the chassis. Follow your local electrical codes; where in doubt, have the mains side built or checked by a licensed electrician.
      </p>
      <SupplySchematic />
      <div className="supply-body">
        <div className="supply-values">
          <div className="option-row">
            <label htmlFor={`${id}-mains`}>Mains</label>
            <select id={`${id}-mains`} value={plan.mainsHz} onChange={(e) => setSupply({ mainsHz: Number(e.target.value) })}>
              <option value={50}>50 Hz</option>
              <option value={60}>60 Hz</option>
            </select>
            <label htmlFor={`${id}-mainsv`}>Mains voltage</label>
            <select id={`${id}-mainsv`} value={plan.mainsVolts} onChange={(e) => setSupply({ mainsVolts: Number(e.target.value) })}>
              {MAINS_VOLTS.map((v) => <option key={v} value={v}>{v} V</option>)}
            </select>
            <label htmlFor={`${id}-rect`}>Rectifier</label>
            <select id={`${id}-rect`} value={rectifierKey(plan.rectifier)} onChange={(e) => setSupply({ rectifier: rectifierOf(e.target.value) })}>
              <option value="silicon-full-wave">silicon, full wave (centre-tapped)</option>
              <option value="silicon-bridge">silicon bridge</option>
              <option value="silicon-half-wave">silicon, half wave (one diode)</option>
              {RECTIFIER_TUBES.map((t) => <option key={t.id} value={`tube:${t.id}`}>{t.id} rectifier tube</option>)}
            </select>
          </div>
          <p className="field-hint">A transformer's voltage is stated at its rated current; with no load it rises by the winding's drop (its resistance, or its regulation when given).</p>
          <div className="value-grid">
            <SupplyField path="secondaryRms" label={oneWinding(plan.rectifier) ? 'Secondary' : 'Secondary, each half'} unit="V rms" example="260" />
            <SupplyField path="secondaryAmps" label="At its rated current" unit="A" example="200m or none" />
            <SupplyField path="windingOhms" label="Winding resistance" unit="Ω" example="35" />
            <SupplyField path="regulation" label="Or its regulation" unit="%" example="8 or none" />
            <SupplyField path="humRms" label="Hum budget, stage 1's node" unit="V rms" example="5m or none" />
          </div>
          <h3>Filter</h3>
          <div className="option-row">
            <label htmlFor={`${id}-input`}>Input</label>
            <select
              id={`${id}-input`}
              value={plan.input.kind}
              onChange={(e) => setSupply({ input: e.target.value === 'choke' ? { kind: 'choke', l: 10, rdc: 150, c: plan.input.c } : { kind: 'capacitor', c: plan.input.c } })}
            >
              <option value="capacitor">reservoir capacitor</option>
              <option value="choke">choke, then a capacitor</option>
            </select>
          </div>
          <div className="value-grid">
            {plan.input.kind === 'choke' ? (
              <>
                <SupplyField path="input.l" label="Input choke" unit="H" example="10" />
                <SupplyField path="input.rdc" label="Its resistance" unit="Ω" example="150" />
              </>
            ) : null}
            <SupplyField path="input.c" label="Node 1 capacitor" unit="F" example="100u" />
          </div>
          <ol className="supply-sections">
            {plan.sections.map((s, k) => (
              <li key={k}>
                <div className="value-grid">
                  {s.kind === 'rc' ? (
                    <SupplyField path={`sections.${k}.r`} label={`Node ${k + 2}: resistor`} unit="Ω" example="10k" />
                  ) : (
                    <>
                      <SupplyField path={`sections.${k}.l`} label={`Node ${k + 2}: choke`} unit="H" example="10" />
                      <SupplyField path={`sections.${k}.rdc`} label="Its resistance" unit="Ω" example="200" />
                    </>
                  )}
                  <SupplyField path={`sections.${k}.c`} label={`Node ${k + 2} capacitor`} unit="F" example="47u" />
                </div>
                <button type="button" className="link-button" onClick={() => removeSection(k)} aria-label={`Remove the section to node ${k + 2}`}>Remove</button>
              </li>
            ))}
          </ol>
          {plan.sections.length < MAX_SECTIONS ? (
            <div className="option-row">
              <button type="button" onClick={() => addSection('rc')}>Add an R–C section</button>
              <button type="button" onClick={() => addSection('lc')}>Add an L–C section</button>
            </div>
          ) : null}
          <h3>Feeds</h3>
          <div className="option-row supply-feeds">
            <span>
              <label htmlFor={`${id}-fo`}>Output stage from</label>
              <select id={`${id}-fo`} value={plan.feeds.output} onChange={(e) => setSupply({ feeds: { ...plan.feeds, output: Number(e.target.value) } })}>{nodeOptions}</select>
            </span>
            {pairDriven ? (
              <span>
                <label htmlFor={`${id}-fs`}>Phase splitter from</label>
                <select id={`${id}-fs`} value={nodeOf(plan, 'splitter')} onChange={(e) => setSupply({ feeds: { ...plan.feeds, splitter: Number(e.target.value) } })}>{nodeOptions}</select>
              </span>
            ) : null}
            {screensFed ? (
              <span>
                <label htmlFor={`${id}-fg2`}>Output screens from</label>
                <select
                  id={`${id}-fg2`}
                  value={plan.feeds.screens ?? ''}
                  onChange={(e) => {
                    const { screens: _old, ...rest } = plan.feeds;
                    setSupply({ feeds: e.target.value === '' ? rest : { ...rest, screens: Number(e.target.value) } });
                  }}
                >
                  <option value="">the plates' node (a dropper when lower)</option>
                  {nodeOptions}
                </select>
              </span>
            ) : null}
            {gainFeeds.map((g) => (
              <span key={g.index}>
                <label htmlFor={`${id}-fv${g.index}`}>{gainFeeds.length === 1 ? 'Voltage stages from' : `Stage ${g.index + 1} (${g.tube}) from`}</label>
                <select id={`${id}-fv${g.index}`} value={g.node} onChange={(e) => setStageNode(g.index, Number(e.target.value))}>{nodeOptions}</select>
              </span>
            ))}
            <span>
              <label htmlFor={`${id}-ch`}>Channels</label>
              <select id={`${id}-ch`} value={plan.channels} onChange={(e) => setSupply({ channels: Number(e.target.value) })}>
                {Array.from({ length: MAX_CHANNELS }, (_, k) => <option key={k} value={k + 1}>{k === 0 ? '1 (mono)' : k === 1 ? '2 (stereo)' : k + 1}</option>)}
              </select>
            </span>
          </div>
          {error ? <p className="field-error" role="alert">{error}</p> : null}
          <HeaterWindings />
          <MainsTransformer />
          <BiasSupply />
        </div>
        <SupplyResults />
      </div>
    </section>
  );
}
