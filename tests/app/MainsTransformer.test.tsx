import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { readDesignFile, writeDesignFile } from '../../app/keep/designFile';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { solveOnSupply } from '../../src/index';

const amps = (text: string) => Number(/; ([\d.]+) A in the primary/.exec(text)![1]);

describe('the mains transformer and its fuse', () => {
  it('adds every winding\'s VA once the supply is solved, fuses the primary at the mains chosen, counts a bias winding, and keeps the mains in files', async () => {
    const store = createWorkbenchStore({ supplySolver: async (input) => solveOnSupply(input) });
    render(<App store={store} />);
    const panel = within(screen.getByRole('region', { name: 'B+ supply' }));
    const line = await panel.findByTestId('mains-transformer', {}, { timeout: 5000 });
    expect(line.textContent).toMatch(/^Mains transformer: at least [\d.]+ VA \(B\+ [\d.]+ VA idle, about [\d.]+ VA at full power, heaters [\d.]+ VA\); [\d.]+ A in the primary at 230 V \(at 85 % efficiency, from memory\); a time-lag \(T\) fuse of [\d.]+ A/);
    // The larger of the B+ winding's idle and full-power VA, and the heaters': added (to the three figures shown).
    const [total, idle, full, heaters] = /at least ([\d.]+) VA \(B\+ ([\d.]+) VA idle, about ([\d.]+) VA at full power, heaters ([\d.]+) VA/.exec(line.textContent!)!.slice(1).map(Number);
    expect(Math.abs(total! - (Math.max(idle!, full!) + heaters!))).toBeLessThan(0.15);
    // The demo's centre-tapped winding is fused in its centre tap.
    expect(line.textContent).toMatch(/; a time-lag fuse of [\d.]+ A in the B\+ winding's centre tap \(the same rule/);
    const at230 = amps(line.textContent!);
    // The same amplifier on 120 V mains draws 230/120 times the primary current (P = V·I).
    act(() => void fireEvent.change(panel.getByLabelText('Mains voltage'), { target: { value: '120' } }));
    await waitFor(() => expect(amps(panel.getByTestId('mains-transformer').textContent!) / at230).toBeCloseTo(230 / 120, 1));
    expect(cardSections(store.getState()).find((c) => c.heading === 'B+ supply')!.lines.some((l) => /^Mains transformer: .* at 120 V /.test(l))).toBe(true);
    // A fixed-bias output stage's winding joins them.
    act(() => void store.getState().setOutputBias('fixed'));
    await waitFor(() => expect(panel.getByTestId('mains-transformer').textContent).toMatch(/, bias [\d.]+ VA\)/), { timeout: 5000 });
    const back = readDesignFile(writeDesignFile({ title: 'us mains', design: store.getState().design }));
    if (!back.ok) throw new Error(back.message);
    expect(back.doc.design.supply.mainsVolts).toBe(120);
    const doc = JSON.parse(writeDesignFile({ title: 'older', design: store.getState().design })) as { design: { supply: Record<string, unknown> } };
    delete doc.design.supply.mainsVolts;
    const older = readDesignFile(JSON.stringify(doc));
    expect(older.ok && older.doc.design.supply.mainsVolts).toBe(230);
    doc.design.supply.mainsVolts = 400;
    expect(readDesignFile(JSON.stringify(doc))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.supply: The mains voltage must be from 50 V to 300 V/) });
  });
});
