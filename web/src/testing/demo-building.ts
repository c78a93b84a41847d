import type { SpecDocument } from './evaluate';

/**
 * An invented demo building for the specs of the Results page (not a real project): a library annex
 * on two levels, evaluated under the calculation tests' IECC 2021 edition (`test/calc/fixtures.ts`).
 * Its luminaires, areas and controls are invented; the allowances come from that edition's table:
 * IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data, library reading area
 * 0.96 W/ft² and storage room 0.38 W/ft².
 *
 * - The reading room (Level 1, 1,000 ft²) is within its allowance: 0.96 × 1,000 = 960 W allowed,
 *   20 troffers × 40 W = 800 W installed, and five exit signs left out as exempt lighting. Its time
 *   switch and light-reduction control are provided, so every control requirement is met.
 * - The storage room (Level 2, 500 ft²) is over its own allowance: 0.38 × 500 = 190 W allowed,
 *   6 × 40 W = 240 W installed. It has its occupant sensor, but no light-reduction control: that
 *   requirement is not met (C405.2.3; the installed density 0.48 W/ft² is not below the exception's
 *   0.45 W/ft², WAC 51-11C-405024 as the edition holds it).
 *
 * The building's total stays within the allowance (800 + 240 = 1,040 W of 960 + 190 = 1,150 W), so
 * the verdict "does not comply" rests on the storage room's control alone.
 */

export type SpecSpace = SpecDocument['spaces'][number];
export type SpecLuminaireType = NonNullable<SpecDocument['luminaireTypes']>[number];

/** 40 W troffers for the general lighting, and 5 W exit signs entered as exempt lighting (invented schedule). */
export const troffer: SpecLuminaireType = { tag: 'A', description: 'Troffer', inputWatts: '40', use: 'general' };
export const exitSign: SpecLuminaireType = {
  tag: 'X',
  description: 'Exit sign',
  inputWatts: '5',
  use: 'exempt',
  exemptReason: 'Exit signs',
};

export const readingRoom: SpecSpace = {
  id: 's1',
  name: 'Reading room',
  level: 'Level 1',
  spaceType: 'library-reading',
  area: '1000',
  luminaires: [
    { tag: 'A', count: '20' },
    { tag: 'X', count: '5' },
  ],
  controls: [
    { strategy: 'time-switch', provided: true, device: 'Panel schedule' },
    { strategy: 'light-reduction', provided: true, device: 'Dimmer', reductionPercent: '50' },
  ],
};

export const storageRoom: SpecSpace = {
  id: 's2',
  name: 'Storage',
  level: 'Level 2',
  spaceType: 'storage',
  area: '500',
  luminaires: [{ tag: 'A', count: '6' }],
  controls: [{ strategy: 'occupant-sensor', provided: true, device: 'Ceiling sensor', timeoutMinutes: '15', autoOn: 'manual' }],
};

/** The storage room's light-reduction control provided as well: then every interior control is met. */
export const storageRoomControlled: SpecSpace = {
  ...storageRoom,
  controls: [...(storageRoom.controls ?? []), { strategy: 'light-reduction', provided: true, device: 'Dimmer', reductionPercent: '50' }],
};

/** The library annex with the given spaces (the two above unless told), and any other part of the document. */
export function libraryAnnex(
  spaces: SpecSpace[] = [readingRoom, storageRoom],
  rest: Partial<Omit<SpecDocument, 'spaces'>> = {},
): SpecDocument {
  return {
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    luminaireTypes: [troffer, exitSign],
    ...rest,
    spaces,
  };
}
