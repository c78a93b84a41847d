import { ChangeDetectionStrategy, Component, computed, effect, input, signal, viewChild } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import type { SpaceResult, UnitSystem, UnverifiedValue } from '../../core/api/api-types';
import { spaceAllowanceStatus, type SpaceAllowanceStatus } from '../../shared/allowance-status';
import { areaFigure, densityFigure, percentFigure, unitLabels, wattsFigure } from '../../shared/format';
import { InUnits } from '../../shared/in-units';
import { VerifyBadge } from '../../shared/verify-badge';
import { CardRows } from '../../shared/card-rows';

export interface SpaceRow {
  space: SpaceResult;
  status: SpaceAllowanceStatus;
  /** What the space's figures rest on that is not checked, each with its short citation. */
  unverifiedNote: string | null;
}

/**
 * The unverified values behind a row's figures (allowance and installed power): control and
 * daylight values belong to the Controls and Daylight pages, which mark them there.
 */
function figureValues(space: SpaceResult, byId: ReadonlyMap<string, UnverifiedValue>): UnverifiedValue[] {
  return space.unverified
    .map((id) => byId.get(id))
    .filter((value): value is UnverifiedValue => value !== undefined)
    .filter(
      (value) =>
        !value.what.startsWith('Control strategy:') && !value.what.startsWith('Daylight ') && !value.what.startsWith(`${space.name}: `),
    );
}

/** `values` is the result's `unverifiedValues`, which the spaces name by id. */
export function spaceRows(spaces: readonly SpaceResult[], values: readonly UnverifiedValue[]): SpaceRow[] {
  const byId = new Map(values.map((value) => [value.id, value]));
  return spaces.map((space) => {
    const values = figureValues(space, byId);
    return {
      space,
      status: spaceAllowanceStatus(space),
      unverifiedNote: values.length === 0 ? null : values.map((value) => `${value.what}: ${value.citation.short}`).join(' · '),
    };
  });
}

/** Sorted by status, the spaces that need the engineer come first. */
const statusOrder: Record<SpaceAllowanceStatus['kind'], number> = { over: 0, 'none-entered': 1, within: 2, unlit: 3 };

const numericColumns: Record<string, (space: SpaceResult) => string | null> = {
  area: (space) => space.area,
  allowedLpd: (space) => space.allowedLpd,
  installedLpd: (space) => space.installedLpd,
  allowanceW: (space) => space.allowanceW,
  installedW: (space) => space.installedW,
  marginW: (space) => space.marginW,
  marginPct: (space) => space.marginPct,
};

/** Each space's allowance, installed power, LPDs, margin and status; sortable, and filterable to the spaces over allowance. */
@Component({
  selector: 'al-space-results-table',
  imports: [
    CardRows,
    MatTableModule,
    MatSortModule,
    MatSlideToggleModule,
    MatFormFieldModule,
    MatInputModule,
    MatIconModule,
    FormsModule,
    VerifyBadge,
    InUnits,
  ],
  templateUrl: './space-results-table.html',
  styleUrl: './space-results-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpaceResultsTable {
  readonly spaces = input.required<readonly SpaceResult[]>();
  /** The result's unverified values, which each space names by id. */
  readonly unverifiedValues = input<readonly UnverifiedValue[]>([]);
  readonly units = input<UnitSystem>('ip');
  readonly updating = input(false);

  protected readonly overOnly = signal(false);
  protected readonly search = signal('');
  protected readonly labels = computed(() => unitLabels(this.units()));
  protected readonly figures = { watts: wattsFigure, density: densityFigure, percent: percentFigure, area: areaFigure };
  protected readonly columns = [
    'name',
    'level',
    'area',
    'allowedLpd',
    'installedLpd',
    'allowanceW',
    'installedW',
    'marginW',
    'marginPct',
    'status',
  ];
  protected readonly overCount = computed(() => this.spaces().filter((space) => spaceAllowanceStatus(space).over).length);

  protected readonly dataSource = new MatTableDataSource<SpaceRow>([]);
  private readonly sort = viewChild(MatSort);

  constructor() {
    this.dataSource.sortingDataAccessor = (row, column) => {
      const numeric = numericColumns[column];
      // A margin without luminaires means nothing: those rows sort with the empty ones.
      if (numeric)
        return !row.status.hasMargin && column.startsWith('margin')
          ? Number.NEGATIVE_INFINITY
          : Number(numeric(row.space) ?? Number.NEGATIVE_INFINITY);
      if (column === 'level') return row.space.level ?? '';
      if (column === 'status') return statusOrder[row.status.kind];
      return row.space.name;
    };
    this.dataSource.filterPredicate = (row, filter) => {
      const { overOnly, text } = JSON.parse(filter) as { overOnly: boolean; text: string };
      if (overOnly && !row.status.over) return false;
      return text === '' || `${row.space.name} ${row.space.level ?? ''} ${row.space.lpdBasis.label}`.toLowerCase().includes(text);
    };
    effect(() => {
      this.dataSource.data = spaceRows(this.spaces(), this.unverifiedValues());
    });
    effect(() => {
      this.dataSource.filter = JSON.stringify({ overOnly: this.overOnly(), text: this.search().trim().toLowerCase() });
    });
    effect(() => {
      const sort = this.sort();
      if (sort) this.dataSource.sort = sort;
    });
  }
}
