import { describe, expect, it } from 'vitest';
import { drawXY } from '../../app/ui/signal/drawXY';

/** A fit's points are drawn as one path of dots: every point shown, few elements made (10,000 circles froze the page). */
describe('the small chart\'s dot cloud', () => {
  const layer = () => document.createElementNS('http://www.w3.org/2000/svg', 'g');
  const points = Array.from({ length: 10_000 }, (_, k) => ({ x: 40 + (k % 300), y: (k % 17) / 2 }));

  it('draws 10,000 points as one path holding a dot for each, and no circle', () => {
    const g = layer();
    drawXY(g, { width: 330, height: 230, x: { domain: [0, 400], label: 'Va (V)' }, y: { domain: [0, 10], label: 'Ia (mA)' }, dots: { key: 'your-points', color: '#c60', points } });
    const cloud = g.querySelectorAll('path[data-dots="your-points"]');
    expect(cloud).toHaveLength(1);
    expect(cloud[0]!.getAttribute('d')!.match(/M/g)).toHaveLength(10_000);
    expect(g.querySelectorAll('circle')).toHaveLength(0);
  });

  it('places each dot by the chart\'s scales, and leaves out a point that is not a number', () => {
    const g = layer();
    drawXY(g, { width: 330, height: 230, x: { domain: [0, 400], label: 'Va (V)' }, y: { domain: [0, 10], label: 'Ia (mA)' }, dots: { key: 'p', color: '#c60', points: [{ x: 0, y: 0 }, { x: 400, y: 10 }, { x: Number.NaN, y: 1 }] } });
    // Margins 48 left, 12 right, 10 top, 36 bottom: (0, 0) sits at (48, 194) and (400, 10) at (318, 10).
    expect(g.querySelector('path[data-dots="p"]')!.getAttribute('d')).toBe('M48.0,194.0h0M318.0,10.0h0');
  });
});
