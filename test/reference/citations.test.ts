import { describe, expect, it } from 'vitest';
import { editionIds, readReferenceEdition, type ReferenceEdition } from '../../service/src/code-tables/reference-files.js';
import { citationOf, cleanNote, editionName, referenceOf, withoutProvenance, type CitationInput } from '../../service/src/compliance/citation.js';

/**
 * What the maintainers' provenance may hold and a reader must never see: the tags of the check
 * data, flags, source annotations, pointers to SOURCES.md, dataset paths and links, and the names
 * of the datasets and tools behind them.
 */
const markers: [string, RegExp][] = [
  ['provenance tag', /\[(S|S-ed|I|M)\b[^\]]*\]/],
  ['flag', /FLAG:/i],
  ['source annotation', /source annotation/i],
  ['SOURCES.md pointer', /SOURCES\.md/],
  ['dataset path', /github:|shared\/reference-data|database_files|\.(json|csv|rb|py|md)\b/],
  ['link', /https?:\/\/|up\.codes/],
  ['dataset or tool name', /\bBESD\b|PNNL|NREL|openstudio|ruleset-checking|rct229|ConStrain|zmVault/i],
  ['modelling column name', /manon_or_partauto|flag=|rcr_threshold/],
  ['"from memory"', /from memory/i],
  ['legend code', /\bREQ\b/],
  ['commit or snapshot', /@[0-9a-f]{7,}|\bcommit [0-9a-f]{7,}|cloned snapshot|repository at that commit/],
  ['maintainers’ capitals', /\b(?:FORMULA|ADDED) ROW\b|\bFLAG\b/],
  ['field name', /\b(?:correctedFrom|equalsRowOf|lpd_w_ft2|lpdFormula)\b/],
  ['script or repository shorthand', /Apps Script|\.\.\/|\brepo\b/],
];

interface Row extends CitationInput {
  where: string;
}

/** Every row of an edition that carries provenance: table rows, control cells, strategies and their parameters, edition rules. */
function rows(edition: ReferenceEdition): Row[] {
  const name = editionName(edition.edition.family, edition.edition.year);
  const sections = Object.fromEntries(Object.entries(edition.rules.sections).map(([key, section]) => [key, section.section]));
  const row = (where: string, reference: string, value: { source: string; confidence?: string; verified?: boolean; note?: string; fromMemory?: string; tag?: string }): Row => ({
    where: `${edition.id} ${where}`,
    edition: name,
    reference,
    source: value.source,
    confidence: value.confidence ?? '',
    tag: value.tag ?? null,
    verified: value.verified ?? value.tag === '[S]',
    note: value.note ?? null,
    fromMemory: value.fromMemory ?? null,
  });
  const lpd = (note: string, key: string) => referenceOf(note, sections[key] ?? '');
  return [
    ...edition.buildingAreaTypes.rows.map((entry) => row(`building area type ${entry.key}`, lpd(entry.note, 'buildingAreaMethod'), entry)),
    ...edition.spaceTypes.rows.flatMap((entry) => [
      row(`space type ${entry.key}`, lpd(entry.note, 'spaceBySpaceMethod'), entry),
      ...Object.entries(entry.controls ?? {}).map(([strategy, cell]) => row(`space type ${entry.key} ${strategy}`, lpd(cell.note, 'spaceBySpaceMethod'), cell)),
    ]),
    ...edition.exteriorApplications.rows.map((entry) => row(`exterior application ${entry.key}`, lpd(entry.note, 'exteriorAllowance'), entry)),
    ...edition.lightingZones.rows.map((entry) => row(`lighting zone ${entry.zone}`, sections['lightingZones'] ?? '', entry)),
    ...edition.additionalAllowances.rows.map((entry) => row(`additional allowance ${entry.key}`, lpd(entry.note, 'additionalAllowances'), entry)),
    ...edition.controlStrategies.strategies.flatMap((strategy) => [
      row(`strategy ${strategy.key}`, strategy.section, strategy),
      ...Object.entries(strategy.parameters).map(([parameter, value]) => row(`strategy ${strategy.key} ${parameter}`, strategy.section, value)),
    ]),
    ...(['daylight', 'roomGeometry', 'smallEnclosedSpace', 'track', 'baseSite'] as const).flatMap((rule) => {
      const value = edition.rules[rule];
      return value ? [row(`rule ${rule}`, '', value.provenance)] : [];
    }),
    ...Object.entries(edition.rules.sections).map(([key, section]) => row(`section ${key}`, section.section, { ...section, source: '' })),
  ];
}

const editions = editionIds.map((id) => readReferenceEdition(id));
const everyRow = editions.flatMap(rows);

describe('citations of the code tables', () => {
  it('cover every row of every edition', () => {
    // A floor, not a count to keep in step with the files: each edition holds a couple of hundred rows with provenance or more.
    for (const edition of editions) expect(rows(edition).length, edition.id).toBeGreaterThan(200);
  });

  it.each(markers)('leave no %s in any short citation or note', (_what, marker) => {
    const found = everyRow.flatMap((row) => {
      const citation = citationOf(row);
      return [citation.short, citation.note ?? ''].filter((text) => marker.test(text)).map((text) => `${row.where}: ${text}`);
    });
    expect(found).toEqual([]);
  });

  it('cite the table each lighting power density comes from', () => {
    // IECC 2018, 2021 and 2024 Tables C405.3.2(1) and (2); ASHRAE 90.1-2013, 2016 and 2019 Tables 9.5.1 and 9.6.1; 90.1-2022 Tables 9.5.1 and
    // 9.5.2.1-1 (the tables' own numbering, via PNNL building-energy-standards-data; the table files' `table` fields).
    const expected: Record<string, [string, string]> = {
      'iecc-2018': ['IECC 2018 Table C405.3.2(1)', 'IECC 2018 Table C405.3.2(2)'],
      'iecc-2021': ['IECC 2021 Table C405.3.2(1)', 'IECC 2021 Table C405.3.2(2)'],
      'iecc-2024': ['IECC 2024 Table C405.3.2(1)', 'IECC 2024 Table C405.3.2(2)'],
      'ashrae-90.1-2013': ['ASHRAE 90.1-2013 Table 9.5.1', 'ASHRAE 90.1-2013 Table 9.6.1'],
      'ashrae-90.1-2016': ['ASHRAE 90.1-2016 Table 9.5.1', 'ASHRAE 90.1-2016 Table 9.6.1'],
      'ashrae-90.1-2019': ['ASHRAE 90.1-2019 Table 9.5.1', 'ASHRAE 90.1-2019 Table 9.6.1'],
      'ashrae-90.1-2022': ['ASHRAE 90.1-2022 Table 9.5.1', 'ASHRAE 90.1-2022 Table 9.5.2.1-1'],
    };
    for (const edition of editions) {
      const [areaTable, spaceTable] = expected[edition.id]!;
      const cited = rows(edition);
      for (const row of cited.filter((entry) => entry.where.includes('building area type'))) expect(citationOf(row).short, row.where).toBe(`${areaTable} — model code`);
      for (const row of cited.filter((entry) => /space type [^ ]+$/.test(entry.where))) expect(citationOf(row).short, row.where).toMatch(new RegExp(`^${spaceTable.replace(/[().]/g, '\\$&')}`));
    }
  });

  it('say what each kind of source is, and never call an unchecked value checked', () => {
    for (const row of everyRow) {
      const citation = citationOf(row);
      if (citation.layer === 'not-checked') {
        expect(citation.short, row.where).toContain('not yet checked against the printed code');
        expect(citation.checked, row.where).toBe(false);
      }
      if (!row.verified) expect(citation.checked, row.where).toBe(false);
      if (row.tag === '[S-ed]') expect(citation.layer, row.where).toBe('other-edition-or-state');
      if (row.tag === '[I]') expect(citation.layer, row.where).toBe('modelling-dataset');
      if (row.tag === '[M]' || row.source === 'from memory') expect(citation.layer, row.where).toBe('not-checked');
    }
  });

  it('name the state whose text stands in for the model code', () => {
    const iecc = rows(editions.find((edition) => edition.id === 'iecc-2021')!);
    // IECC 2021 C405.2.2 time-switch control, as Washington's 2021 energy code (WAC 51-11C-405022) words it.
    const timeSwitch = citationOf(iecc.find((row) => row.where.endsWith('strategy time-switch'))!);
    expect(timeSwitch).toMatchObject({ layer: 'other-edition-or-state', checked: false, short: 'IECC 2021 Section C405.2.2 — Washington state text standing in for the model code' });
    const track = citationOf(iecc.find((row) => row.where.endsWith('rule track'))!);
    expect(track.layer).toBe('not-checked');
    expect(track.note).toMatch(/not yet checked against the printed code/i);
  });

  it('leave the tables’ own labels and definitions without bracketed provenance', () => {
    for (const edition of editions) {
      const texts = [
        ...edition.lightingZones.rows.map((row) => row.description),
        ...edition.spaceTypes.rows.map((row) => row.label),
        ...edition.buildingAreaTypes.rows.map((row) => row.label),
        ...edition.exteriorApplications.rows.map((row) => row.label),
      ].map(withoutProvenance);
      expect(texts.filter((text) => /\[|from memory/i.test(text)), edition.id).toEqual([]);
    }
  });

  it('rewrite the maintainers’ shorthand in words', () => {
    // Invented notes in the shape the reference files use.
    expect(cleanNote('source annotation: From 90.1-2019 Table 9.6.1 | FLAG: RCR 9 is an unusual value; verify | SOURCES.md "Rows to verify": RCR 9 is unusual')).toBe(
      'The public transcription cites 90.1-2019 Table 9.6.1. To verify: RCR 9 is an unusual value; verify.',
    );
    expect(cleanNote('[M] IECC 2021 track rule not found', '[M] the same 30 W/lin ft rule')).toBe('IECC 2021 track rule not found. Not yet checked against the printed code: the same 30 W/lin ft rule.');
    expect(cleanNote('read from the toplit text (https://example.org/a, Colorado 2015) [S-ed]')).toBe('Read from the toplit text (Colorado 2015).');
    expect(cleanNote('')).toBeNull();
  });

  it('say a height-formula row’s allowance per foot of height in words', () => {
    // Invented formula rows in the shape the reference files use for atriums.
    expect(cleanNote('FORMULA ROW: source unit is W/ft; 0.05 is W/ft2 per ft of total atrium height, not a flat W/ft2')).toBe(
      'The allowance is 0.05 W/ft² for each foot of the atrium’s total height, not a flat W/ft² (the source gives the unit as W/ft).',
    );
    expect(cleanNote('FORMULA ROW: source gives 0.5 (W/ft2) plus supplemental 0.01 (W/ft); read as 0.5 W/ft2 + 0.01 W/ft2 per ft of total atrium height. lpd_w_ft2 holds only the base term')).toBe(
      'The allowance is 0.5 W/ft² plus 0.01 W/ft² for each foot of the atrium’s total height (the source gives 0.5 and a supplemental 0.01 per foot).',
    );
    expect(cleanNote('FORMULA ROW: source gives 0.5 with unit W/ft plus supplemental 0.01 (W/ft); read as 0.50 W/ft2 + 0.01 W/ft2 per ft of total atrium height. FLAG: base-term unit looks wrong')).toBe(
      'The allowance is 0.50 W/ft² plus 0.01 W/ft² for each foot of the atrium’s total height (the source gives 0.5 with the unit W/ft and a supplemental 0.01 per foot). To verify: base-term unit looks wrong.',
    );
  });

  it('say where a cross-check was read and what it found, without commits, files or the second dataset’s name', () => {
    // Invented cross-check notes in the shape of the later editions' files.
    expect(cleanNote('read from the public repository at that commit, not in the cloned snapshot @abcdef1; transcribed field by field | vs ASHRAE 90.1-2010: DIFFERS from row "Lobby | Elevator" = 0.7')).toBe(
      'Transcribed field by field from a later version of the public modelling dataset than the other editions use. Compared with ASHRAE 90.1-2010: differs from the row “Lobby — Elevator” (0.7).',
    );
    expect(cleanNote('openstudio-standards space-type data ("Lobby | General"): LPD 0.9 equal; RCR 4 equal [github:owner/data@1234567:x.json; same lineage] ; IECC 2012 row "Lobby | General" = 0.8 (differs; not copied; same repo)')).toBe(
      'The IECC 2012 row “Lobby — General” differs (0.8; not copied).',
    );
    expect(cleanNote('IECC 2012 used 15 minutes (notes.md §3.1) | equal to the low-authority ../x.csv value (unidentified Apps Script) | 0.9 -> 0.8 is the cut quoted in https://example.org/a (secondary)')).toBe(
      'IECC 2012 used 15 minutes. Equal to the value of a low-authority copy of unknown origin. 0.9 → 0.8 is the cut quoted in a published article (secondary).',
    );
    // A "rows to verify" pointer repeats what a flag, or a part that ends by asking to verify, already says.
    expect(cleanNote('FLAG LOW: 0.5 here vs 0.2; verify | SOURCES.md "Rows to verify": 0.5 where 0.2')).toBe('To verify (low confidence): 0.5 here vs 0.2; verify.');
    expect(cleanNote('LZ3 0.2 here vs 0.3 (same repo); verify | SOURCES.md "Rows to verify": LZ3 0.2 where 0.3')).toBe('LZ3 0.2 here vs 0.3; verify.');
  });

  it('decide the kind of source by the row’s tag first', () => {
    // An invented row: another edition's modelling reading, tagged [S-ed], with the confidence of an interpretation.
    const reading = { edition: 'ASHRAE 90.1-2010', reference: '9.4.1.1(e)', source: 'github:owner/code@1234567:space.rb', confidence: 'interpretation', verified: false };
    expect(citationOf({ ...reading, tag: '[S-ed]' })).toMatchObject({ layer: 'other-edition-or-state', short: "ASHRAE 90.1-2010 Section 9.4.1.1(e) — another edition's modelling reading standing in for this one" });
    expect(citationOf({ ...reading, tag: null }).layer).toBe('modelling-dataset');
    expect(citationOf({ ...reading, tag: '[M]' }).layer).toBe('not-checked');
  });
});
