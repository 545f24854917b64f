import { act, fireEvent, render, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

/**
 * The output tubes on the whole amplifier's drawing as they are wired: a
 * power triode as a triode, a pentode's screen to its supply (named with its
 * voltage), to its own plate (triode-connected) or to a tap on the primary
 * (ultralinear, the tap's share named), single-ended or a pair.
 */
describe('the output tubes\' screens on the drawing', () => {
  const texts = (view: ReturnType<typeof render>) => [...view.container.querySelectorAll('svg.chain-schematic text')].map((t) => t.textContent ?? '');
  /** Grids drawn dashed: one a triode, two a pentode (control and screen). */
  const dashedGrids = (view: ReturnType<typeof render>) => view.container.querySelectorAll('svg.chain-schematic line[stroke-dasharray="4 3"]').length;
  /** Joints on the drawing: a screen joins its tap or its plate with one. */
  const dots = (view: ReturnType<typeof render>) => view.container.querySelectorAll('svg.chain-schematic circle[r="3"]').length;

  it('single-ended and in a pair, for each connection and for a power triode', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    // The demo: an ultralinear EL34 behind two triode stages (one dashed grid each; the pentode two).
    expect(dashedGrids(view)).toBe(4);
    expect(texts(view)).toContain('43 %');
    const ul = dots(view);
    act(() => { store.getState().changeOutput({ connection: 'pentode', screenVolts: 300 }); });
    expect(texts(view)).toContain('g2 300 V');
    expect(texts(view)).not.toContain('43 %');
    // The tap's joint is gone: the screen goes to its supply.
    expect(dots(view)).toBe(ul - 1);
    act(() => { store.getState().changeOutput({ connection: 'triode' }); });
    expect(texts(view).filter((t) => t.startsWith('g2') || t.endsWith('%'))).toEqual([]);
    // Tied to the plate: a joint there.
    expect(dots(view)).toBe(ul);
    act(() => store.getState().chooseOutputTube('300B'));
    expect(dashedGrids(view)).toBe(3);
    expect(dots(view)).toBe(ul - 1);
    act(() => store.getState().setOutputPair('push-pull'));
    // Two power triodes, and the splitter's one.
    expect(dashedGrids(view)).toBe(5);
    act(() => store.getState().chooseOutputTube('EL34'));
    act(() => { store.getState().changeOutput({ connection: 'ultralinear', ulTap: 0.4 }); });
    expect(dashedGrids(view)).toBe(7);
    expect(texts(view)).toContain('40 %');
    act(() => { store.getState().changeOutput({ connection: 'pentode', screenVolts: 280 }); });
    // The pair's screens joined to one supply, named once.
    expect(texts(view).filter((t) => t === 'g2 280 V')).toHaveLength(1);
  });

  it('edits the screen\'s supply and the tap\'s share where they stand, as every value on the drawing', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    const drawing = () => within(view.container.querySelector('svg.chain-schematic') as unknown as HTMLElement);
    const editor = () => within(view.container.querySelector('.chain-frame .inline-editor') as HTMLElement).getByRole('textbox');
    const edit = (button: string, typed: string) => {
      act(() => fireEvent.click(drawing().getByRole('button', { name: button })));
      act(() => fireEvent.change(editor(), { target: { value: typed } }));
      act(() => fireEvent.keyDown(editor(), { key: 'Enter' }));
    };
    edit('Output stage screen tap 43 %: change', '40');
    expect(store.getState().design.output.ulTap).toBeCloseTo(0.4, 9);
    act(() => { store.getState().changeOutput({ connection: 'pentode', screenVolts: 300 }); });
    edit('Output stage screen supply g2 300 V: change', '280');
    expect(store.getState().design.output.screenVolts).toBe(280);
    // In a pair, the joined screens' one name opens the same box.
    act(() => store.getState().setOutputPair('push-pull'));
    edit('Output stage screen supply g2 280 V: change', '270');
    expect(store.getState().design.output.screenVolts).toBe(270);
  });
});
