import ExcelJS from 'exceljs';
import type { BuildingAreaTypeView, SpaceTypeView } from '../../core/api/api-types';
import {
  aliasesToRemember,
  attachServerProblems,
  buildRows,
  buildTypeRows,
  guessMapping,
  guessTypeMapping,
  parseCsv,
  parseXlsx,
  templateCsv,
  templateXlsx,
  unknownNames,
  type ImportContext,
} from './space-import';

// IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data: office enclosed 0.74 W/ft², storage room 0.38 W/ft².
const spaceTypes = [
  {
    key: 'office-enclosed',
    label: 'Office — Enclosed',
    sourceLabel: 'Office | Enclosed',
    category: 'common',
    lpdWPerFt2: '0.74',
    verified: true,
  },
  { key: 'storage-room', label: 'Storage Room', sourceLabel: 'Storage Room', category: 'common', lpdWPerFt2: '0.38', verified: true },
] as SpaceTypeView[];
// IECC 2021 Table C405.3.2(1), via PNNL building-energy-standards-data: automotive facility 0.75 W/ft².
const buildingAreaTypes = [
  { key: 'automotive-facility', label: 'Automotive facility', sourceLabel: 'Automotive facility', lpdWPerFt2: '0.75', verified: true },
] as BuildingAreaTypeView[];
const bySpace: ImportContext = { method: 'space-by-space', spaceTypes, buildingAreaTypes };

describe('guessMapping', () => {
  it('matches headers by name, alias and unit-decorated text, each field once', () => {
    expect(guessMapping(['Room name', 'Floor', 'Space type', 'Area (ft²)', 'Ceiling height', 'Notes'])).toEqual([
      'name',
      'level',
      'spaceType',
      'area',
      'ceilingHeight',
      null,
    ]);
    expect(guessMapping(['Name', 'Name', 'SF'])).toEqual(['name', null, 'area']);
  });

  it('reads a plain "Type" column as the building area type under the building area method', () => {
    expect(guessMapping(['Name', 'Type', 'Area'], 'building-area')).toEqual(['name', 'buildingAreaType', 'area']);
  });
});

describe('buildRows', () => {
  const header = ['Name', 'Level', 'Space type', 'Area'];

  it('resolves space types by key or by label and keeps the sheet line', () => {
    const rows = buildRows(
      [header, ['Office 1', 'Level 1', 'office-enclosed', '120'], ['Store', '', 'storage room', '40']],
      guessMapping(header),
      bySpace,
    );
    expect(rows.map((row) => row.problems)).toEqual([[], []]);
    expect(rows[0]!.space).toMatchObject({ name: 'Office 1', level: 'Level 1', spaceType: 'office-enclosed', area: '120' });
    expect(rows[1]!.space.spaceType).toBe('storage-room');
    expect(rows[1]!.line).toBe(3);
  });

  it('gives each row the problems the service would find', () => {
    const rows = buildRows(
      [
        header,
        ['', 'L1', 'office-enclosed', '10'],
        ['Lab', 'L1', 'laboratory-ish', '0'],
        ['Hall', 'L1', 'storage-room', 'ten'],
        ['Nook', 'L1', '', '-3'],
      ],
      guessMapping(header),
      bySpace,
    );
    expect(rows[0]!.problems).toEqual([{ field: 'name', message: 'A name is required.' }]);
    expect(rows[1]!.problems.map((problem) => problem.message)).toEqual([
      'Floor area: Out of range. Enter a number greater than 0 and at most 5,000,000.',
      'No space type is called “laboratory-ish”: choose the type it means above.',
    ]);
    expect(rows[2]!.problems.map((problem) => problem.message)).toEqual([
      'Floor area: “ten” is not a number. Enter a number greater than 0 and at most 5,000,000.',
    ]);
    expect(rows[3]!.problems.map((problem) => problem.field)).toEqual(['area', 'spaceType']);
  });

  it('under the building area method needs a building area type and keeps the space type, which sets the controls', () => {
    const columns = ['Name', 'Building area type', 'Space type', 'Area'];
    const [row] = buildRows([columns, ['Bay', 'Automotive facility', 'storage-room', '500']], guessMapping(columns, 'building-area'), {
      ...bySpace,
      method: 'building-area',
    });
    expect(row!.problems).toEqual([]);
    expect(row!.space).toMatchObject({ buildingAreaType: 'automotive-facility', spaceType: 'storage-room' });
    expect(row!.space.controlSpaceType).toBeUndefined();
    const [missing] = buildRows([columns, ['Bay', '', 'storage-room', '500']], guessMapping(columns, 'building-area'), {
      ...bySpace,
      method: 'building-area',
    });
    expect(missing!.problems.map((problem) => problem.message)).toEqual(['The building area method needs a building area type.']);
  });

  it('keeps a building area type column under the space-by-space method too, for the other method', () => {
    const columns = ['Name', 'Space type', 'Building area type', 'Area'];
    const [row] = buildRows([columns, ['Bay', 'Storage room', 'automotive facility', '500']], guessMapping(columns), bySpace);
    expect(row!.problems).toEqual([]);
    expect(row!.space).toMatchObject({ spaceType: 'storage-room', buildingAreaType: 'automotive-facility' });
  });

  it('matches type names loosely, and says which names are left for the engineer to match', () => {
    const rows = buildRows(
      [
        header,
        ['A', '', 'OFFICE – enclosed', '1'],
        ['B', '', 'Enclosed office', '1'],
        ['C', '', 'Stor Rm.', '1'],
        ['D', '', 'Bunk room', '1'],
        ['E', '', 'bunk-room', '1'],
      ],
      guessMapping(header),
      bySpace,
    );
    expect(rows.map((row) => row.space.spaceType)).toEqual(['office-enclosed', 'office-enclosed', 'storage-room', undefined, undefined]);
    expect(rows.map((row) => row.matches.spaceType?.kind)).toEqual(['loose', 'loose', 'loose', undefined, undefined]);
    expect(unknownNames(rows)).toEqual([{ kind: 'spaceType', name: 'Bunk room', rows: 2 }]);
  });

  it('applies the names the project remembered and those chosen in the dialog', () => {
    const rows = buildRows([header, ['A', '', 'Bunk room', '1'], ['B', '', 'Apparatus bay', '1']], guessMapping(header), {
      ...bySpace,
      aliases: [{ name: 'bunk-room', spaceType: 'office-enclosed', buildingAreaType: null }],
      chosen: { spaceType: new Map([['apparatu bay', 'storage-room']]), buildingAreaType: new Map() },
    });
    expect(rows.map((row) => [row.space.spaceType, row.matches.spaceType?.kind])).toEqual([
      ['office-enclosed', 'remembered'],
      ['storage-room', 'chosen'],
    ]);
  });

  it('reads count columns headed by a tag, and refuses counts that are not whole numbers in range', () => {
    const columns = ['Name', 'Space type', 'Area', 'A1', 'B2 (no.)'];
    const mapping = guessMapping(columns, 'space-by-space', ['A1', 'B2']);
    expect(mapping).toEqual(['name', 'spaceType', 'area', 'count:A1', 'count:B2']);
    const context = { ...bySpace, tags: new Set(['A1', 'B2']) };
    const [good, bad] = buildRows(
      [columns, ['Office 1', 'office-enclosed', '120', '4', '0'], ['Office 2', 'office-enclosed', '120', '2.5', '-1']],
      mapping,
      context,
    );
    expect(good!.space.luminaires).toEqual([{ tag: 'A1', count: '4' }]);
    expect(bad!.problems.map((problem) => problem.message)).toEqual([
      'Count of A1: Must be a whole number. Enter a whole number from 0 to 1,000,000.',
      'Count of B2: Must not be negative. Enter a whole number from 0 to 1,000,000.',
    ]);
  });

  it("puts the service's 400 paths on the rows they name", () => {
    const rows = buildRows([header, ['A', '', 'office-enclosed', '1'], ['B', '', 'office-enclosed', '2']], guessMapping(header), bySpace);
    const marked = attachServerProblems(rows, [{ path: 'spaces.1.area', message: 'Must be greater than zero.' }]);
    expect(marked[0]!.problems).toEqual([]);
    expect(marked[1]!.problems).toEqual([{ field: 'area', message: 'Must be greater than zero.' }]);
  });
});

describe('parsing files', () => {
  it('reads CSV with quoted cells, a byte-order mark and blank lines', () => {
    expect(parseCsv('\uFEFFName,Area\n"Office, north",120\n\n,\nStore,40\n')).toEqual([
      ['Name', 'Area'],
      ['Office, north', '120'],
      ['Store', '40'],
    ]);
  });

  it('reads every sheet of an .xlsx, numbers and formulas as text', async () => {
    const workbook = new ExcelJS.Workbook();
    const sheet = workbook.addWorksheet('Rooms');
    sheet.addRow(['Name', 'Level', 'Area']);
    sheet.addRow(['Office 1', 'Level 1', 120]);
    sheet.addRow(['Office 2', null, { formula: '10*12', result: 120 }]);
    workbook.addWorksheet('Types').addRow(['Tag', 'Watts']);
    const buffer = (await workbook.xlsx.writeBuffer()) as ArrayBuffer;

    expect(await parseXlsx(buffer)).toEqual([
      {
        name: 'Rooms',
        table: [
          ['Name', 'Level', 'Area'],
          ['Office 1', 'Level 1', '120'],
          ['Office 2', '', '120'],
        ],
      },
      { name: 'Types', table: [['Tag', 'Watts']] },
    ]);
  });

  it('offers a workbook template whose second sheet reads as luminaire types counted on the first', async () => {
    const [spacesSheet, typesSheet] = await parseXlsx(await templateXlsx());
    const typeMapping = guessTypeMapping(typesSheet!.table[0]!);
    expect(typeMapping).toEqual(['tag', 'description', 'inputWatts', 'use']);
    const [type] = buildTypeRows(typesSheet!.table, typeMapping, new Set());
    expect(type!.problems).toEqual([]);
    expect(guessMapping(spacesSheet!.table[0]!, 'space-by-space', [type!.type.tag]).at(-1)).toBe('count:A1');
  });

  it('offers a CSV template whose headers map back onto every field', () => {
    const [headers] = parseCsv(templateCsv());
    expect(guessMapping(headers!)).toEqual(['name', 'level', 'spaceType', 'buildingAreaType', 'area', 'ceilingHeight', 'length', 'width']);
  });
});

describe('luminaire types from a sheet', () => {
  const columns = ['Type', 'Description', 'Rated input (W)', 'Use', 'Reason'];

  it('reads tag, description, rated input and use, and finds what the service would refuse', () => {
    const mapping = guessTypeMapping(columns);
    expect(mapping).toEqual(['tag', 'description', 'inputWatts', 'use', 'exemptReason']);
    const rows = buildTypeRows(
      [
        columns,
        ['H1', 'High-bay', '151.5', 'General lighting', ''],
        ['X1', 'Exit sign', '2', 'Exempt', ''],
        ['H1', 'Again', '100', '', ''],
        ['A1', 'Troffer', 'lots', 'task', ''],
      ],
      mapping,
      new Set(['A1']),
    );
    expect(rows[0]).toMatchObject({
      problems: [],
      type: { tag: 'H1', description: 'High-bay', inputWatts: '151.5', use: 'general', basis: 'rated' },
    });
    expect(rows[1]!.problems.map((problem) => problem.message)).toEqual(['Exempt lighting needs the reason it is exempt.']);
    expect(rows[2]!.problems.map((problem) => problem.message)).toEqual(['The tag “H1” is on an earlier row too.']);
    expect(rows[3]!.problems.map((problem) => problem.field)).toEqual(['tag', 'inputWatts', 'use']);
  });
});

describe('remembering matched names', () => {
  it('keeps what the project remembered under the same name for the other kind of type', () => {
    const remembered = [{ name: 'Bunk room', spaceType: null, buildingAreaType: 'dormitory' }];
    expect(aliasesToRemember([{ kind: 'spaceType', name: 'bunk-room', key: 'office-enclosed' }], remembered)).toEqual([
      { name: 'bunk-room', spaceType: 'office-enclosed', buildingAreaType: 'dormitory' },
    ]);
  });
});
