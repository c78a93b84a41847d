import { foldTypeName, matchTypeName, rememberedNames, searchTypes, type TypeOption } from './space-import-match';

// Rows of IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data (key, label, the edition's own label).
const types: TypeOption[] = [
  {
    key: 'conference-meeting-multipurpose-room',
    label: 'Conference/Meeting/Multipurpose Room',
    sourceLabel: 'Conference/Meeting/Multipurpose Room',
  },
  { key: 'corridor-in-a-hospital', label: 'Corridor — In a Hospital', sourceLabel: 'Corridor | In a Hospital' },
  { key: 'corridor-otherwise', label: 'Corridor — Otherwise', sourceLabel: 'Corridor | Otherwise' },
  { key: 'electrical-mechanical-room', label: 'Electrical/Mechanical Room', sourceLabel: 'Electrical/Mechanical Room' },
  { key: 'office-enclosed', label: 'Office — Enclosed', sourceLabel: 'Office | Enclosed' },
  { key: 'office-open-plan', label: 'Office — Open plan', sourceLabel: 'Office | Open plan' },
  { key: 'restroom-otherwise', label: 'Restroom — Otherwise', sourceLabel: 'Restroom | Otherwise' },
  { key: 'storage-room', label: 'Storage Room', sourceLabel: 'Storage Room' },
  {
    key: 'warehouse-storage-area-for-smaller-hand-carried-items',
    label: 'Warehouse - Storage Area — For Smaller, hand-carried items',
    sourceLabel: 'Warehouse - Storage Area | For Smaller, hand-carried items',
  },
];

const key = (name: string) => matchTypeName(name, types)?.type.key ?? null;

describe('matchTypeName', () => {
  it('takes a key or label as written as an exact match', () => {
    expect(matchTypeName('office-enclosed', types)?.kind).toBe('exact');
    expect(matchTypeName('Storage Room', types)?.kind).toBe('exact');
  });

  it('does not mind case, dashes of any length, spacing or punctuation', () => {
    expect(key('OFFICE - ENCLOSED')).toBe('office-enclosed');
    expect(key('office – enclosed')).toBe('office-enclosed');
    expect(key('Office—Enclosed')).toBe('office-enclosed');
    expect(key('  office ,  enclosed. ')).toBe('office-enclosed');
    expect(key('Office: open-plan')).toBe('office-open-plan');
    expect(matchTypeName('office – enclosed', types)?.kind).toBe('loose');
  });

  it('reads the words in any order, and plurals as the word', () => {
    expect(key('Enclosed office')).toBe('office-enclosed');
    expect(key('Enclosed offices')).toBe('office-enclosed');
  });

  it('reads the common short forms of the list, and the general "Otherwise" row where a word fits several', () => {
    expect(key('Corr')).toBe('corridor-otherwise');
    expect(key('RR')).toBe('restroom-otherwise');
    expect(key('Toilets')).toBe('restroom-otherwise');
    expect(key('Mech')).toBe('electrical-mechanical-room');
    expect(key('Elec rm')).toBe('electrical-mechanical-room');
    expect(key('Mech/Elec')).toBe('electrical-mechanical-room');
    expect(key('Conf')).toBe('conference-meeting-multipurpose-room');
    expect(key('Stor rm')).toBe('storage-room');
    expect(key('Corr — hospital')).toBe('corridor-in-a-hospital');
  });

  it('leaves a name that fits several types and no general row, or none at all, to the engineer', () => {
    expect(key('Office')).toBeNull();
    expect(key('Stor')).toBeNull();
    expect(key('Apparatus bay')).toBeNull();
    expect(key(' — ')).toBeNull();
  });

  it('applies a name remembered for the project before anything else', () => {
    const remembered = rememberedNames([{ name: 'Bunk-Room', spaceType: 'office-enclosed', buildingAreaType: null }], 'spaceType');
    expect(matchTypeName('bunk room', types, remembered)).toMatchObject({ type: { key: 'office-enclosed' }, kind: 'remembered' });
    expect(rememberedNames([{ name: 'Bunk-Room', spaceType: 'office-enclosed', buildingAreaType: null }], 'buildingAreaType').size).toBe(0);
  });
});

describe('foldTypeName', () => {
  it('folds names that differ only in case, dashes, punctuation and short forms to one text', () => {
    expect(foldTypeName('Mech/Elec Rm.')).toBe(foldTypeName('mech – elec rm'));
    expect(foldTypeName('Mech/Elec Rm.')).toBe('mechanical electrical room');
  });
});

describe('searchTypes', () => {
  it('finds the types whose words start with every word typed', () => {
    expect(searchTypes(types, 'stor').map((type) => type.key)).toEqual([
      'storage-room',
      'warehouse-storage-area-for-smaller-hand-carried-items',
    ]);
    expect(searchTypes(types, 'off open').map((type) => type.key)).toEqual(['office-open-plan']);
    expect(searchTypes(types, '')).toHaveLength(types.length);
  });
});
