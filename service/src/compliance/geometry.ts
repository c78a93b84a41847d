import type { EditionRules } from './edition-data.js';
import { type Dec, ZERO, dec, max, min, sum } from './numbers.js';

/**
 * Room cavity ratio, IES Lighting Handbook zonal-cavity method: RCR = 2.5 × h × P ÷ A, with h the
 * room cavity height (luminaires above the work plane), P the room perimeter and A its area.
 */
export function roomCavityRatio(cavityHeight: Dec, perimeter: Dec, area: Dec): Dec {
  return dec('2.5').times(cavityHeight).times(perimeter).dividedBy(area);
}

/** The rectangle form of the same definition: RCR = 5 × h × (L + W) ÷ (L × W). */
export function rectangularRoomCavityRatio(cavityHeight: Dec, length: Dec, width: Dec): Dec {
  return dec(5).times(cavityHeight).times(length.plus(width)).dividedBy(length.times(width));
}

import type { ZoneKind } from '../../../contract/editions.js';

export type { ZoneKind } from '../../../contract/editions.js';

/** An axis-aligned rectangle in plan, feet, origin at the room's south-west corner. */
export interface PlanRectangle {
  x0: Dec;
  y0: Dec;
  x1: Dec;
  y1: Dec;
}

export interface ZoneRectangle extends PlanRectangle {
  kind: ZoneKind;
  /** Which opening made it, e.g. "windows.0". */
  source: string;
}

export interface RoomPlan {
  length: Dec;
  width: Dec;
  ceilingHeight?: Dec;
  windows: { width: Dec; headHeight: Dec; offset?: Dec; wall: 'north' | 'east' | 'south' | 'west' }[];
  skylights: { length: Dec; width: Dec; x?: Dec; y?: Dec }[];
}

export interface ZoneAreas {
  primarySidelit: Dec;
  secondarySidelit: Dec;
  toplit: Dec;
  rectangles: ZoneRectangle[];
}

function clip(rectangle: PlanRectangle, room: RoomPlan): PlanRectangle | null {
  const clipped = {
    x0: max(rectangle.x0, ZERO),
    y0: max(rectangle.y0, ZERO),
    x1: min(rectangle.x1, room.length),
    y1: min(rectangle.y1, room.width),
  };
  return clipped.x1.greaterThan(clipped.x0) && clipped.y1.greaterThan(clipped.y0) ? clipped : null;
}

/**
 * The sidelit bands of one window: a band from `near` to `far` head heights into the room, as
 * wide as the window plus the side extension each way. Clipping to the room stands for "or the
 * distance to a wall", which the code gives as the lesser of the two.
 */
function sidelitBand(window: RoomPlan['windows'][number], room: RoomPlan, extension: Dec, near: Dec, far: Dec): PlanRectangle | null {
  const alongX = window.wall === 'north' || window.wall === 'south';
  const wallLength = alongX ? room.length : room.width;
  const offset = window.offset ?? wallLength.minus(window.width).dividedBy(2);
  const start = offset.minus(extension);
  const end = offset.plus(window.width).plus(extension);
  const depthNear = near.times(window.headHeight);
  const depthFar = far.times(window.headHeight);
  const roomDepth = alongX ? room.width : room.length;
  const [inner, outer] =
    window.wall === 'south' || window.wall === 'west' ? [depthNear, depthFar] : [roomDepth.minus(depthFar), roomDepth.minus(depthNear)];
  const rectangle = alongX ? { x0: start, x1: end, y0: inner, y1: outer } : { x0: inner, x1: outer, y0: start, y1: end };
  return clip(rectangle, room);
}

export function zoneRectangles(room: RoomPlan, rules: EditionRules['daylight']): ZoneRectangle[] {
  const rectangles: ZoneRectangle[] = [];
  const primaryDepth = dec(rules.primaryDepthHeadHeights);
  const secondaryDepth = dec(rules.secondaryDepthHeadHeights);
  room.windows.forEach((window, index) => {
    const extension =
      rules.sideExtension.kind === 'head-height-fraction'
        ? dec(rules.sideExtension.fraction).times(window.headHeight)
        : dec(rules.sideExtension.feet);
    const primary = sidelitBand(window, room, extension, ZERO, primaryDepth);
    if (primary) rectangles.push({ ...primary, kind: 'primary-sidelit', source: `windows.${index}` });
    const secondary = sidelitBand(window, room, extension, primaryDepth, secondaryDepth);
    if (secondary) rectangles.push({ ...secondary, kind: 'secondary-sidelit', source: `windows.${index}` });
  });
  room.skylights.forEach((skylight, index) => {
    const reach = dec(rules.toplitExtensionCeilingHeights).times(room.ceilingHeight ?? ZERO);
    const x = skylight.x ?? room.length.minus(skylight.length).dividedBy(2);
    const y = skylight.y ?? room.width.minus(skylight.width).dividedBy(2);
    const toplit = clip(
      { x0: x.minus(reach), y0: y.minus(reach), x1: x.plus(skylight.length).plus(reach), y1: y.plus(skylight.width).plus(reach) },
      room,
    );
    if (toplit) rectangles.push({ ...toplit, kind: 'toplit', source: `skylights.${index}` });
  });
  return rectangles;
}

/** Where an edition's data gives no order: the area under a skylight is not also sidelit; a primary band is never someone else's secondary band. */
export const defaultPrecedence: ZoneKind[] = ['toplit', 'primary-sidelit', 'secondary-sidelit'];

function contains(rectangle: PlanRectangle, x: Dec, y: Dec): boolean {
  return x.greaterThan(rectangle.x0) && x.lessThan(rectangle.x1) && y.greaterThan(rectangle.y0) && y.lessThan(rectangle.y1);
}

function breakpoints(values: Dec[]): Dec[] {
  const sorted = [...values].sort((a, b) => a.comparedTo(b));
  return sorted.filter((value, index) => index === 0 || !value.equals(sorted[index - 1]!));
}

/**
 * Daylight areas without double counting. Overlapping zones count once, in the zone that takes
 * precedence, in the order the edition's data gives (or {@link defaultPrecedence}). The plan is
 * cut into cells at every rectangle edge and each cell is given to one zone. `keep` leaves out the
 * zones an edition's glazing rules take away (a blocked window's primary band, a skylight of low
 * transmittance): their floor goes to whichever other zone reaches it.
 */
export function daylightAreas(
  room: RoomPlan,
  rules: EditionRules['daylight'],
  keep: (rectangle: ZoneRectangle) => boolean = () => true,
): ZoneAreas {
  const precedence = rules.overlapPrecedence ?? defaultPrecedence;
  const rectangles = zoneRectangles(room, rules).filter(keep);
  const xs = breakpoints(rectangles.flatMap((rectangle) => [rectangle.x0, rectangle.x1]));
  const ys = breakpoints(rectangles.flatMap((rectangle) => [rectangle.y0, rectangle.y1]));
  const totals: Record<ZoneKind, Dec[]> = { toplit: [], 'primary-sidelit': [], 'secondary-sidelit': [] };
  for (let i = 0; i + 1 < xs.length; i++) {
    for (let j = 0; j + 1 < ys.length; j++) {
      const midX = xs[i]!.plus(xs[i + 1]!).dividedBy(2);
      const midY = ys[j]!.plus(ys[j + 1]!).dividedBy(2);
      const kind = precedence.find((candidate) =>
        rectangles.some((rectangle) => rectangle.kind === candidate && contains(rectangle, midX, midY)),
      );
      if (kind) totals[kind].push(xs[i + 1]!.minus(xs[i]!).times(ys[j + 1]!.minus(ys[j]!)));
    }
  }
  return {
    primarySidelit: sum(totals['primary-sidelit']),
    secondarySidelit: sum(totals['secondary-sidelit']),
    toplit: sum(totals.toplit),
    rectangles,
  };
}
