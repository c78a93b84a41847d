import type { ImportAlias } from '../../core/api/api-types';

/**
 * Short forms that room schedules commonly use for words of the code tables' type names (common
 * practice). Kept small on purpose: a short form that could mean two things belongs to the
 * engineer's own matching in the import dialog, which the project then remembers.
 */
export const typeNameAbbreviations: Readonly<Record<string, string>> = {
  corr: 'corridor',
  rr: 'restroom',
  toilet: 'restroom',
  mech: 'mechanical',
  elec: 'electrical',
  conf: 'conference',
  stor: 'storage',
  rm: 'room',
};

/** A type of a code table, as the import matches names against it. */
export interface TypeOption {
  key: string;
  label: string;
  sourceLabel: string;
}

/** How a name found its type: the same words, loosely (order, abbreviations), remembered for the project, or chosen now. */
export type MatchKind = 'exact' | 'loose' | 'remembered' | 'chosen';

export interface TypeMatch<T extends TypeOption> {
  type: T;
  kind: MatchKind;
}

/** The words of a name: case, dashes of every length, punctuation and spacing do not count; plurals and short forms fold to one word. */
export function nameWords(name: string): string[] {
  return name
    .normalize('NFKC')
    .toLocaleLowerCase()
    .replace(/&/g, ' and ')
    .split(/[^\p{L}\p{N}]+/u)
    .filter(Boolean)
    .map((word) => (word.length > 3 && word.endsWith('s') && !word.endsWith('ss') ? word.slice(0, -1) : word))
    .map((word) => typeNameAbbreviations[word] ?? word);
}

/** One text per name, for comparing and for remembering: "Mech/Elec Rm." and "mech – elec rm" fold alike. */
export function foldTypeName(name: string): string {
  return nameWords(name).join(' ');
}

function sameWords(a: readonly string[], b: readonly string[]): boolean {
  return a.length === b.length && [...a].sort().join(' ') === [...b].sort().join(' ');
}

function optionWords(type: TypeOption): string[][] {
  return [nameWords(type.key), nameWords(type.label), nameWords(type.sourceLabel)];
}

/**
 * The type a spreadsheet's name means, or null when it is not clear. In order: a name the project
 * remembered; a key or label as written; the same words, in any order, once folded; the words of
 * exactly one type, or of several where exactly one is the table's general ("Otherwise") row.
 */
export function matchTypeName<T extends TypeOption>(
  name: string,
  types: readonly T[],
  remembered: ReadonlyMap<string, string> = new Map(),
): TypeMatch<T> | null {
  const words = nameWords(name);
  if (words.length === 0) return null;
  const rememberedKey = remembered.get(words.join(' '));
  const known = rememberedKey === undefined ? undefined : types.find((type) => type.key === rememberedKey);
  if (known) return { type: known, kind: 'remembered' };
  const plain = name.trim().toLocaleLowerCase();
  const exact = types.find((type) => [type.key, type.label, type.sourceLabel].some((text) => text.toLocaleLowerCase() === plain));
  if (exact) return { type: exact, kind: 'exact' };
  const reordered = types.find((type) => optionWords(type).some((candidate) => sameWords(candidate, words)));
  if (reordered) return { type: reordered, kind: 'loose' };
  const containing = types.filter((type) => optionWords(type).some((candidate) => words.every((word) => candidate.includes(word))));
  if (containing.length === 1) return { type: containing[0]!, kind: 'loose' };
  const general = containing.filter((type) => nameWords(type.label).includes('otherwise'));
  if (general.length === 1) return { type: general[0]!, kind: 'loose' };
  return null;
}

/** The remembered names of one kind, folded, to the type each was matched to. */
export function rememberedNames(aliases: readonly ImportAlias[], kind: 'spaceType' | 'buildingAreaType'): Map<string, string> {
  const names = new Map<string, string>();
  for (const alias of aliases) {
    const key = alias[kind];
    if (key) names.set(foldTypeName(alias.name), key);
  }
  return names;
}

/** The types whose words start with every word typed, for the dialog's list (the table's order kept). */
export function searchTypes<T extends TypeOption>(types: readonly T[], query: string): T[] {
  const typed = nameWords(query);
  if (typed.length === 0) return [...types];
  return types.filter((type) => {
    const words = optionWords(type).flat();
    return typed.every((word) => words.some((candidate) => candidate.startsWith(word)));
  });
}
