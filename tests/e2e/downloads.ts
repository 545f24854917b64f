import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { expect } from 'vitest';

/** Reading what the page downloads: PNG size, how much of it is drawn, the bytes of a download. */
/** Width and height from a PNG's IHDR chunk (bytes 16–23, big-endian). */
export function pngSize(bytes: Buffer): { width: number; height: number } {
  expect(bytes.subarray(1, 4).toString('latin1')).toBe('PNG');
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

/** Share of pixels in the middle of a PNG that differ from its top-left pixel, decoded by the browser. */
/** The share of pixels that differ from the corner's colour: over the middle 80 % of the image, or over `region` (image pixels). */
export async function inkShare(page: Page, png: Buffer, region?: { x: number; y: number; width: number; height: number }): Promise<number> {
  return page.evaluate(async ({ b64, region }) => {
    const img = new Image();
    img.src = `data:image/png;base64,${b64}`;
    await img.decode();
    const c = document.createElement('canvas');
    c.width = img.width;
    c.height = img.height;
    const ctx = c.getContext('2d')!;
    ctx.drawImage(img, 0, 0);
    const r = region ?? { x: Math.floor(img.width * 0.1), y: Math.floor(img.height * 0.1), width: Math.floor(img.width * 0.8), height: Math.floor(img.height * 0.8) };
    const data = ctx.getImageData(r.x, r.y, r.width, r.height).data;
    let differ = 0;
    for (let i = 0; i < data.length; i += 4) if (Math.abs(data[i]! - data[0]!) + Math.abs(data[i + 1]! - data[1]!) + Math.abs(data[i + 2]! - data[2]!) > 60) differ++;
    return differ / (data.length / 4);
  }, { b64: png.toString('base64'), region });
}

export async function downloadOf(page: Page, button: string): Promise<Buffer> {
  const [dl] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: button }).click()]);
  return readFileSync((await dl.path())!);
}

/** A build card's A4 pages (1240 × 1754 px each at 150 dpi, stacked); fails the test on any other size. */
export function cardPages(size: { width: number; height: number }): number {
  const pages = size.height / 1754;
  if (size.width !== 1240 || !Number.isInteger(pages) || pages < 1 || pages > 4) throw new Error(`not a card of A4 pages: ${size.width} × ${size.height}`);
  return pages;
}
