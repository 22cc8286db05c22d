/**
 * Marker outlines as SVG path data, so all markers of one series go into a single `<path>`
 * (short, fast output). Each shape has about the same visual area for the same `size`.
 */
import type { MarkerShape } from '../../output/palette.js';
import { r2 } from './svgNumber.js';

/** Path data of one marker of `shape` centred on (cx, cy), `size` ≈ diameter in SVG units. */
export function markerPath(shape: MarkerShape, cx: number, cy: number, size: number): string {
  const r = size / 2;
  switch (shape) {
    case 'square': {
      const h = r * 0.88;
      return `M${r2(cx - h)} ${r2(cy - h)}h${r2(2 * h)}v${r2(2 * h)}h${r2(-2 * h)}Z`;
    }
    case 'triangle': {
      const h = r * 1.2;
      return `M${r2(cx)} ${r2(cy - h)}L${r2(cx + h * 0.95)} ${r2(cy + h * 0.7)}L${r2(cx - h * 0.95)} ${r2(cy + h * 0.7)}Z`;
    }
    case 'diamond': {
      const h = r * 1.2;
      return `M${r2(cx)} ${r2(cy - h)}L${r2(cx + h)} ${r2(cy)}L${r2(cx)} ${r2(cy + h)}L${r2(cx - h)} ${r2(cy)}Z`;
    }
    case 'triangle-down': {
      const h = r * 1.2;
      return `M${r2(cx)} ${r2(cy + h)}L${r2(cx + h * 0.95)} ${r2(cy - h * 0.7)}L${r2(cx - h * 0.95)} ${r2(cy - h * 0.7)}Z`;
    }
    case 'pentagon':
      return polygon(cx, cy, r * 1.1, 5, 0);
    case 'hexagon':
      return polygon(cx, cy, r * 1.05, 6, Math.PI / 6);
    case 'star':
      return star(cx, cy, r * 1.35, r * 0.6);
    default:
      return `M${r2(cx - r)} ${r2(cy)}a${r2(r)} ${r2(r)} 0 1 0 ${r2(2 * r)} 0a${r2(r)} ${r2(r)} 0 1 0 ${r2(-2 * r)} 0Z`;
  }
}

/** Regular polygon of `k` corners on a circle of radius `r`, the first corner at the top turned by `turn`. */
function polygon(cx: number, cy: number, r: number, k: number, turn: number): string {
  const pts = Array.from({ length: k }, (_, i) => {
    const a = turn - Math.PI / 2 + (2 * Math.PI * i) / k;
    return `${r2(cx + r * Math.cos(a))} ${r2(cy + r * Math.sin(a))}`;
  });
  return `M${pts.join('L')}Z`;
}

/** Five-pointed star with outer radius `ro` and inner radius `ri`. */
function star(cx: number, cy: number, ro: number, ri: number): string {
  const pts = Array.from({ length: 10 }, (_, i) => {
    const a = -Math.PI / 2 + (Math.PI * i) / 5;
    const r = i % 2 === 0 ? ro : ri;
    return `${r2(cx + r * Math.cos(a))} ${r2(cy + r * Math.sin(a))}`;
  });
  return `M${pts.join('L')}Z`;
}
