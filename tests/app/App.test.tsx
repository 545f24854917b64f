import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

describe('the workbench page', () => {
  it('shows the product name, the safety caution and a plate-curve family', () => {
    const store = createWorkbenchStore();
    const { container } = render(<App store={store} />);
    expect(screen.getByRole('heading', { level: 1 }).textContent).toBe('Quiescent');
    expect(screen.getByLabelText('Safety caution').textContent).toMatch(/lethal voltages/i);
    const curves = container.querySelectorAll('.layer-curves path');
    expect(curves.length).toBe(store.getState().analysis.sheet.family.length);
    expect(curves.length).toBeGreaterThanOrEqual(5);
    // Every curve is a real path, not an empty or NaN-laden one.
    for (const c of curves) expect(c.getAttribute('d')).toMatch(/^M[\d.]+,[\d.]+L/);
    expect(container.querySelector('[data-series="dissipation"]')).not.toBeNull();
  });
});
