import { ScrollingModule } from '@angular/cdk/scrolling';
import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { BuildingAreaTypeView, ComplianceMethod, SpaceRecord, SpaceResult, SpaceTypeView, UnitSystem } from '../../core/api/api-types';
import { formatArea, formatLength, formatWatts, unitLabels } from '../../shared/format';
import { phoneScreen, printing, screenMatches } from '../../shared/media-queries';
import { inProjectUnits } from '../../shared/unit-words';
import { VerifyBadge } from '../../shared/verify-badge';
import { groupByLevel, spaceStatus, type SpaceRow, type SpaceStatus } from './space-rows';
import { RevisionMarker } from '../../shared/revision-marker';

/** Row height in px; the virtual scroll needs it fixed. */
export const spaceRowHeight = 48;
/** The same for a space's card on a phone: name, type, figures and a status of up to two lines. */
export const spaceCardHeight = 136;

/** The project's spaces grouped by level, in one virtual-scrolled list that stays smooth at thousands of rows. */
@Component({
  selector: 'al-space-table',
  imports: [
    NgTemplateOutlet,
    ScrollingModule,
    MatButtonModule,
    MatIconModule,
    MatMenuModule,
    MatTooltipModule,
    VerifyBadge,
    RevisionMarker,
  ],
  templateUrl: './space-table.html',
  styleUrl: './space-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpaceTable {
  readonly spaces = input.required<readonly SpaceRecord[]>();
  readonly results = input.required<ReadonlyMap<string, SpaceResult>>();
  /** The project's results state: no verdict is shown unless it is `ready`. */
  readonly resultsStatus = input.required<string>();
  readonly method = input<ComplianceMethod>('space-by-space');
  readonly units = input<UnitSystem>('ip');
  readonly spaceTypes = input<readonly SpaceTypeView[]>([]);
  readonly buildingAreaTypes = input<readonly BuildingAreaTypeView[]>([]);
  readonly canEdit = input(false);
  /** Per space, its check items that need revision in the present round. */
  readonly revisions = input<ReadonlyMap<string, number>>(new Map());

  readonly edit = output<SpaceRecord>();
  readonly duplicate = output<SpaceRecord>();
  readonly remove = output<SpaceRecord>();

  protected readonly rows = computed(() => groupByLevel(this.spaces()));
  protected readonly labels = computed(() => unitLabels(this.units()));
  /** The template names the unit labels `units`; the badge takes the system itself. */
  protected readonly unitSystem = computed(() => this.units());
  private readonly typeViews = computed(() => {
    const types: readonly (SpaceTypeView | BuildingAreaTypeView)[] =
      this.method() === 'building-area' ? this.buildingAreaTypes() : this.spaceTypes();
    return new Map(types.map((type) => [type.key, type]));
  });

  protected readonly trackRow = (_index: number, row: SpaceRow) => row.id;

  /** A phone shows each space as a card of its name, type, figures and status, taller than a table row. */
  protected readonly phone = screenMatches(phoneScreen);
  protected readonly rowHeight = computed(() => (this.phone() ? spaceCardHeight : spaceRowHeight));
  protected readonly printing = printing();

  protected typeView(space: SpaceRecord): SpaceTypeView | BuildingAreaTypeView | undefined {
    const key = this.method() === 'building-area' ? space.buildingAreaType : space.spaceType;
    return key ? this.typeViews().get(key) : undefined;
  }

  /** A template's context has no type of its own: this gives the row its type back at the template's edge. */
  protected asRow(row: SpaceRow): SpaceRow {
    return row;
  }

  protected typeLabel(space: SpaceRecord): string {
    const key = this.method() === 'building-area' ? space.buildingAreaType : space.spaceType;
    if (!key) return '—';
    // A type the edition does not have (kept from another edition) is named as such, never by its key.
    return inProjectUnits(this.typeViews().get(key)?.label ?? 'A type this edition does not have', this.units());
  }

  /** How many like rooms the entry stands for, in words, where it is more than one. */
  protected roomCount(space: SpaceRecord): string | null {
    const rooms = Number(space.rooms ?? '1');
    return rooms > 1 ? rooms.toLocaleString('en-US') : null;
  }

  protected area(value: string | number): string {
    return formatArea(String(value), this.units()).replace(/ (ft²|m²)$/, '');
  }

  protected length(value: string | undefined): string {
    return formatLength(value, this.units()).replace(/ (ft|m)$/, '');
  }

  protected dimensions(space: SpaceRecord): string {
    if (!space.length && !space.width && !space.ceilingHeight) return '—';
    return `${this.length(space.length)} × ${this.length(space.width)} × ${this.length(space.ceilingHeight)}`;
  }

  protected watts(value: string | undefined): string {
    return formatWatts(value).replace(/ W$/, '');
  }

  protected result(space: SpaceRecord): SpaceResult | undefined {
    return this.results().get(space.id);
  }

  protected statusText(status: SpaceStatus): string {
    switch (status.kind) {
      case 'within':
        return `Within allowance, ${status.words}`;
      case 'over':
        return `Over allowance ${status.words}`;
      case 'none-entered':
        return 'No luminaires entered: enter them, or confirm the space is unlit';
      case 'unlit':
        return 'Unlit (confirmed)';
      case 'updating':
        return 'Updating…';
      default:
        return 'Not evaluated';
    }
  }

  protected status(space: SpaceRecord): SpaceStatus {
    return spaceStatus(this.results().get(space.id), this.resultsStatus());
  }
}
