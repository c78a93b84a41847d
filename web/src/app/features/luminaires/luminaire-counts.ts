import type { DaylightZoneKind, LuminaireGroup, SpaceRecord } from '../../core/api/api-types';

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
