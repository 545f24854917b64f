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
import { StoreProvider, useWorkbenchStore } from './store/StoreProvider';
import { useKeeping } from './keep/useKeeping';
import { BuildSheetPanel } from './panels/BuildSheetPanel';
import { ComparePanel } from './panels/ComparePanel';
import { CustomTubePanel } from './panels/CustomTubePanel';
import { ExportPanel } from './panels/ExportPanel';
import { KeepPanel } from './panels/KeepPanel';
import type { WorkbenchStore } from './store/workbenchStore';

export function App({ store }: { store?: WorkbenchStore }) {
  return (
    <StoreProvider store={store}>
      <Bench />
    </StoreProvider>
  );
}

function Bench() {
  useKeeping(useWorkbenchStore());
  return (
      <div className="page">
        <header className="masthead">
          <h1>Quiescent</h1>
          <p className="tagline">Load lines and part values for tube audio stages</p>
          <DesignTitle />
        </header>
        <SafetyIntro />
        <main className="bench">
          <div className="bench-main">
            <FiguresStrip />
            <section className="sheet-panel" aria-label="Plate curves">
              <PlateChart />
            </section>
            <FindingsList />
            <SignalPanel />
            <SignalCharts />
            <ComparePanel />
            <BuildSheetPanel />
          </div>
          <div className="bench-side">
            <KeepPanel />
            <StageSchematic />
            <CircuitValues />
            <Stage2Panel />
            <TubeChooser />
            <CustomTubePanel />
            <ExportPanel />
          </div>
        </main>
        <footer>
          <SafetyNotice compact />
        </footer>
      </div>
  );
}
