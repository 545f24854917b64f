import { PlateChart } from './chart/PlateChart';
import { CircuitValues } from './panels/CircuitValues';
import { FiguresStrip } from './panels/FiguresStrip';
import { FindingsList } from './panels/FindingsList';
import { SafetyIntro } from './panels/SafetyIntro';
import { SafetyNotice } from './panels/SafetyNotice';
import { TubeChooser } from './panels/TubeChooser';
import { StageSchematic } from './schematic/StageSchematic';
import { SignalCharts } from './signal/SignalCharts';
import { SignalPanel } from './signal/SignalPanel';
import { Stage2Panel } from './signal/Stage2Panel';
import { DesignTitle } from './panels/DesignTitle';
import { StoreProvider, useWorkbench, useWorkbenchStore } from './store/StoreProvider';
import { StageKindSwitch } from './output/StageKindSwitch';
import { ChainStrip } from './chain/ChainStrip';
import { OutputChart } from './output/OutputChart';
import { OutputFigures } from './output/OutputFigures';
import { OutputSignalCharts } from './output/OutputSignalCharts';
import { OutputComparePanel } from './output/OutputComparePanel';
import { OutputSchematic } from './output/OutputSchematic';
import { OutputValues } from './output/OutputValues';
import { OutputPartsPanel } from './output/OutputPartsPanel';
import { useKeeping } from './keep/useKeeping';
import { BuildSheetPanel } from './panels/BuildSheetPanel';
import { SupplyPanel } from './supply/SupplyPanel';
import { ComparePanel } from './panels/ComparePanel';
import { CustomTubePanel } from './panels/CustomTubePanel';
import { ExportPanel } from './panels/ExportPanel';
import { KeepPanel } from './panels/KeepPanel';
import { TargetsPanel } from './targets/TargetsPanel';
import type { WorkbenchStore } from './store/workbenchStore';
import { followerShown } from './store/shownStage';
import { FollowerFigures } from './follower/FollowerFigures';
import { FollowerCompare } from './follower/FollowerCompare';

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
