import type { ZoneKind } from './editions.js';

/** The shape of a room's daylight plan, drawn by the web app's Daylight page and in the submittal package's Word file. */

type DaylightZoneKind = ZoneKind;
type Wall = 'north' | 'east' | 'south' | 'west';
/** An opening as the design holds it: decimal text, a blank position centring it. */
interface WindowOpening {
  wall: Wall;
  width: string;
  offset?: string | undefined;
  /** Read by the engine, not the drawing. */
  headHeight?: string | undefined;
  sillHeight?: string | undefined;
  visibleTransmittance?: string | undefined;
  daylightBlocked?: boolean | undefined;
}
interface Skylight {
  length: string;
  width: string;
  x?: string | undefined;
  y?: string | undefined;
  visibleTransmittance?: string | undefined;
  daylightBlocked?: boolean | undefined;
}
/** A daylight zone as the evaluation gives it. */
interface ZoneRectangleResult {
  kind: DaylightZoneKind;
  source?: string;
  x: string;
  y: string;
  length: string;
  width: string;
}

/**
 * Lays a rectangular room out for an SVG plan. Plan coordinates follow the evaluation: x along the
 * room length (the north and south walls), y along its width, origin at the south-west corner, so
 * north is up. Window offsets run from the west end of north/south walls and the south end of
 * east/west walls; absent offsets and skylight positions centre the opening, as the engine does.
 */
export interface PlanInput {
  length: number;
  width: number;
  windows: readonly WindowOpening[];
  skylights: readonly Skylight[];
  zones: readonly ZoneRectangleResult[];
}

export interface PlanRect {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface PlanZone extends PlanRect {
  kind: DaylightZoneKind;
  label: string;
}

export interface PlanWindow {
  wall: Wall;
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

export interface Plan {
  viewWidth: number;
  viewHeight: number;
  scale: number;
  room: PlanRect;
  zones: PlanZone[];
  windows: PlanWindow[];
  skylights: PlanRect[];
  scaleBar: { x: number; y: number; length: number; label: number };
  north: { x: number; y: number };
}

export const planPadding = { left: 44, right: 64, top: 28, bottom: 56 };
const drawOrder: Record<DaylightZoneKind, number> = { 'secondary-sidelit': 0, 'primary-sidelit': 1, toplit: 2 };
const zoneWords: Record<DaylightZoneKind, [string, string]> = {
  'primary-sidelit': ['Primary', 'P'],
  'secondary-sidelit': ['Secondary', 'S'],
  toplit: ['Toplit', 'T'],
};

function value(text: string | undefined, fallback: number): number {
  if (text === undefined || text.trim() === '') return fallback;
  const number = Number(text);
  return Number.isFinite(number) ? number : fallback;
}

/** A round length for the scale bar: about a quarter of the room, from 1, 2, 5 × 10ⁿ. */
export function scaleBarLength(roomLength: number): number {
  const target = roomLength / 4;
  const power = 10 ** Math.floor(Math.log10(target));
  const steps = [5, 2, 1].map((step) => step * power);
  return steps.find((step) => step <= target) ?? power;
}

export function planGeometry(input: PlanInput, drawingWidth = 560, drawingHeight = 320): Plan {
  const scale = Math.min(drawingWidth / input.length, drawingHeight / input.width);
  const roomWidth = input.length * scale;
  const roomHeight = input.width * scale;
  const left = planPadding.left;
  const top = planPadding.top;
  const toX = (x: number) => left + x * scale;
  const toY = (y: number) => top + (input.width - y) * scale;
  const rect = (x: number, y: number, along: number, across: number): PlanRect => ({
    x: toX(x),
    y: toY(y + across),
    width: along * scale,
    height: across * scale,
  });

  const zones = [...input.zones]
    .sort((a, b) => drawOrder[a.kind] - drawOrder[b.kind])
    .map((zone) => {
      const shape = rect(Number(zone.x), Number(zone.y), Number(zone.length), Number(zone.width));
      const [long, short] = zoneWords[zone.kind];
      return { ...shape, kind: zone.kind, label: shape.width >= 72 && shape.height >= 18 ? long : short };
    });

  const windows = input.windows.map((opening): PlanWindow => {
    const span = value(opening.width, 0);
    const northSouth = opening.wall === 'north' || opening.wall === 'south';
    const wallLength = northSouth ? input.length : input.width;
    const start = value(opening.offset, (wallLength - span) / 2);
    if (northSouth) {
      const y = opening.wall === 'south' ? toY(0) : toY(input.width);
      return { wall: opening.wall, x1: toX(start), y1: y, x2: toX(start + span), y2: y };
    }
    const x = opening.wall === 'west' ? toX(0) : toX(input.length);
    return { wall: opening.wall, x1: x, y1: toY(start), x2: x, y2: toY(start + span) };
  });

  const skylights = input.skylights.map((skylight) => {
    const along = value(skylight.length, 0);
    const across = value(skylight.width, 0);
    return rect(value(skylight.x, (input.length - along) / 2), value(skylight.y, (input.width - across) / 2), along, across);
  });

  const bar = scaleBarLength(input.length);
  return {
    viewWidth: left + roomWidth + planPadding.right,
    viewHeight: top + roomHeight + planPadding.bottom,
    scale,
    room: { x: left, y: top, width: roomWidth, height: roomHeight },
    zones,
    windows,
    skylights,
    scaleBar: { x: left, y: top + roomHeight + 36, length: bar * scale, label: bar },
    north: { x: left + roomWidth + 36, y: top + 8 },
  };
}
