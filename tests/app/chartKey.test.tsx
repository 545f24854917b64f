import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

describe('the chart key', () => {
  it('shows each ratings limit in the style it is drawn in', () => {
    const view = render(<App store={createWorkbenchStore()} />);
    const key = screen.getByRole('list', { name: 'Chart key' });
    const swatch = (label: string) => [...key.querySelectorAll('li')].find((li) => li.textContent === label)!.querySelector('line')!;
    for (const [label, series] of [['Maximum plate voltage', 'max-plate-voltage'], ['Rated plate dissipation', 'dissipation']] as const) {
      const drawn = view.container.querySelector(`[data-series="${series}"]`)!;
      expect(drawn, series).toBeTruthy();
      expect(swatch(label).getAttribute('stroke-dasharray')).toBe(drawn.getAttribute('stroke-dasharray'));
      expect(swatch(label).getAttribute('stroke-width')).toBe(drawn.getAttribute('stroke-width'));
    }
  });

  it('keys the grid-leak limit with its voltage, drawn on that plate curve in the same style', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    const key = screen.getByRole('list', { name: 'Chart key' });
    const drawn = view.container.querySelector('[data-series="grid-leak-limit"]')!;
    expect(drawn).toBeTruthy();
    // The bench's own sheet says where: the same voltage on the chart and in the key.
    const vg = store.getState().analysis.sheet.gridLimit!.vg;
    expect(Number(drawn.getAttribute('data-vg'))).toBe(vg);
    const item = [...key.querySelectorAll('li')].find((li) => li.textContent!.startsWith('Grid-leak limit'))!;
    expect(item.textContent).toContain(`(${vg.toFixed(2).replace('-', '−')} V)`);
    expect(item.querySelector('line')!.getAttribute('stroke-dasharray')).toBe(drawn.getAttribute('stroke-dasharray'));
  });
});
