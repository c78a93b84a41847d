import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedCodeTables } from '../../schema/seeds/00_code_tables.js';
import { loadEditionData } from '../../service/src/code-tables/code-tables.repository.js';
import { deriveIeccControls } from '../../service/src/code-tables/iecc-controls.js';
import { editionIds, readReferenceEdition, type ReferenceEdition } from '../../service/src/code-tables/reference-files.js';
import { editionName } from '../../service/src/compliance/citation.js';
import type { EditionId, RequirementCode } from '../../service/src/compliance/edition-data.js';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';
import { referenceRoot } from '../reference/source-data.js';

let database: TestDatabase;
let app: ReturnType<typeof testApp>['app'];
let engineer: SignedInAgent;
const reference = Object.fromEntries(editionIds.map((id) => [id, readReferenceEdition(id)])) as Record<EditionId, ReferenceEdition>;

beforeAll(async () => {
  database = await freshDatabase();
  app = testApp(database.db, database.url).app;
  engineer = await signIn(app, 'engineer@alderbay.example');
});

afterAll(async () => {
  await database.drop();
});

async function get(url: string) {
  const response = await engineer.agent.get(url);
  expect(response.status, url).toBe(200);
  return response.body;
}

const codeTables = [
  'building_area_types',
  'space_types',
  'space_type_controls',
  'control_strategy_sections',
  'control_strategy_parameters',
  'code_exterior_applications',
  'lighting_zones',
  'additional_allowances',
  'edition_rules',
  'edition_sections',
  'code_edition_versions',
];

async function rowCounts(): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const table of codeTables) {
    const [row] = await database.db(table).count<{ count: string }[]>({ count: '*' });
    counts[table] = Number(row!.count);
  }
  return counts;
}

describe('GET /api/code-editions', () => {
  it('lists the seven editions with their current data version and methods', async () => {
    const body = await get('/api/code-editions');
    expect(body.map((edition: { id: string }) => edition.id)).toEqual([
      'ashrae-90.1-2013',
      'ashrae-90.1-2016',
      'ashrae-90.1-2019',
      'ashrae-90.1-2022',
      'iecc-2018',
      'iecc-2021',
      'iecc-2024',
    ]);
    expect(body.map((edition: { id: string }) => edition.id).sort()).toEqual([...editionIds].sort());
    for (const edition of body) {
      expect(edition).toMatchObject({
        dataVersion: reference[edition.id as EditionId].dataVersion,
        methods: ['building-area', 'space-by-space'],
      });
      expect(edition).toHaveProperty('title');
      expect(edition).toHaveProperty('publisher');
      expect(typeof edition.year).toBe('number');
    }
  });

  it('needs a session', async () => {
    const response = await request(app).get('/api/code-editions');
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('unauthorized');
    expect((await request(app).get('/api/code-editions/iecc-2021/space-types')).status).toBe(401);
  });

  it('answers 404 in the error shape for an unknown edition or data version', async () => {
    const unknown = await engineer.agent.get('/api/code-editions/ashrae-90.1-2099/space-types');
    expect(unknown.status).toBe(404);
    expect(unknown.body).toEqual({ error: { code: 'not_found', message: expect.stringContaining('ashrae-90.1-2099') } });
    const version = await engineer.agent.get('/api/code-editions/iecc-2021/space-types?dataVersion=0000000000000000');
    expect(version.status).toBe(404);
    expect(version.body.error.code).toBe('not_found');
  });
});

describe.each(editionIds)('GET /api/code-editions/%s/…', (id) => {
  const edition = reference[id];
  const name = editionName(edition.edition.family, edition.edition.year);
  const provenance = (row: { source: string; confidence: string; verified: boolean; note: string; fromMemory?: string | undefined }) => ({
    source: row.source,
    confidence: row.confidence,
    verified: row.verified,
    note: row.note,
    ...(row.fromMemory ? { fromMemory: row.fromMemory } : {}),
    citation: expect.objectContaining({
      short: expect.stringMatching(new RegExp(`^${name.replace('.', '\\.')} `)),
      checked: row.verified ? expect.any(Boolean) : false,
    }),
  });

  it('building-area-types returns every row of the file, decimals unchanged', async () => {
    const body = await get(`/api/code-editions/${id}/building-area-types`);
    expect(body).toEqual(
      edition.buildingAreaTypes.rows.map((row) => ({
        key: row.key,
        label: row.label,
        sourceLabel: row.sourceLabel,
        lpdWPerFt2: row.lpdWPerFt2,
        ...(row.equalsRowOf ? { equalsRowOf: row.equalsRowOf } : {}),
        ...provenance(row),
      })),
    );
  });

  it('space-types returns every row with its category, RCR threshold and requirement map', async () => {
    const body = await get(`/api/code-editions/${id}/space-types`);
    expect(body).toHaveLength(edition.spaceTypes.rows.length);
    edition.spaceTypes.rows.forEach((row, index) => {
      const served = body[index];
      expect(served).toMatchObject({
        key: row.key,
        label: row.label,
        sourceLabel: row.sourceLabel,
        category: row.category,
        lpdWPerFt2: row.lpdWPerFt2,
        rcrThreshold: row.rcrThreshold,
        ...provenance(row),
      });
      expect(served.rcrCondition).toBe(row.rcrCondition);
      expect(served.lpdFormula).toEqual(row.lpdFormula);
      const expected =
        row.iecc && row.daylight
          ? Object.fromEntries(
              Object.entries(
                deriveIeccControls(row.iecc, {
                  sidelighting: row.daylight.sidelighting as RequirementCode,
                  toplighting: row.daylight.toplighting as RequirementCode,
                }),
              ).map(([strategy, cell]) => [strategy, cell.requirement]),
            )
          : Object.fromEntries(Object.entries(row.controls ?? {}).map(([strategy, cell]) => [strategy, cell.requirement]));
      expect(served.controls).toEqual(expected);
      if (row.iecc) expect(served.iecc).toEqual(row.iecc);
    });
  });

  it('control-strategies returns each strategy with its section and parameters', async () => {
    const body = await get(`/api/code-editions/${id}/control-strategies`);
    const labels = new Map(edition.catalogue.strategies.map((strategy) => [strategy.key, strategy.label]));
    const order = edition.catalogue.strategies.map((strategy) => strategy.key);
    const expected = [...edition.controlStrategies.strategies]
      .sort((a, b) => order.indexOf(a.key) - order.indexOf(b.key))
      .map((strategy) => ({
        key: strategy.key,
        label: labels.get(strategy.key),
        section: strategy.section,
        tag: strategy.tag,
        parameters: Object.fromEntries(Object.entries(strategy.parameters).map(([name, parameter]) => [name, parameter.value])),
        ...provenance(strategy),
      }));
    expect(body).toMatchObject(expected);
    expect(body).toHaveLength(expected.length);
  });

  it('exterior-applications returns every row, allowances by zone as strings', async () => {
    const body = await get(`/api/code-editions/${id}/exterior-applications`);
    expect(body).toEqual(
      edition.exteriorApplications.rows.map((row) => ({
        key: row.key,
        label: row.label,
        sourceLabel: row.sourceLabel,
        unit: row.unit,
        sourceUnit: row.sourceUnit,
        tradable: row.tradable,
        isBaseSiteAllowance: row.isBaseSiteAllowance,
        allowanceByZone: row.allowanceByZone,
        unverifiedZones: row.unverifiedZones ?? [],
        controls: row.controls,
        sourceControlFlags: row.sourceControlFlags,
        ...provenance(row),
      })),
    );
  });

  it('lighting-zones and additional-allowances return what the files hold', async () => {
    const zones = await get(`/api/code-editions/${id}/lighting-zones`);
    expect(zones).toEqual(
      edition.lightingZones.rows.map((row) => ({
        key: row.zone,
        zone: Number(row.zone),
        label: `Lighting zone ${row.zone}`,
        // The definition without the provenance the file appends in brackets; the citation carries that.
        description: row.description.replace(/\s*\[from memory[^\]]*\]/, ''),
        sourceLabel: row.sourceLabel,
        ...provenance(row),
      })),
    );
    const allowances = await get(`/api/code-editions/${id}/additional-allowances`);
    expect(allowances).toEqual(
      edition.additionalAllowances.rows.map((row) => ({
        key: row.key,
        label: row.label,
        sourceLabel: row.sourceLabel,
        kind: row.kind,
        section: row.section ?? null,
        lpdWPerFt2: row.lpdWPerFt2,
        fixedW: row.fixedW,
        ...provenance(row),
      })),
    );
  });

  it('rules returns the edition rules and the sections results cite', async () => {
    const body = await get(`/api/code-editions/${id}/rules`);
    const { provenance: _daylightProvenance, openings, ...daylight } = edition.rules.daylight;
    expect(body.daylight).toMatchObject(daylight);
    expect(body.daylight.provenance.verified).toBe(false);
    // The glazing rules keep their values and sections; each is cited for people and, from memory, not checked.
    for (const [name, rule] of Object.entries(openings ?? {})) {
      const { provenance: _ruleProvenance, ...values } = rule;
      expect(body.daylight.openings[name], `${id} ${name}`).toMatchObject(values);
      expect(body.daylight.openings[name].provenance.verified).toBe(false);
      expect(body.daylight.openings[name].provenance.citation.checked).toBe(false);
    }
    expect(body.roomGeometry?.increasePercent ?? null).toBe(edition.rules.roomGeometry?.increasePercent ?? null);
    expect(body.smallEnclosedSpaceFt2).toBe(edition.rules.smallEnclosedSpace?.ft2 ?? null);
    expect(body.trackMinimumWPerFt).toBe(edition.rules.track.minimumWPerFt);
    expect(body.baseSiteCoversNontradable).toBe(edition.rules.baseSite.coversNontradable);
    expect(
      Object.fromEntries(Object.entries(body.sections).map(([key, section]) => [key, (section as { section: string }).section])),
    ).toEqual(Object.fromEntries(Object.entries(edition.rules.sections).map(([key, section]) => [key, section.section])));
  });
});

describe('citations in the code-table views', () => {
  const tables = [
    'building-area-types',
    'space-types',
    'control-strategies',
    'exterior-applications',
    'lighting-zones',
    'additional-allowances',
  ];

  it.each(editionIds)('cite every row of %s in words, with none of the files’ markers', async (id) => {
    for (const table of tables) {
      const body: { citation: { short: string; note: string | null; checked: boolean }; verified: boolean }[] = await get(
        `/api/code-editions/${id}/${table}`,
      );
      for (const row of body) {
        const words = `${row.citation.short} ${row.citation.note ?? ''}`;
        expect(words, `${id}/${table}`).not.toMatch(
          /\[(S|S-ed|I|M)\b|FLAG:|source annotation|SOURCES\.md|github:|https?:\/\/|from memory/i,
        );
        if (!row.verified) expect(row.citation.checked, `${id}/${table}`).toBe(false);
      }
    }
  });

  it('names the table, the kind of source and what is not yet checked', async () => {
    const spaceTypes = await get('/api/code-editions/iecc-2021/space-types');
    // IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data.
    expect(spaceTypes.find((row: { key: string }) => row.key === 'office-enclosed').citation).toMatchObject({
      short: 'IECC 2021 Table C405.3.2(2) — model code',
      layer: 'model-code',
      checked: true,
    });
    const strategies = await get('/api/code-editions/iecc-2021/control-strategies');
    // C405.2.5 specific application controls: the reference files hold it from memory.
    expect(strategies.find((row: { key: string }) => row.key === 'specific-application').citation).toMatchObject({
      short: 'IECC 2021 Section C405.2.5 — not yet checked against the printed code',
      layer: 'not-checked',
      checked: false,
    });
    const cells = await get('/api/code-editions/ashrae-90.1-2019/space-types');
    // ASHRAE 90.1-2019 Table 9.6.1 column (a): no public source was found for columns (a)–(d).
    const office = cells.find((row: { key: string }) => row.key === 'office-enclosed-and-le-250-ft2');
    expect(office.controlProvenance['local-control'].citation.layer).toBe('not-checked');
  });
});

describe('loadEditionData', () => {
  it('builds the contract the engine reads, at the current data version', async () => {
    const data = await loadEditionData(database.db, 'ashrae-90.1-2019');
    expect(data).toBeDefined();
    expect(data!.dataVersion).toBe(reference['ashrae-90.1-2019'].dataVersion);
    expect(data!.buildingAreaTypes).toHaveLength(32);
    expect(data!.spaceTypes).toHaveLength(102);
    // The "others … % of the interior allowance" row has no per-unit allowance, so the engine does not get it.
    expect(data!.exteriorApplications).toHaveLength(25);
    const office = data!.spaceTypes.find((space) => space.key === 'office-enclosed-and-le-250-ft2')!;
    expect(office.lpdWPerFt2).toBe('0.74'); // ASHRAE 90.1-2019 Table 9.6.1, via PNNL building-energy-standards-data
    expect(office.controls['local-control']).toBe('to-verify');
    expect(data!.rules.roomGeometry).toMatchObject({ increasePercent: '20', provenance: { verified: false } });
    expect(data!.sections['spaceBySpaceMethod']).toBe('9.6.1');
  });

  it('gives IECC space types their rule inputs and derived controls', async () => {
    const data = await loadEditionData(database.db, 'iecc-2021');
    const enclosed = data!.spaceTypes.find((space) => space.key === 'office-enclosed')!;
    expect(enclosed.iecc).toEqual({
      occupantSensorListed: true,
      fullAutoOnAllowed: false,
      sensorFunction: 'general',
      lightReductionExemptItem: null,
      timeSwitchExemptItem: null,
      sleepingUnit: false,
    }); // IECC 2021 C405.2.1 item 5
    // C405.2.2 exception and sleeping-unit controls (from memory, flagged in the data's notes).
    const dormitory = data!.spaceTypes.find((space) => space.key === 'dormitory-living-quarters')!;
    expect(dormitory.iecc).toMatchObject({ timeSwitchExemptItem: 'sleeping units', sleepingUnit: true });
    // C405.2.3 exceptions as Washington's 2021 text states them ([S-ed]): corridors, lobbies, electrical and mechanical rooms.
    const corridor = data!.spaceTypes.find((space) => space.key === 'corridor-otherwise')!;
    expect(corridor.iecc?.lightReductionExemptItem).toBe('corridors');
    expect(corridor.controls['light-reduction']).toBe('not-required');
    expect(enclosed.controls['light-reduction']).toBe('required');
    expect(enclosed.controls['occupant-sensor']).toBe('required');
    expect(data!.rules.smallEnclosedSpaceFt2).toBe('300'); // IECC 2021 C405.2.1 item 12
    expect(data!.rules.roomGeometry).toBeNull();
    // The sidelit zones count together at more than 150 W (C405.2.4 item 1, from memory).
    expect(data!.rules.daylight.combinedSidelitThresholdW).toBe('150');
  });

  it('gives 90.1 the overlap of toplit and primary sidelit areas to the primary sidelit area (from memory)', async () => {
    const data = await loadEditionData(database.db, 'ashrae-90.1-2019');
    expect(data!.rules.daylight.overlapPrecedence).toEqual(['primary-sidelit', 'toplit', 'secondary-sidelit']);
  });

  it('gives the atrium rows of the older editions their height formula', async () => {
    const data = await loadEditionData(database.db, 'ashrae-90.1-2016');
    const atrium = data!.spaceTypes.find((space) => space.key === 'atrium-gt-40-ft-in-height')!;
    // ASHRAE 90.1-2016 Table 9.6.1 atrium > 40 ft: 0.4 plus a supplemental 0.02 per ft of total height (the row notes; from memory "0.40 + 0.02 per ft total height").
    expect(atrium.lpdFormula).toEqual({
      kind: 'base-plus-per-foot-of-height',
      baseWPerFt2: '0.4',
      wPerFt2PerFt: '0.02',
      heightFt: { above: '40' },
    });
    expect(atrium.provenance.verified).toBe(false);
    expect(data!.spaceTypes.find((space) => space.key === 'office-open-plan')!.lpdFormula).toBeUndefined();
  });

  it('derives no verified control from IECC 2021 inputs standing in for IECC 2018', async () => {
    const body = await get('/api/code-editions/iecc-2018/space-types');
    const enclosed = body.find((row: { key: string }) => row.key === 'office-enclosed');
    expect(enclosed.iecc).toMatchObject({ occupantSensorListed: true, tag: '[S-ed]' });
    expect(enclosed.verified).toBe(true);
    for (const provenance of Object.values(enclosed.controlProvenance) as Array<{ verified: boolean }>)
      expect(provenance.verified).toBe(false);
    const data = await loadEditionData(database.db, 'iecc-2018');
    expect(data!.sections['exteriorAllowance']).toBe('C405.4.2'); // IECC 2018 numbers exterior lighting C405.4 (the source's table labels)
  });

  it('is undefined for an unknown edition or data version', async () => {
    expect(await loadEditionData(database.db, 'iecc-2099')).toBeUndefined();
    expect(await loadEditionData(database.db, 'iecc-2021', 'ffffffffffffffff')).toBeUndefined();
  });
});

describe('reseeding', () => {
  it('changes nothing when the files are unchanged', async () => {
    const before = await rowCounts();
    const versions = await database.db('code_editions').select('id', 'current_data_version').orderBy('id');
    const outcomes = await seedCodeTables(database.db);
    expect(outcomes.every((outcome) => !outcome.inserted)).toBe(true);
    expect(await rowCounts()).toEqual(before);
    expect(await database.db('code_editions').select('id', 'current_data_version').orderBy('id')).toEqual(versions);
  });

  it('inserts a new data version when a file changes and keeps the rows older versions refer to', async () => {
    const root = mkdtempSync(path.join(os.tmpdir(), 'allowlight-reference-'));
    try {
      cpSync(referenceRoot, root, { recursive: true });
      const file = path.join(root, 'iecc-2021', 'building-area-types.json');
      const table = JSON.parse(readFileSync(file, 'utf8'));
      table.rows[0].note = `${table.rows[0].note} | checked again`;
      writeFileSync(file, JSON.stringify(table, null, 2));
      const oldVersion = reference['iecc-2021'].dataVersion;

      const outcomes = await seedCodeTables(database.db, root);
      const iecc = outcomes.find((outcome) => outcome.edition === 'iecc-2021')!;
      expect(iecc.inserted).toBe(true);
      expect(iecc.dataVersion).not.toBe(oldVersion);
      expect(outcomes.filter((outcome) => outcome.inserted)).toHaveLength(1);

      const editions = await get('/api/code-editions');
      expect(editions.find((edition: { id: string }) => edition.id === 'iecc-2021').dataVersion).toBe(iecc.dataVersion);
      const old = await get(`/api/code-editions/iecc-2021/building-area-types?dataVersion=${oldVersion}`);
      expect(old[0].note).toBe(reference['iecc-2021'].buildingAreaTypes.rows[0]!.note);
      const current = await get('/api/code-editions/iecc-2021/building-area-types');
      expect(current[0].note).toMatch(/checked again$/);
      expect((await loadEditionData(database.db, 'iecc-2021', oldVersion))!.dataVersion).toBe(oldVersion);

      // Going back to the original files points the edition at its original version again, inserting nothing.
      const back = await seedCodeTables(database.db);
      expect(back.every((outcome) => !outcome.inserted)).toBe(true);
      expect((await get('/api/code-editions')).find((edition: { id: string }) => edition.id === 'iecc-2021').dataVersion).toBe(oldVersion);
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });
});
