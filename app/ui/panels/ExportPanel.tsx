import { useId, useState } from 'react';
import { buildCardPng } from '../../export/buildCard';
import { chartCaption } from '../../export/chartCaption';
import { chartPng, svgDocument } from '../../export/chartImage';
import { amplifierNetlistOf } from '../../export/amplifierNetlistFile';
import { download, fileStem } from '../../export/download';
import { useWorkbench, useWorkbenchStore } from '../../store/StoreProvider';
import { solvesPending, whenSolved } from '../../store/whenSolved';

/** Export for bench notes: the chart as PNG (1×, 2×, 3×) or SVG, the whole build card as a PNG, and the amplifier as a netlist for a circuit simulator. */
export function ExportPanel() {
  const store = useWorkbenchStore();
  const [note, setNote] = useState<string | null>(null);
  const id = useId();
  const chart = () => document.querySelector<SVGSVGElement>('svg.plate-chart');
  const stem = () => fileStem(store.getState().title);
  // The whole amplifier's drawing goes on the card when it has more than one stage to show.
  const wholeAmplifier = () => ((store.getState().amplifier?.names.length ?? 0) > 1 ? document.querySelector<SVGSVGElement>('svg.chain-schematic') : null);
  const supplyOn = useWorkbench((s) => s.design.supply.on);
  const netlistFile = (withSupply: boolean) => {
    const net = amplifierNetlistOf(store.getState(), withSupply);
    if (!net.ok) throw new Error(net.message);
    return { blob: new Blob([net.text], { type: 'text/plain' }), name: `${stem()}${withSupply ? '-with-supply' : ''}.cir` };
  };
  /** `withSupply`: the export carries the supplies' figures (the card, the netlist with the supply), so it waits for them. */
  const run = async (what: string, make: () => Promise<{ blob: Blob; name: string }>, withSupply = false) => {
    try {
      // An export reads the figures: if a keystroke's light analysis is showing, finish it first.
      store.getState().settleAnalysis();
      // And, for what carries them, the supplies solved for this design (a card made straight after a change would print the last one's).
      if (withSupply && solvesPending(store.getState())) {
        setNote(`${what}: waiting for the supply to be solved for this design…`);
        await whenSolved(store);
      }
      const { blob, name } = await make();
      download(blob, name);
      setNote(`${what} saved as ${name}.`);
    } catch (e) {
      setNote(`${what} failed: ${(e as Error).message}`);
    }
  };
  return (
    <section className="panel export" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Export</h2>
      <div className="option-row">
        {[1, 2, 3].map((scale) => (
          <button key={scale} type="button" onClick={() => void run(`Chart PNG ${scale}×`, async () => ({ blob: await chartPng(chart()!, scale, chartCaption(store.getState())), name: `${stem()}-chart-${scale}x.png` }))}>
            Chart PNG {scale}×
          </button>
        ))}
        <button type="button" onClick={() => void run('Chart SVG', async () => ({ blob: new Blob([svgDocument(chart()!, chartCaption(store.getState())).text], { type: 'image/svg+xml' }), name: `${stem()}-chart.svg` }))}>Chart SVG</button>
        <button type="button" onClick={() => void run('Build card', async () => ({ blob: await buildCardPng(store.getState(), chart()!, document.querySelector<SVGSVGElement>('svg.schematic-svg'), new Date(), wholeAmplifier()), name: `${stem()}-build-card.png` }), true)}>Build card (PNG, A4)</button>
        <button type="button" onClick={() => void run('Netlist', async () => netlistFile(false))}>
          Netlist for ngspice (.cir)
        </button>
        {supplyOn ? (
          <button type="button" onClick={() => void run('Netlist with the supply', async () => netlistFile(true), true)}>
            Netlist with the supply (.cir)
          </button>
        ) : null}
      </div>
      <p className="field-hint">
        The netlist is the amplifier as the strip above shows it, tubes by Koren’s laws, to run in the ngspice circuit simulator: operating point, response and a transient at the working level.
        {supplyOn ? ' With the supply, each stage draws from its node behind the rectifier and filter, and the transient (ten mains cycles) carries their ripple and hum.' : ''}
      </p>
      {note ? <p className="keep-ok" role="status">{note}</p> : null}
    </section>
  );
}
