import ExcelJS from 'exceljs';
import type { BuildingAreaTypeView, SpaceTypeView } from '../../core/api/api-types';
import { attachServerProblems, buildRows, guessMapping, parseCsv, parseXlsx, templateCsv, type ImportContext } from './space-import';

// IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data: office enclosed 0.74 W/ft², storage room 0.38 W/ft².
const spaceTypes = [
  { key: 'office-enclosed', label: 'Office — Enclosed', sourceLabel: 'Office | Enclosed', category: 'common', lpdWPerFt2: '0.74', verified: true },
  { key: 'storage-room', label: 'Storage Room', sourceLabel: 'Storage Room', category: 'common', lpdWPerFt2: '0.38', verified: true },
] as SpaceTypeView[];
// IECC 2021 Table C405.3.2(1), via PNNL building-energy-standards-data: automotive facility 0.75 W/ft².
const buildingAreaTypes = [{ key: 'automotive-facility', label: 'Automotive facility', sourceLabel: 'Automotive facility', lpdWPerFt2: '0.75', verified: true }] as BuildingAreaTypeView[];
const bySpace: ImportContext = { method: 'space-by-space', spaceTypes, buildingAreaTypes };

describe('guessMapping', () => {
  it('matches headers by name, alias and unit-decorated text, each field once', () => {
    expect(guessMapping(['Room name', 'Floor', 'Space type', 'Area (ft²)', 'Ceiling height', 'Notes'])).toEqual(['name', 'level', 'spaceType', 'area', 'ceilingHeight', null]);
    expect(guessMapping(['Name', 'Name', 'SF'])).toEqual(['name', null, 'area']);
  });

  it('reads a plain "Type" column as the building area type under the building area method', () => {
    expect(guessMapping(['Name', 'Type', 'Area'], 'building-area')).toEqual(['name', 'buildingAreaType', 'area']);
  });
});

describe('buildRows', () => {
  const header = ['Name', 'Level', 'Space type', 'Area'];

  it('resolves space types by key or by label and keeps the sheet line', () => {
    const rows = buildRows([header, ['Office 1', 'Level 1', 'office-enclosed', '120'], ['Store', '', 'storage room', '40']], guessMapping(header), bySpace);
    expect(rows.map((row) => row.problems)).toEqual([[], []]);
    expect(rows[0]!.space).toMatchObject({ name: 'Office 1', level: 'Level 1', spaceType: 'office-enclosed', area: '120' });
    expect(rows[1]!.space.spaceType).toBe('storage-room');
    expect(rows[1]!.line).toBe(3);
  });

  it('gives each row the problems the service would find', () => {
    const rows = buildRows(
      [header, ['', 'L1', 'office-enclosed', '10'], ['Lab', 'L1', 'laboratory-ish', '0'], ['Hall', 'L1', 'storage-room', 'ten'], ['Nook', 'L1', '', '-3']],
      guessMapping(header),
      bySpace,
    );
    expect(rows[0]!.problems).toEqual([{ field: 'name', message: 'A name is required.' }]);
    expect(rows[1]!.problems.map((problem) => problem.message)).toEqual(['Floor area: Must be greater than zero.', 'No space type is called "laboratory-ish".']);
    expect(rows[2]!.problems.map((problem) => problem.message)).toEqual(['Floor area: "ten" is not a decimal number.']);
    expect(rows[3]!.problems.map((problem) => problem.field)).toEqual(['area', 'spaceType']);
  });

  it('under the building area method needs a building area type and reads the space type as the control type', () => {
    const columns = ['Name', 'Building area type', 'Space type', 'Area'];
    const [row] = buildRows([columns, ['Bay', 'Automotive facility', 'storage-room', '500']], guessMapping(columns, 'building-area'), { ...bySpace, method: 'building-area' });
    expect(row!.problems).toEqual([]);
    expect(row!.space).toMatchObject({ buildingAreaType: 'automotive-facility', controlSpaceType: 'storage-room' });
    expect(row!.space.spaceType).toBeUndefined();
  });

  it('puts the service\'s 400 paths on the rows they name', () => {
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

  it('reads the first sheet of an .xlsx, numbers and formulas as text', async () => {
    const workbook = new ExcelJS.Workbook();
    const sheet = workbook.addWorksheet('Rooms');
    sheet.addRow(['Name', 'Level', 'Area']);
    sheet.addRow(['Office 1', 'Level 1', 120]);
    sheet.addRow(['Office 2', null, { formula: '10*12', result: 120 }]);
    workbook.addWorksheet('Ignored').addRow(['x']);
    const buffer = (await workbook.xlsx.writeBuffer()) as ArrayBuffer;

    expect(await parseXlsx(buffer)).toEqual([
      ['Name', 'Level', 'Area'],
      ['Office 1', 'Level 1', '120'],
      ['Office 2', '', '120'],
    ]);
  });

  it('offers a CSV template whose headers map back onto every field', () => {
    const [headers] = parseCsv(templateCsv());
    expect(guessMapping(headers!)).toEqual(['name', 'level', 'spaceType', 'buildingAreaType', 'area', 'ceilingHeight', 'length', 'width']);
  });
});
