import { act, render } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

/**
 * The whole amplifier's drawing names, over each stage's rail, the supply
 * node that feeds it, numbered as the supply's table numbers them (the
 * demo's DEMO_SUPPLY: the voltage stages on node 4, the output stage on
 * node 2; a push-pull pair's splitter takes node 3, the node before the
 * voltage stages'). A follower rides on its gain stage's rail: no node of
 * its own.
 */
describe('the supply node over each rail of the drawing', () => {
  const nodes = (view: ReturnType<typeof render>) => [...view.container.querySelectorAll('svg.chain-schematic text')].map((t) => t.textContent ?? '').filter((t) => /^node \d+$/.test(t));

  it('names each stage\'s node, and follows when a stage moves to another', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    expect(nodes(view)).toEqual(['node 4', 'node 4', 'node 2']);
    act(() => store.getState().setStageNode(1, 2));
    expect(nodes(view)).toEqual(['node 4', 'node 3', 'node 2']);
    act(() => store.getState().setOutputPair('push-pull'));
    expect(nodes(view)).toEqual(['node 4', 'node 3', 'node 3', 'node 2']);
  });

  it('gives a follower none: it rides on the rail of the stage it follows', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    act(() => store.getState().addStage(0, 'follower'));
    expect(view.container.querySelectorAll('svg.chain-schematic rect.chain-cell')).toHaveLength(4);
    expect(nodes(view)).toEqual(['node 4', 'node 4', 'node 2']);
  });
});
