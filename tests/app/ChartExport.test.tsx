import { render } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { chartCaption } from '../../app/export/chartCaption';
import { svgDocument } from '../../app/export/chartImage';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

describe('the exported chart', () => {
  it('carries a title line (tube, B+, Ra, Rk), the key figures and the legend, and no B+ handle over the axis labels', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    const svg = view.container.querySelector<SVGSVGElement>('svg.plate-chart')!;
    const doc = svgDocument(svg, chartCaption(store.getState()));
    expect(doc.text).toContain('12AU7, B+ 275 V, Ra 27 kΩ, Rk 1.2 kΩ bypassed, RL 220 kΩ');
    expect(doc.text).toMatch(/Va [\d.]+ V, Ia [\d.]+ mA/);
    for (const label of ['DC load line', 'Maximum plate voltage', 'Operating point']) expect(doc.text).toContain(label);
    expect(doc.text).not.toContain('handle-bplus');
    const [, , w, h] = svg.getAttribute('viewBox')!.split(' ').map(Number);
    expect(doc.width).toBe(w);
    expect(doc.height).toBeGreaterThan(h!);
  });
});
