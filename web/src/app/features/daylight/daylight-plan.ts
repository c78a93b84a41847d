import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { DaylightZoneKind, Skylight, UnitSystem, WindowOpening, ZoneRectangleResult } from '../../core/api/api-types';
import { formatLength } from '../../shared/format';
import { planGeometry } from './plan-geometry';

let nextPlanId = 0;

export const zoneNames: Record<DaylightZoneKind, string> = {
  'primary-sidelit': 'Primary sidelit zone',
  'secondary-sidelit': 'Secondary sidelit zone',
  toplit: 'Toplit zone',
};

/** The room to scale, north up: walls, windows on their walls, skylights, and the daylight zones in fills, patterns and labels. */
@Component({
  selector: 'al-daylight-plan',
  templateUrl: './daylight-plan.html',
  styleUrl: './daylight-plan.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DaylightPlan {
  readonly name = input('');
  readonly length = input.required<number>();
  readonly width = input.required<number>();
  readonly windows = input<readonly WindowOpening[]>([]);
  readonly skylights = input<readonly Skylight[]>([]);
  readonly zones = input<readonly ZoneRectangleResult[]>([]);
  readonly units = input<UnitSystem>('ip');

  protected readonly id = `plan-${nextPlanId++}`;
  protected readonly legend = [
    { kind: 'primary-sidelit', pattern: 'primary', name: zoneNames['primary-sidelit'], short: 'P' },
    { kind: 'secondary-sidelit', pattern: 'secondary', name: zoneNames['secondary-sidelit'], short: 'S' },
    { kind: 'toplit', pattern: 'toplit', name: zoneNames.toplit, short: 'T' },
  ] as const;
  protected readonly plan = computed(() =>
    planGeometry({ length: this.length(), width: this.width(), windows: this.windows(), skylights: this.skylights(), zones: this.zones() }),
  );
  protected readonly unit = computed(() => (this.units() === 'ip' ? 'ft' : 'm'));
  protected readonly lengthLabel = computed(() => formatLength(String(this.length()), this.units()));
  protected readonly widthLabel = computed(() => formatLength(String(this.width()), this.units()));
  protected readonly description = computed(() => {
    const walls = this.windows().map((opening) => opening.wall);
    const byWall = ['north', 'east', 'south', 'west']
      .map((wall) => ({ wall, count: walls.filter((each) => each === wall).length }))
      .filter((entry) => entry.count > 0)
      .map((entry) => `${entry.count} on the ${entry.wall} wall`);
    const kinds = [...new Set(this.zones().map((zone) => zone.kind))].map((kind) => zoneNames[kind].toLowerCase());
    return [
      `Plan of ${this.name() || 'the room'}, ${this.lengthLabel()} east to west by ${this.widthLabel()} north to south, north up.`,
      byWall.length ? `Windows: ${byWall.join(', ')}.` : 'No windows.',
      this.skylights().length ? `${this.skylights().length} skylight${this.skylights().length === 1 ? '' : 's'}.` : '',
      kinds.length ? `Shaded: ${kinds.join(', ')}.` : 'No daylight zones.',
    ]
      .filter(Boolean)
      .join(' ');
  });
}
