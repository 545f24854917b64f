import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './App';
import { createWorkbenchStore } from './store/workbenchStore';
import { warmDragPath } from './store/warmDragPath';
import { supplyBetweenFrames } from './work/supplyBetweenFrames';
import { regionThread } from './work/regionThread';
import './styles.css';

const root = document.getElementById('root');
if (root) {
  const store = createWorkbenchStore({ supplySolver: supplyBetweenFrames(), ...(typeof Worker !== 'undefined' ? { regionSolver: regionThread() } : {}) });
  createRoot(root).render(
    <StrictMode>
      <App store={store} />
    </StrictMode>,
  );
  warmDragPath(store);
}
