import type { DaylightZoneKind, LuminaireGroup, LuminaireTypeRecord, SpaceRecord } from '../../core/api/api-types';
import { formatWatts, ratedWattsFigure } from '../../shared/format';

export const zoneLabels: Record<DaylightZoneKind | 'none', string> = {
  none: 'None',
  'primary-sidelit': 'Primary sidelit',
  'secondary-sidelit': 'Secondary sidelit',
  toplit: 'Toplit',
};

/** A space's groups as the write body takes them. */
export function groupsOf(space: SpaceRecord): LuminaireGroup[] {
  return space.luminaires.map(({ luminaireTypeId: _type, ...group }) => group);
}

/** The grid's cell: the total count of a tag, or null when the tag is split across daylight zones. */
export function cellCount(space: SpaceRecord, tag: string): { count: string; split: boolean } {
  const groups = space.luminaires.filter((group) => group.tag === tag);
  if (groups.length > 1) return { count: String(groups.reduce((sum, group) => sum + Number(group.count), 0)), split: true };
  return { count: groups[0]?.count ?? '', split: false };
}

/** The groups after setting one tag's count from the grid: 0 or blank removes it; a zone stays. */
export function withCount(groups: readonly LuminaireGroup[], tag: string, count: string): LuminaireGroup[] {
  const text = count.trim();
  const remove = text === '' || Number(text) === 0;
  const index = groups.findIndex((group) => group.tag === tag);
  if (index === -1) return remove ? [...groups] : [...groups, { tag, count: text }];
  if (remove) return groups.filter((group) => group.tag !== tag);
  return groups.map((group, position) => (position === index ? { ...group, count: text } : group));
}

/**
 * What one of a type counts for, beside its count: the rated input of a luminaire, or the rating a
 * track run or limited circuit is counted at (service/src/compliance/installed.ts). A line-voltage
 * track without a limiter counts at least its specified watts: the edition's minimum for its length
 * may count more.
 */
export function eachWords(type: LuminaireTypeRecord): string {
  switch (type.basis) {
    case 'rated':
      return `${ratedWattsFigure(type.inputWatts)} W each`;
    case 'line-voltage-track':
      return type.limitWatts
        ? `${formatWatts(type.limitWatts)} a run (limiter rating)`
        : `at least ${ratedWattsFigure(type.inputWatts)} W a run`;
    case 'low-voltage-track':
      return `${formatWatts(type.limitWatts)} a run (transformer rating)`;
    case 'current-limited':
      return `${formatWatts(type.limitWatts)} a circuit (limiter rating)`;
  }
}
