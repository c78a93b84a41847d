import type { EditionId } from '../core/api/api-types';

/** Each code edition in a few words, as lists and column headings name it. */
export const editionLabels: Readonly<Record<EditionId, string>> = {
  'iecc-2018': 'IECC 2018',
  'iecc-2021': 'IECC 2021',
  'iecc-2024': 'IECC 2024',
  'ashrae-90.1-2013': '90.1-2013',
  'ashrae-90.1-2016': '90.1-2016',
  'ashrae-90.1-2019': '90.1-2019',
  'ashrae-90.1-2022': '90.1-2022',
};

/** An edition's short name; one the app does not know yet goes by the title the service gives it. */
export function editionLabel(edition: string, title = edition): string {
  return editionLabels[edition as EditionId] ?? title;
}
