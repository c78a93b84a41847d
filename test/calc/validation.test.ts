import { describe, expect, it } from 'vitest';
import { validateDocument } from '../../service/src/compliance/index.js';
import type { EvaluationDocumentInput } from '../../service/src/compliance/index.js';
import { ashrae2019, iecc2021 } from './fixtures.js';

function valid(): EvaluationDocumentInput {
  return {
    edition: 'ashrae-90.1-2019',
    method: 'space-by-space',
    units: 'ip',
    luminaireTypes: [
      { tag: 'A', description: 'downlight', inputWatts: '12.5', use: 'general' },
      { tag: 'X', description: 'exit sign', inputWatts: 3, use: 'exempt', exemptReason: 'exit sign' },
    ],
    spaces: [
      {
        id: 's1',
        name: 'Office',
        spaceType: 'office-enclosed-small',
        area: '200',
        length: 10,
        width: 20,
        ceilingHeight: 9,
        luminaires: [{ tag: 'A', count: 4 }],
        controls: [{ strategy: 'automatic-full-off', provided: true, timeoutMinutes: 20 }],
        windows: [{ width: 4, headHeight: 7, offset: 2, wall: 'south' }],
      },
    ],
    exterior: { lightingZone: 2, applications: [{ key: 'parking', quantity: 1000, installedWatts: 30 }] },
  };
}

function paths(document: unknown, edition = ashrae2019): string[] {
  const outcome = validateDocument(document, edition);
  return outcome.problems.map((problem) => problem.path);
}

describe('validateDocument', () => {
  it('accepts a valid document and normalises its numbers to decimal strings', () => {
    const outcome = validateDocument(valid(), ashrae2019);
    expect(outcome.problems).toEqual([]);
    expect(outcome.valid).toBe(true);
    if (outcome.valid) {
      expect(outcome.document.spaces[0]!.area).toBe('200');
      expect(outcome.document.luminaireTypes[1]!.inputWatts).toBe('3');
      expect(outcome.document.exterior!.lightingZone).toBe('2');
    }
  });

  it('rejects NaN, negative and non-numeric values with their path', () => {
    const document = valid();
    document.spaces[0]!.area = 'twelve';
    document.spaces[0]!.ceilingHeight = -3;
    document.luminaireTypes![0]!.inputWatts = Number.NaN;
    const outcome = validateDocument(document, ashrae2019);
    expect(outcome.problems).toEqual(
      expect.arrayContaining([
        { path: 'spaces.0.area', message: '“twelve” is not a number. Enter a number greater than 0 and at most 5,000,000.' },
        { path: 'spaces.0.ceilingHeight', message: 'Must not be negative. Enter a number greater than 0 and at most 1,000.' },
        { path: 'luminaireTypes.0.inputWatts', message: 'Must be a finite number. Enter a number from 0 to 100,000.' },
      ]),
    );
  });

  it('names unknown space types and building area types of the edition', () => {
    const document = valid();
    document.spaces[0]!.spaceType = 'ballroom';
    expect(paths(document)).toContain('spaces.0.spaceType');
    const areaMethod = { ...valid(), method: 'building-area' as const };
    areaMethod.spaces = [{ id: 'b', name: 'B', buildingAreaType: 'spaceport', area: 10 }];
    expect(paths(areaMethod)).toContain('spaces.0.buildingAreaType');
  });

  it('flags the type each method needs when it is missing, and keeps the other method’s type', () => {
    const areaMethod = { ...valid(), method: 'building-area' as const };
    expect(paths(areaMethod)).toEqual(['spaces.0.buildingAreaType']);
    const both = { ...valid(), method: 'building-area' as const };
    both.spaces[0]!.buildingAreaType = 'office';
    expect(paths(both)).toEqual([]);
    const controlTypeDiffers = valid();
    controlTypeDiffers.spaces[0]!.controlSpaceType = 'corridor';
    expect(paths(controlTypeDiffers)).toEqual(['spaces.0.controlSpaceType']);
    const spaceMethod = valid();
    delete spaceMethod.spaces[0]!.spaceType;
    expect(paths(spaceMethod)).toContain('spaces.0.spaceType');
  });

  it('flags a luminaire tag no type defines, duplicate tags and duplicate space ids', () => {
    const document = valid();
    document.spaces[0]!.luminaires!.push({ tag: 'Z', count: 1 });
    document.luminaireTypes!.push({ tag: 'A', description: 'again', inputWatts: 1, use: 'general' });
    document.spaces.push({ ...document.spaces[0]!, luminaires: [] });
    expect(paths(document)).toEqual(expect.arrayContaining(['spaces.0.luminaires.1.tag', 'luminaireTypes.2.tag', 'spaces.1.id']));
  });

  it('flags an exterior application key the edition lacks and a strategy not in the catalogue', () => {
    const document = valid();
    document.exterior!.applications!.push({ key: 'helipad', quantity: 1, installedWatts: 1 });
    document.spaces[0]!.controls!.push({ strategy: 'clap-switch', provided: true });
    expect(paths(document)).toEqual(expect.arrayContaining(['exterior.applications.1.key', 'spaces.0.controls.1.strategy']));
    // IECC's catalogue has no 90.1 column strategies such as automatic full OFF.
    const iecc = { ...valid(), edition: 'iecc-2021' };
    iecc.spaces[0]!.spaceType = 'office-enclosed';
    expect(paths(iecc, iecc2021)).toEqual(['spaces.0.controls.0.strategy']);
  });

  it('requires an exempt reason, track length and limiter ratings', () => {
    const document = valid();
    delete document.luminaireTypes![1]!.exemptReason;
    document.luminaireTypes!.push(
      { tag: 'T', description: 'track', inputWatts: 100, use: 'general', basis: 'line-voltage-track' },
      { tag: 'L', description: 'low-voltage', inputWatts: 100, use: 'general', basis: 'low-voltage-track' },
    );
    expect(paths(document)).toEqual(
      expect.arrayContaining(['luminaireTypes.1.exemptReason', 'luminaireTypes.2.length', 'luminaireTypes.3.limitWatts']),
    );
  });

  it('checks that windows fit their wall and that openings have a room to sit in', () => {
    const document = valid();
    document.spaces[0]!.windows = [{ width: 8, headHeight: 7, offset: 5, wall: 'south' }];
    expect(paths(document)).toEqual(['spaces.0.windows.0.offset']);
    const noRoom = valid();
    delete noRoom.spaces[0]!.length;
    expect(paths(noRoom)).toEqual(['spaces.0.length']);
  });

  it('reports schema and reference problems together', () => {
    const document = valid();
    document.spaces[0]!.area = -1;
    document.spaces[0]!.spaceType = 'ballroom';
    expect(paths(document)).toEqual(expect.arrayContaining(['spaces.0.area', 'spaces.0.spaceType']));
  });
});

describe('unknown fields', () => {
  it('are refused by name at every level, so a misspelt field is not silently lost', () => {
    const document = valid() as unknown as Record<string, unknown> & { spaces: Record<string, unknown>[] };
    document.spaces[0]!['ceilingHieght'] = 9;
    (document.spaces[0]!['luminaires'] as Record<string, unknown>[])[0]!['cnt'] = 2;
    document['author'] = 'someone';
    const problems = validateDocument(document, ashrae2019).problems;
    expect(problems).toEqual(
      expect.arrayContaining([
        { path: 'spaces.0', message: 'Unknown field “ceilingHieght”: check the spelling.' },
        { path: 'spaces.0.luminaires.0', message: 'Unknown field “cnt”: check the spelling.' },
        { path: '', message: 'Unknown field “author”: check the spelling.' },
      ]),
    );
  });
});
