/** Path data for the parts the supply drawings share: resistors, chokes and windings, as drawings of our own. */

/** A resistor drawn as a zigzag from x to x + w at height y. */
export function zigzag(x: number, y: number, w: number): string {
  const n = 6;
  const pts = [`M${x},${y}`, `L${x + w * 0.2},${y}`];
  for (let k = 0; k < n; k++) pts.push(`L${x + w * 0.2 + ((k + 0.5) * w * 0.6) / n},${y + (k % 2 === 0 ? -6 : 6)}`);
  pts.push(`L${x + w * 0.8},${y}`, `L${x + w},${y}`);
  return pts.join(' ');
}

/** A resistor drawn upright, a zigzag from (x, y) down h. */
export function zigzagDown(x: number, y: number, h: number): string {
  const n = 6;
  const pts = [`M${x},${y}`, `L${x},${y + h * 0.2}`];
  for (let k = 0; k < n; k++) pts.push(`L${x + (k % 2 === 0 ? -6 : 6)},${y + h * 0.2 + ((k + 0.5) * h * 0.6) / n}`);
  pts.push(`L${x},${y + h * 0.8}`, `L${x},${y + h}`);
  return pts.join(' ');
}

/** An inductor drawn as four humps from x to x + w at height y. */
export function coil(x: number, y: number, w: number): string {
  const a = x + w * 0.15;
  const hump = (w * 0.7) / 4;
  let p = `M${x},${y} L${a},${y}`;
  for (let k = 0; k < 4; k++) p += ` a${hump / 2},${hump / 2} 0 0 1 ${hump},0`;
  return `${p} L${x + w},${y}`;
}

/** A vertical winding from (x, y) down h, its turns bulging left (−1) or right (+1). */
export function winding(x: number, y: number, h: number, side: 1 | -1): string {
  const turn = h / 4;
  let p = `M${x},${y}`;
  for (let k = 0; k < 4; k++) p += ` a${turn / 2},${turn / 2} 0 0 ${side === 1 ? 1 : 0} 0,${turn}`;
  return p;
}

/** A capacitor from a node at (x, y) down to ground at `ground`: two plates 6 px apart, 30 px below the node. */
export function capacitorDown(x: number, y: number, ground: number): string {
  return `M${x} ${y} V${y + 30} M${x - 12} ${y + 30} H${x + 12} M${x - 12} ${y + 36} H${x + 12} M${x} ${y + 36} V${ground}`;
}
