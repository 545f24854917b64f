import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { App } from '../../../app/App';
import { writeDesignFile } from '../../../app/keep/designFile';
import { DEMO_DESIGN } from '../../../app/store/demoDesign';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';

describe('keeping designs in the workbench', () => {
  it('a malformed file gets its message and leaves the design untouched', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    render(<App store={store} />);
    const before = store.getState().design;
    const file = new File(['{"format": "quiescent-design", "version": 1, "title": "x", "desi'], 'broken.json', { type: 'application/json' });
    await user.upload(screen.getByLabelText('Open file'), file);
    expect((await screen.findByText(/^The file is not complete JSON/)).getAttribute('role')).toBe('alert');
    expect(store.getState().design).toBe(before);
  });

  it('a file with script-like text in its title opens, and the title is only ever text', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    const view = render(<App store={store} />);
    const title = '<img src=x onerror="window.__pwned=1">';
    await user.upload(screen.getByLabelText('Open file'), new File([writeDesignFile({ title, design: { ...DEMO_DESIGN, ra: 47e3 } })], 'odd.json'));
    await screen.findByText(`Opened “${title}”.`);
    expect(store.getState().design.ra).toBe(47e3);
    expect((screen.getByRole('textbox', { name: 'Design title' }) as HTMLInputElement).value).toBe(title);
    expect(view.container.querySelector('img')).toBeNull();
    expect((window as unknown as { __pwned?: number }).__pwned).toBeUndefined();
  });

  it('undo and redo step through design changes; Ctrl+Z and Ctrl+Shift+Z do the same', async () => {
    let t = 0;
    const store = createWorkbenchStore({ now: () => (t += 5000) });
    const user = userEvent.setup();
    render(<App store={store} />);
    store.getState().editField('ra', '33k');
    store.getState().editField('rk', '820');
    await user.click(screen.getByRole('button', { name: 'Undo' }));
    expect(store.getState().design).toMatchObject({ ra: 33e3, rk: 1200 });
    await user.keyboard('{Control>}z{/Control}');
    expect(store.getState().design).toMatchObject({ ra: 27e3, rk: 1200 });
    await user.keyboard('{Control>}{Shift>}z{/Shift}{/Control}');
    expect(store.getState().design).toMatchObject({ ra: 33e3 });
  });

  it('one whole drag is one undo step', () => {
    const store = createWorkbenchStore();
    const start = store.getState().design;
    const g = store.getState;
    g().beginDrag('point');
    for (let k = 0; k < 10; k++) g().dragPointTo(150 + k, 5e-3);
    g().endDrag();
    expect(g().design.ra).not.toBe(start.ra);
    expect(g().past).toHaveLength(1);
    g().undo();
    expect(g().design).toEqual(start);
  });

  it('typing a value is one step, not one per key', () => {
    let t = 0;
    const store = createWorkbenchStore({ now: () => (t += 100) });
    for (const text of ['6', '68', '68k']) store.getState().editField('ra', text);
    expect(store.getState().past).toHaveLength(1);
  });

  it('autosaves, and a new page opens on the autosaved design', async () => {
    const first = render(<App store={createWorkbenchStore()} />);
    const store = createWorkbenchStore();
    first.unmount();
    localStorage.setItem('quiescent.autosave', writeDesignFile({ title: 'Kept', design: { ...DEMO_DESIGN, bplus: 300 } }));
    render(<App store={store} />);
    expect(store.getState().design.bplus).toBe(300);
    expect(store.getState().title).toBe('Kept');
    expect(store.getState().past).toHaveLength(0);
  });
});
