import { act, render, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { App } from '../../../app/App';
import { readDesignFile, writeDesignFile } from '../../../app/keep/designFile';
import { MAX_LINK_CHARS, readShareFragment, shareFragment } from '../../../app/keep/shareLink';
import { putOnShelf, shelfNames, takeFromShelf } from '../../../app/keep/storage';
import { DEMO_DESIGN } from '../../../app/store/demoDesign';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';

const lastDesign = { title: 'My last design', design: { ...DEMO_DESIGN, bplus: 310, ra: 33e3 } };
const savedDesign = () => {
  const r = readDesignFile(localStorage.getItem('quiescent.autosave') ?? '');
  return r.ok ? r.doc : null;
};

describe('share links say what is wrong with them', () => {
  it('characters outside base64url and "=" padding get specific messages, not silence', () => {
    expect(readShareFragment('#design=abc%20def')).toEqual({ ok: false, message: 'The shared link is damaged: at place 4 it has the character “%”, which is not base64url. The bench kept your last design.' });
    expect(readShareFragment('#design=abcd==')).toEqual({ ok: false, message: 'The shared link is damaged: at place 5 it has padding “=”, which design links never carry. The bench kept your last design.' });
  });

  it('an oversize link is refused by its length, before decoding', () => {
    const r = readShareFragment(`#design=${'A'.repeat(MAX_LINK_CHARS + 1)}`);
    expect(r).toEqual({ ok: false, message: 'The shared link is 100,001 characters long; a design link is at most 100,000. The bench kept your last design.' });
  });
});

describe('nothing the user made is lost', () => {
  it('a refused link leaves the last design open (not the demo), and an edit then saves that design', async () => {
    localStorage.setItem('quiescent.autosave', writeDesignFile(lastDesign));
    history.replaceState(null, '', '/#design=abcd==');
    const store = createWorkbenchStore();
    render(<App store={store} />);
    expect(store.getState().design.bplus).toBe(310);
    expect(screen.getByText(/The shared link is damaged/).textContent).toMatch(/kept your last design/);
    act(() => store.getState().editField('ra', '39k'));
    window.dispatchEvent(new Event('pagehide'));
    expect(savedDesign()?.design).toMatchObject({ bplus: 310, ra: 39e3 });
  });

  it('a link pasted into an open tab is opened (hashchange), with the same checks', async () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    await act(async () => {
      history.replaceState(null, '', `/${shareFragment(lastDesign)}`);
      window.dispatchEvent(new HashChangeEvent('hashchange'));
    });
    expect(store.getState().design.bplus).toBe(310);
    await act(async () => {
      history.replaceState(null, '', '/#design=***');
      window.dispatchEvent(new HashChangeEvent('hashchange'));
    });
    expect(store.getState().design.bplus).toBe(310);
    expect(screen.getByText(/The shared link is damaged/)).toBeTruthy();
  });

  it('leaving the page right after a change keeps it (pagehide flushes the autosave)', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => store.getState().editField('bplus', '290'));
    expect(savedDesign()?.design.bplus).not.toBe(290); // the 400 ms autosave has not run yet
    window.dispatchEvent(new Event('pagehide'));
    expect(savedDesign()?.design.bplus).toBe(290);
  });

  it('a reload in the middle of a drag keeps the design from before the drag, never a half-moved unsnapped one', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    const before = store.getState().design;
    act(() => {
      store.getState().beginDrag('point');
      store.getState().dragPointTo(160, 4.2e-3);
    });
    expect(store.getState().design.ra).not.toBe(before.ra);
    window.dispatchEvent(new Event('pagehide'));
    expect(savedDesign()?.design).toEqual(before);
  });

  it('the undo history survives a reload', () => {
    let t = 0;
    const first = createWorkbenchStore({ now: () => (t += 5000) });
    const view = render(<App store={first} />);
    act(() => {
      first.getState().editField('ra', '33k');
      first.getState().editField('rk', '820');
    });
    window.dispatchEvent(new Event('pagehide'));
    view.unmount();
    const second = createWorkbenchStore();
    render(<App store={second} />);
    expect(second.getState().design).toMatchObject({ ra: 33e3, rk: 820 });
    expect(second.getState().past).toHaveLength(2);
    act(() => second.getState().undo());
    expect(second.getState().design).toMatchObject({ ra: 33e3, rk: 1200 });
  });

  it('storage that will not save is said, with what to do, and the bench keeps working', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    const spy = vi.spyOn(Storage.prototype, 'setItem').mockImplementation(() => {
      throw new DOMException('full', 'QuotaExceededError');
    });
    try {
      act(() => store.getState().editField('bplus', '290'));
      act(() => window.dispatchEvent(new Event('pagehide')));
      expect(screen.getByText(/would not keep your latest change/).textContent).toMatch(/Save a design file to keep it/);
      expect(store.getState().design.bplus).toBe(290);
    } finally {
      spy.mockRestore();
    }
  });

  it('a damaged autosave is named, set aside, and the bench opens on the demo', () => {
    localStorage.setItem('quiescent.autosave', '{"format": "quiescent-design", "vers');
    const store = createWorkbenchStore();
    render(<App store={store} />);
    expect(screen.getByText(/Your last design could not be read/).textContent).toMatch(/quiescent\.autosave\.damaged/);
    expect(localStorage.getItem('quiescent.autosave.damaged')).toMatch(/^\{"format"/);
  });

  it('a design kept under the name "__proto__" or "constructor" is really kept', () => {
    for (const name of ['__proto__', 'constructor']) {
      expect(putOnShelf(name, lastDesign)).toBe(true);
      expect(takeFromShelf(name)?.design.bplus).toBe(310);
    }
    expect(shelfNames()).toEqual(['__proto__', 'constructor']);
  });
});
