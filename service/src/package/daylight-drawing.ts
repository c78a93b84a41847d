import sharp from 'sharp';
import { planGeometry, type Plan, type PlanInput } from '../../../contract/daylight-plan.js';

/**
 * The room's daylight plan as the Daylight page draws it (the same geometry, `contract/daylight-plan.ts`),
 * written as SVG text in print colours and rendered to PNG with sharp (librsvg), for the Word package.
 */

/** A drawing ready for the document: PNG bytes and their size in pixels. */
export interface PlanDrawing {
  png: Buffer;
  width: number;
  height: number;
}

// Each plan is drawn once, one at a time: libvips's cache of earlier operations and its thread pool
// would only hold memory (the 5,000-space bench's Word file peaks some 100 MB lower without them).
sharp.cache(false);
sharp.concurrency(1);

/** The most drawings one package carries: enough for every daylit room of a normal project, bounded for a large one. */
export const maxPlanDrawings = 30;

const escape = (text: string) =>
  text.replace(/[&<>"']/g, (character) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[character]!);
const n = (value: number) => (Number.isFinite(value) ? Math.round(value * 100) / 100 : 0);

/** The plan as SVG text: zones in the page's patterns, walls, windows, skylights, the two dimensions, a scale bar and north. */
export function planSvg(plan: Plan, labels: { length: string; width: string; unit: string }): string {
  const { room } = plan;
  const zoneFill = { 'primary-sidelit': 'url(#primary)', 'secondary-sidelit': 'url(#secondary)', toplit: 'url(#toplit)' } as const;
  const parts = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${n(plan.viewWidth)}" height="${n(plan.viewHeight)}" viewBox="0 0 ${n(plan.viewWidth)} ${n(plan.viewHeight)}" font-family="DejaVu Sans, Liberation Sans, Arial, sans-serif">`,
    '<defs>',
    '<pattern id="primary" patternUnits="userSpaceOnUse" width="8" height="8" patternTransform="rotate(45)"><rect width="8" height="8" fill="#b9e3dc"/><line x1="0" y1="0" x2="0" y2="8" stroke="#00796b" stroke-width="2"/></pattern>',
    '<pattern id="secondary" patternUnits="userSpaceOnUse" width="9" height="9"><rect width="9" height="9" fill="#e3f2f7"/><circle cx="4.5" cy="4.5" r="1.3" fill="#3b7f99"/></pattern>',
    '<pattern id="toplit" patternUnits="userSpaceOnUse" width="10" height="10"><rect width="10" height="10" fill="#ffe7b3"/><path d="M0 0 L10 10 M10 0 L0 10" stroke="#a86b00" stroke-width="1"/></pattern>',
    '</defs>',
    `<rect x="0" y="0" width="${n(plan.viewWidth)}" height="${n(plan.viewHeight)}" fill="#ffffff"/>`,
    `<rect x="${n(room.x)}" y="${n(room.y)}" width="${n(room.width)}" height="${n(room.height)}" fill="#f7f7f5"/>`,
  ];
  for (const zone of plan.zones) {
    parts.push(
      `<rect x="${n(zone.x)}" y="${n(zone.y)}" width="${n(zone.width)}" height="${n(zone.height)}" fill="${zoneFill[zone.kind]}" stroke="#555" stroke-width="0.8"/>`,
    );
    if (zone.width >= 14 && zone.height >= 12) {
      parts.push(
        `<text x="${n(zone.x + zone.width / 2)}" y="${n(zone.y + zone.height / 2 + 4)}" text-anchor="middle" font-size="12" font-weight="bold" fill="#1b1b1b" stroke="#ffffff" stroke-width="3" paint-order="stroke">${escape(zone.label)}</text>`,
      );
    }
  }
  parts.push(
    `<rect x="${n(room.x)}" y="${n(room.y)}" width="${n(room.width)}" height="${n(room.height)}" fill="none" stroke="#1b1b1b" stroke-width="3"/>`,
  );
  for (const sky of plan.skylights) {
    parts.push(
      `<rect x="${n(sky.x)}" y="${n(sky.y)}" width="${n(sky.width)}" height="${n(sky.height)}" fill="#ffffff" stroke="#1b1b1b" stroke-width="1.5"/>`,
      `<path d="M${n(sky.x)} ${n(sky.y)} L${n(sky.x + sky.width)} ${n(sky.y + sky.height)} M${n(sky.x + sky.width)} ${n(sky.y)} L${n(sky.x)} ${n(sky.y + sky.height)}" stroke="#1b1b1b" stroke-width="1"/>`,
    );
  }
  for (const opening of plan.windows) {
    const line = `x1="${n(opening.x1)}" y1="${n(opening.y1)}" x2="${n(opening.x2)}" y2="${n(opening.y2)}"`;
    parts.push(`<line ${line} stroke="#1565c0" stroke-width="7"/>`, `<line ${line} stroke="#ffffff" stroke-width="2"/>`);
  }
  const midX = room.x + room.width / 2;
  const midY = room.y + room.height / 2;
  parts.push(
    `<text x="${n(midX)}" y="${n(room.y + room.height + 18)}" text-anchor="middle" font-size="12" fill="#333">${escape(labels.length)}</text>`,
    `<text x="${n(room.x - 14)}" y="${n(midY)}" text-anchor="middle" font-size="12" fill="#333" transform="rotate(-90 ${n(room.x - 14)} ${n(midY)})">${escape(labels.width)}</text>`,
    `<g transform="translate(${n(plan.scaleBar.x)} ${n(plan.scaleBar.y)})"><rect x="0" y="0" width="${n(plan.scaleBar.length / 2)}" height="5" fill="#1b1b1b"/><rect x="${n(plan.scaleBar.length / 2)}" y="0" width="${n(plan.scaleBar.length / 2)}" height="5" fill="#ffffff" stroke="#1b1b1b" stroke-width="1"/><text x="0" y="17" font-size="11" fill="#333">0</text><text x="${n(plan.scaleBar.length)}" y="17" text-anchor="middle" font-size="11" fill="#333">${plan.scaleBar.label} ${escape(labels.unit)}</text></g>`,
    `<g transform="translate(${n(plan.north.x)} ${n(plan.north.y)})"><path d="M0 0 L8 22 L0 17 L-8 22 Z" fill="#1b1b1b"/><text x="0" y="36" text-anchor="middle" font-size="12" font-weight="bold" fill="#1b1b1b">N</text></g>`,
    '</svg>',
  );
  return parts.join('');
}

/** The plan rendered at 1.25 times its drawing size (SVG is read at 72 dpi: density 90), about 800 px wide, sharp enough to print at the page's width. */
export async function planDrawing(input: PlanInput, labels: { length: string; width: string; unit: string }): Promise<PlanDrawing> {
  const plan = planGeometry(input);
  const svg = planSvg(plan, labels);
  const png = await sharp(Buffer.from(svg), { density: 90 }).png({ compressionLevel: 6 }).toBuffer();
  const meta = await sharp(png).metadata();
  return { png, width: meta.width ?? Math.round(plan.viewWidth * 2), height: meta.height ?? Math.round(plan.viewHeight * 2) };
}
