import { PALETTE } from '../ui/chart/palette';
import { addCaption, type ChartCaption } from './chartCaption';

/** Fonts named in exported SVG and drawn into PNGs: common on every desktop, with a generic fallback. */
export const EXPORT_FONTS = "'DejaVu Sans', 'Segoe UI', Arial, Helvetica, sans-serif";

/**
 * A standalone SVG document of an on-screen SVG: namespace, size, an explicit
 * font stack and a sheet-coloured background, so it renders the same outside
 * the page. Only drawn shapes and text are kept; nothing interactive.
 */
export function svgDocument(svg: SVGSVGElement, caption?: ChartCaption): { text: string; width: number; height: number } {
  const clone = svg.cloneNode(true) as SVGSVGElement;
  const [, , w, h] = (svg.getAttribute('viewBox') ?? '0 0 760 520').split(/\s+/).map(Number) as [number, number, number, number];
  clone.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  clone.setAttribute('font-family', EXPORT_FONTS);
  // Nothing interactive on paper: the hover surface, and the B+ handle, which would cover the axis labels (the caption states B+).
  clone.querySelectorAll('.hover-surface, .handle-bplus').forEach((el) => el.remove());
  const bg = document.createElementNS('http://www.w3.org/2000/svg', 'rect');
  bg.setAttribute('width', String(w));
  bg.setAttribute('height', String(h));
  bg.setAttribute('fill', PALETTE.sheet);
  clone.insertBefore(bg, clone.firstChild);
  const height = caption ? addCaption(clone, w, h, caption) : h;
  clone.setAttribute('viewBox', `0 0 ${w} ${height}`);
  clone.setAttribute('width', String(w));
  clone.setAttribute('height', String(height));
  return { text: new XMLSerializer().serializeToString(clone), width: w, height };
}

/** Loads SVG text as an image the canvas can draw. */
export async function svgImage(text: string): Promise<HTMLImageElement> {
  const url = URL.createObjectURL(new Blob([text], { type: 'image/svg+xml' }));
  try {
    const img = new Image();
    img.src = url;
    await img.decode();
    return img;
  } finally {
    setTimeout(() => URL.revokeObjectURL(url), 0);
  }
}

export function canvasBlob(canvas: HTMLCanvasElement): Promise<Blob> {
  return new Promise((resolve, reject) => canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('the browser could not encode the PNG'))), 'image/png'));
}

/** The chart as a PNG at `scale` times its on-screen size (the SVG is drawn at that size, so lines stay sharp). */
export async function chartPng(svg: SVGSVGElement, scale: number, caption?: ChartCaption): Promise<Blob> {
  const doc = svgDocument(svg, caption);
  const img = await svgImage(doc.text);
  const canvas = document.createElement('canvas');
  canvas.width = Math.round(doc.width * scale);
  canvas.height = Math.round(doc.height * scale);
  canvas.getContext('2d')!.drawImage(img, 0, 0, canvas.width, canvas.height);
  return canvasBlob(canvas);
}
