import {
  reviewItemKindLabels,
  reviewItemKinds,
  type ReviewItem,
  type ReviewItemKind,
  type ReviewOutcome,
} from '../../../../../contract/review';

export const outcomeLabels: Record<ReviewOutcome, string> = {
  met: 'Met',
  'not-met': 'Not met',
  'to-verify': 'To verify',
  'not-required': 'Not required',
};

export type ItemGrouping = 'kind' | 'space';

export interface ItemGroup {
  key: string;
  label: string;
  items: ReviewItem[];
}

/**
 * The items in groups: by kind in the order the checks go, or by space in the order of the
 * project's spaces, with the site's exterior items last. Within a group the service's order is
 * kept. An item whose space is no longer among the spaces goes to its own group rather than vanish.
 */
export function groupItems(
  items: readonly ReviewItem[],
  grouping: ItemGrouping,
  spaces: readonly { id: string; name: string }[],
): ItemGroup[] {
  if (grouping === 'kind') {
    return reviewItemKinds
      .map((kind) => ({ key: kind, label: reviewItemKindLabels[kind], items: items.filter((item) => item.kind === kind) }))
      .filter((group) => group.items.length > 0);
  }
  const groups: ItemGroup[] = spaces
    .map((space) => ({ key: space.id, label: space.name, items: items.filter((item) => item.spaceId === space.id) }))
    .filter((group) => group.items.length > 0);
  const known = new Set(spaces.map((space) => space.id));
  const elsewhere = items.filter((item) => item.spaceId && !known.has(item.spaceId));
  if (elsewhere.length > 0) groups.push({ key: 'other-spaces', label: 'Spaces no longer in the design', items: elsewhere });
  const site = items.filter((item) => !item.spaceId);
  if (site.length > 0) groups.push({ key: 'site', label: 'Site', items: site });
  return groups;
}

/** The item j / k (or the arrows) moves to: the next or previous one in the list as shown, staying put at either end. */
export function stepItem(order: readonly ReviewItem[], currentId: string | null, step: 1 | -1): string | null {
  if (order.length === 0) return null;
  const index = order.findIndex((item) => item.id === currentId);
  if (index === -1) return order[step === 1 ? 0 : order.length - 1]!.id;
  return order[Math.min(order.length - 1, Math.max(0, index + step))]!.id;
}

export interface KindCount {
  kind: ReviewItemKind;
  label: string;
  /** Without a verdict in this round. */
  open: number;
  needsRevision: number;
}

/** Per kind, the items still open and those needing revision; kinds with neither are left out. */
export function countsByKind(items: readonly ReviewItem[]): KindCount[] {
  return reviewItemKinds
    .map((kind) => {
      const ofKind = items.filter((item) => item.kind === kind);
      return {
        kind,
        label: reviewItemKindLabels[kind],
        open: ofKind.filter((item) => item.verdict === null).length,
        needsRevision: ofKind.filter((item) => item.verdict === 'needs-revision').length,
      };
    })
    .filter((count) => count.open > 0 || count.needsRevision > 0);
}

/** Whole days since the moment, never below zero (a clock a little ahead of the server's). */
export function ageInDays(since: string, now: Date): number {
  const days = Math.floor((now.getTime() - new Date(since).getTime()) / 86_400_000);
  return Number.isFinite(days) ? Math.max(0, days) : 0;
}
