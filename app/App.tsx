import { PlateChart } from './ui/chart/PlateChart';
import { CircuitValues } from './ui/panels/CircuitValues';
import { FiguresStrip } from './ui/panels/FiguresStrip';
import { FindingsList } from './ui/panels/FindingsList';
import { SafetyIntro } from './ui/panels/SafetyIntro';
import { SafetyNotice } from './ui/panels/SafetyNotice';
import { TubeChooser } from './ui/panels/TubeChooser';
import { StageSchematic } from './ui/schematic/StageSchematic';
import { SignalCharts } from './ui/signal/SignalCharts';
import { SignalPanel } from './ui/signal/SignalPanel';
import { Stage2Panel } from './ui/signal/Stage2Panel';
import { DesignTitle } from './ui/panels/DesignTitle';
import { StoreProvider, useWorkbench, useWorkbenchStore } from './store/StoreProvider';
import { StageKindSwitch } from './ui/output/StageKindSwitch';
import { ChainStrip } from './ui/chain/ChainStrip';
import { OutputChart } from './ui/output/OutputChart';
import { OutputFigures } from './ui/output/OutputFigures';
import { OutputSignalCharts } from './ui/output/OutputSignalCharts';
import { OutputComparePanel } from './ui/output/OutputComparePanel';
import { OutputSchematic } from './ui/output/OutputSchematic';
import { OutputValues } from './ui/output/OutputValues';
import { OutputPartsPanel } from './ui/output/OutputPartsPanel';
import { SplitterSheet } from './ui/output/SplitterSheet';
import { useKeeping } from './keep/useKeeping';
import { BuildSheetPanel } from './ui/panels/BuildSheetPanel';
import { SupplyPanel } from './ui/supply/SupplyPanel';
import { ComparePanel } from './ui/panels/ComparePanel';
import { CustomTubePanel } from './ui/panels/CustomTubePanel';
import { ExportPanel } from './ui/panels/ExportPanel';
import { KeepPanel } from './ui/panels/KeepPanel';
import { TargetsPanel } from './ui/targets/TargetsPanel';
import type { WorkbenchStore } from './store/workbenchStore';
import { followerShown } from './store/shownStage';
import { FollowerFigures } from './ui/follower/FollowerFigures';
import { FollowerCompare } from './ui/follower/FollowerCompare';

export function App({ store }: { store?: WorkbenchStore }) {
  return (
    <StoreProvider store={store}>
      <Bench />
    </StoreProvider>
  );
}

function Bench() {
  useKeeping(useWorkbenchStore());
  const stageKind = useWorkbench((s) => s.design.stageKind);
  return (
      <div className="page">
        <header className="masthead">
          <h1>Quiescent</h1>
          <p className="tagline">Load lines and part values for tube audio amplifiers, stage by stage</p>
          <DesignTitle />
        </header>
        <SafetyIntro />
        <ChainStrip />
        <StageKindSwitch />
        {stageKind === 'output' ? <OutputBench /> : <VoltageBench />}
        <SupplyPanel />
        <footer>
          <SafetyNotice compact />
        </footer>
      </div>
  );
}

/**
 * The resistance-coupled voltage stage: its chart, figures, signal views and
 * build sheet; or, with its cathode follower on the bench, the follower on
 * its own curves, its figures and its values first.
 */
function VoltageBench() {
  const follower = useWorkbench(followerShown);
  return (
        <main className="bench">
          <div className="bench-main">
            {follower ? <FollowerFigures /> : <FiguresStrip />}
            <section className="sheet-panel" aria-label={follower ? 'The follower\'s plate curves' : 'Plate curves'}>
              <PlateChart />
            </section>
            <TargetsPanel />
            <FindingsList />
            {follower ? <FollowerCompare /> : (
              <>
                <SignalPanel />
                <SignalCharts />
                <ComparePanel />
              </>
            )}
            <BuildSheetPanel />
          </div>
          <div className="bench-side">
            <KeepPanel />
            <StageSchematic />
            {follower ? <Stage2Panel /> : null}
            <CircuitValues />
            {follower ? null : <Stage2Panel />}
            <TubeChooser />
            <CustomTubePanel />
            <ExportPanel />
          </div>
        </main>
  );
}

/** The transformer-coupled output stage: its chart, power and distortion, and a second tube to weigh. */
function OutputBench() {
  return (
    <main className="bench">
      <div className="bench-main">
        <OutputFigures />
        <section className="sheet-panel" aria-label="Plate curves">
          <OutputChart />
        </section>
        <TargetsPanel />
        <FindingsList />
        <OutputSignalCharts />
        <SplitterSheet />
        <OutputComparePanel />
        <OutputPartsPanel />
      </div>
      <div className="bench-side">
        <KeepPanel />
        <OutputSchematic />
        <OutputValues />
        <ExportPanel />
      </div>
    </main>
  );
}
