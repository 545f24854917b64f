import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './App';
import { createWorkbenchStore } from './store/workbenchStore';
import { warmDragPath } from './store/warmDragPath';
import { supplyBetweenFrames } from './work/supplyBetweenFrames';
import { lowEndInWorker, supplyInWorker } from './work/supplyInWorker';
import { regionThread } from './work/regionThread';
import './styles.css';

const root = document.getElementById('root');
if (root) {
  const workers = typeof Worker !== 'undefined';
  // Off the page's thread where the browser has workers (every one the workbench runs in); else between frames.
  const store = createWorkbenchStore({ supplySolver: workers ? supplyInWorker() : supplyBetweenFrames(), ...(workers ? { regionSolver: regionThread(), lowEndSolver: lowEndInWorker() } : {}) });
  createRoot(root).render(
    <StrictMode>
      <App store={store} />
    </StrictMode>,
  );
  warmDragPath(store);
}
