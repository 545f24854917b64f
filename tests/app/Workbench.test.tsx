import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

function setup() {
  const store = createWorkbenchStore();
  const user = userEvent.setup();
  const view = render(<App store={store} />);
  const figure = (name: string) => view.container.querySelector(`[data-figure="${name}"] dd`)!.textContent;
  const field = (label: RegExp) => screen.getByRole('textbox', { name: label }) as HTMLInputElement;
  return { store, user, view, figure, field };
}

describe('the workbench', () => {
  it('shows the stage\'s input resistance: its leak, less where the grid\'s own current has a slope at its bias', async () => {
    const { user, figure, field } = setup();
    // The demo's 12AU7 at −5.45 V: its 1 MΩ leak alone.
    expect(figure('rin')).toBe('1 MΩ');
    // Rk 120 Ω puts it near −1 V grid (about 7 mA), where its grid current's slope loads the source: a few hundred kΩ.
    const rk = field(/^Rk/);
    await user.clear(rk);
    await user.type(rk, '120{Tab}');
    expect(figure('rin')).toMatch(/^[2-4]\d\d kΩ$/);
  });

  it('typing "bad" into Ra shows a specific error beside it and keeps the previous figures', async () => {
    const { user, figure, field, store } = setup();
    const before = { ia: figure('ia'), gain: figure('gain'), ra: store.getState().design.ra };
    const ra = field(/^Ra/);
    await user.clear(ra);
    await user.type(ra, 'bad');
    const alert = screen.getByText('“bad” is not a part value: use digits with an optional multiplier (p n u m k M), e.g. 33k, 3k3 or 68n');
    expect(ra.getAttribute('aria-invalid')).toBe('true');
    expect(ra.getAttribute('aria-describedby')).toBe(alert.id);
    expect(figure('ia')).toBe(before.ia);
    expect(figure('gain')).toBe(before.gain);
    expect(store.getState().design.ra).toBe(before.ra);
  });

  it('"68k" in Ra updates the design, the figures and the schematic label', async () => {
    const { user, figure, field, store, view } = setup();
    const iaBefore = figure('ia');
    const ra = field(/^Ra/);
    await user.clear(ra);
    await user.type(ra, '68k');
    expect(store.getState().design.ra).toBe(68e3);
    expect(figure('ia')).not.toBe(iaBefore);
    expect(view.container.querySelector('[data-part="ra"]')!.textContent).toBe('Ra 68 kΩ');
    await user.tab();
    expect(ra.value).toBe('68k');
  });

  it('a keyboard nudge of the operating point changes Ra and Rk', async () => {
    const { user, field } = setup();
    const ra = field(/^Ra/).value;
    const rk = field(/^Rk/).value;
    const point = screen.getByRole('slider', { name: /operating point/i });
    point.focus();
    await user.keyboard('{ArrowRight}');
    expect(field(/^Ra/).value).not.toBe(ra);
    expect(field(/^Rk/).value).not.toBe(rk);
    await user.keyboard('{Shift>}{ArrowUp}{/Shift}');
    expect(point.getAttribute('aria-valuetext')).toMatch(/mA$/);
    // Enter settles the move: the values snap to the chosen series and the boxes show them.
    await user.keyboard('{Enter}');
    expect(field(/^Ra/).value).toMatch(/^\d+(\.\d)?k$/);
  });

  it('choosing another tube redraws the curves', async () => {
    const { user, view } = setup();
    const firstCurve = () => view.container.querySelector('.layer-curves path')!.getAttribute('d');
    const before = firstCurve();
    await user.click(screen.getByRole('radio', { name: /^12AX7/ }));
    expect(firstCurve()).not.toBe(before);
    expect(screen.getByRole('group', { name: /plate curves of the 12AX7/i })).toBeTruthy();
    expect(view.container.querySelector('[data-figure="mu"] dd')!.textContent).toMatch(/^\d{2,3}/);
  });

  it('the tube list filters by type or description', async () => {
    const { user } = setup();
    await user.type(screen.getByRole('searchbox', { name: /find by type/i }), 'directly heated');
    const names = within(screen.getByRole('radiogroup', { name: 'Tubes' })).getAllByRole('radio').map((r) => (r as HTMLInputElement).value);
    expect(names.sort()).toEqual(['2A3', '300B', '45']);
  });

  it('a value on the schematic is edited in place, and the form shows the same value', async () => {
    const { user, field, view } = setup();
    await user.click(screen.getByRole('button', { name: /^Rk 1\.2 kΩ/ }));
    const editor = within(view.container.querySelector('.inline-editor') as HTMLElement).getByRole('textbox');
    expect(document.activeElement).toBe(editor);
    await user.clear(editor);
    await user.type(editor, '820{Enter}');
    expect(view.container.querySelector('.inline-editor')).toBeNull();
    expect(field(/^Rk/).value).toBe('820');
    expect(view.container.querySelector('[data-part="rk"]')!.textContent).toBe('Rk 820 Ω');
  });

  it('the bypass capacitor toggles from the schematic and the gain falls without it', async () => {
    const { user, store } = setup();
    const gainBypassed = store.getState().analysis.solution.gain;
    await user.click(screen.getByRole('switch', { name: /cathode bypass capacitor/i }));
    expect(store.getState().design.bypassed).toBe(false);
    expect(Math.abs(store.getState().analysis.solution.gain)).toBeLessThan(Math.abs(gainBypassed));
  });

  it('every control has an accessible name', () => {
    const { view } = setup();
    const controls = view.container.querySelectorAll('input, select, button, [role="slider"], [role="switch"]');
    expect(controls.length).toBeGreaterThan(20);
    const labelled = new Set([...view.container.querySelectorAll('label')].map((l) => l.htmlFor).filter(Boolean));
    for (const c of controls) {
      const named =
        c.getAttribute('aria-label') ||
        c.closest('label') ||
        labelled.has(c.id) ||
        (c.tagName === 'BUTTON' && c.textContent?.trim());
      expect(named, c.outerHTML.slice(0, 120)).toBeTruthy();
    }
  });

  it('shows the safety caution prominently on a first visit and keeps it in the footer', async () => {
    localStorage.clear();
    const { user } = setup();
    expect(screen.getByRole('region', { name: 'Safety first' })).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'I understand' }));
    expect(screen.queryByRole('region', { name: 'Safety first' })).toBeNull();
    expect(screen.getByLabelText('Safety caution').textContent).toMatch(/lethal/);
  });
});
