import { useWorkbench } from '../../store/StoreProvider';

/** Frame the chart on the load line (a low-current stage fills it) or show the whole sheet the tube's ratings span. */
export function ChartWindowSwitch() {
  const w = useWorkbench((s) => s.chartWindow);
  const setWindow = useWorkbench((s) => s.setChartWindow);
  return (
    <div className="chart-window" role="group" aria-label="Chart window">
      <button type="button" aria-pressed={w === 'load-line'} onClick={() => setWindow('load-line')}>Zoom to the load line</button>
      <button type="button" aria-pressed={w === 'sheet'} onClick={() => setWindow('sheet')}>Whole sheet</button>
    </div>
  );
}
