import { PlateChart } from './chart/PlateChart';
import { SafetyNotice } from './panels/SafetyNotice';
import { StoreProvider } from './store/StoreProvider';
import type { WorkbenchStore } from './store/workbenchStore';

export function App({ store }: { store?: WorkbenchStore }) {
  return (
    <StoreProvider store={store}>
      <div className="page">
        <header className="masthead">
          <h1>Quiescent</h1>
          <p className="tagline">Load lines and part values for tube audio stages</p>
        </header>
        <main>
          <section className="sheet-panel" aria-label="Plate curves">
            <PlateChart />
          </section>
        </main>
        <footer>
          <SafetyNotice />
        </footer>
      </div>
    </StoreProvider>
  );
}
