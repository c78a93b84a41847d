import type { ComparisonSummary, EditionComparison, ProjectComparison } from '../../core/api/api-types';
import { changeGroups, compareView, marginWords, placesWords, type CompareContext } from './compare-columns';

// An invented project and invented figures: only how they read is checked here, not what any edition allows.
const spaces = ['Reading room', 'Stacks', 'Office 1', 'Office 2', 'Corridor'].map((name, index) => ({ id: `s${index + 1}`, name }));
const context: CompareContext = { spaces, luminaireTags: ['A', 'B'], units: 'ip' };

function summary(overrides: Partial<ComparisonSummary> = {}): ComparisonSummary {
  return {
    verdict: 'complies',
    units: 'ip',
    area: '12500',
    allowanceW: '10250.4',
    installedW: '8400',
    marginW: '1850.4',
    marginPct: '18.05',
    allowanceLpd: '0.82',
    installedLpd: '0.672',
    interiorComplies: true,
    exterior: { allowanceW: '900', installedW: '610', marginW: '290', complies: true },
    controls: { met: 20, notMet: 0, toVerify: 0 },
    open: [],
    unverifiedValues: 4,
    ...overrides,
  };
}

function edition(overrides: Partial<EditionComparison>): EditionComparison {
  return {
    edition: 'iecc-2021',
    title: 'International Energy Conservation Code 2021 (commercial)',
    status: 'evaluated',
    unmapped: [],
    remapped: [],
    controlsNotCarried: [],
    controlChanges: [],
    problems: [],
    result: summary(),
    ...overrides,
  };
}

const comparison: ProjectComparison = {
  current: edition({}),
  editions: [
    edition({
      edition: 'ashrae-90.1-2019',
      title: 'ANSI/ASHRAE/IES Standard 90.1-2019',
      remapped: [{ space: 'Stacks', from: 'Library — In the Stacks', to: 'Library — Stacks' }],
      controlsNotCarried: ['Occupant sensor', 'Time-switch control'],
      unmapped: [{ what: 'exterior application', name: 'Building facades', type: '' }],
      controlChanges: [
        {
          place: 'Reading room',
          exterior: false,
          changes: [
            { control: 'Automatic full OFF', requirement: 'required', before: 'not-required', status: 'not-met', section: '9.4.1.1(h)' },
            { control: 'Local control', requirement: 'to-verify', before: 'not-required', status: 'to-verify', section: '9.4.1.1(a)' },
            { control: 'Occupant sensor', requirement: 'not-required', before: 'required', status: 'not-required', section: 'C405.2.1' },
          ],
        },
        {
          place: 'Stacks',
          exterior: false,
          changes: [
            { control: 'Automatic full OFF', requirement: 'required', before: 'not-required', status: 'not-met', section: '9.4.1.1(h)' },
          ],
        },
        {
          place: 'Office 1',
          exterior: false,
          changes: [
            { control: 'Automatic full OFF', requirement: 'required', before: 'not-required', status: 'met', section: '9.4.1.1(h)' },
          ],
        },
        {
          place: 'Office 2',
          exterior: false,
          changes: [
            { control: 'Automatic full OFF', requirement: 'required', before: 'not-required', status: 'not-met', section: '9.4.1.1(h)' },
          ],
        },
      ],
      result: summary({
        verdict: 'does-not-comply',
        allowanceW: '8000',
        marginW: '-400',
        marginPct: '-5',
        interiorComplies: false,
        exterior: { allowanceW: '700', installedW: '580', marginW: '120', complies: true },
        controls: { met: 5, notMet: 3, toVerify: 1 },
        unverifiedValues: 1,
      }),
    }),
    edition({
      edition: 'ashrae-90.1-2022',
      title: 'ANSI/ASHRAE/IES Standard 90.1-2022',
      status: 'not-mapped',
      unmapped: [{ what: 'space', name: 'Reading room', type: 'Library — In a Reading area' }],
      result: null,
    }),
    edition({
      edition: 'iecc-2024',
      title: 'International Energy Conservation Code 2024 (commercial)',
      result: summary({ unverifiedValues: 0 }),
    }),
  ],
  cautions: ['Energy-code compliance only.'],
};

describe('compareView', () => {
  const view = compareView(comparison, context);
  const [own, ashrae, notMapped, iecc2024] = view.columns;

  it('sets the project’s own edition first, marked, then every other edition as the service lists them, named in words', () => {
    expect(view.columns.map((column) => [column.label, column.own])).toEqual([
      ['IECC 2021', true],
      ['90.1-2019', false],
      ['90.1-2022', false],
      ['IECC 2024', false],
    ]);
    expect(ashrae!.title).toBe('ANSI/ASHRAE/IES Standard 90.1-2019');
    expect(view.ownLabel).toBe('IECC 2021');
    // An edition the app has no short name for goes by the service's title, never its key.
    const unknown = compareView(
      { ...comparison, editions: [edition({ edition: 'iecc-2027', title: 'International Energy Conservation Code 2027 (commercial)' })] },
      context,
    ).columns[1]!;
    expect(unknown.label).toBe('International Energy Conservation Code 2027 (commercial)');
  });

  it('gives each margin as a figure and in words that agree: what is left, or the excess', () => {
    expect(own!.interior).toMatchObject({
      allowance: '10,250 W',
      installed: '8,400 W',
      margin: '1,850 W (18.1 %)',
      marginWords: 'within allowance, 1,850 W to spare',
    });
    expect(own!.interior!.status).toEqual({ within: true, icon: 'check_circle', label: 'Within allowance' });
    expect(ashrae!.interior).toMatchObject({ margin: '-400 W (-5.0 %)', marginWords: 'over by 400 W' });
    expect(ashrae!.interior!.status).toEqual({ within: false, icon: 'warning', label: 'Over allowance' });
    expect(marginWords(true, '0')).toBe('within allowance, 0 W to spare');
  });

  it('says why an edition’s verdict fails, and what holds one back', () => {
    expect(own!.verdict).toEqual({ icon: 'check_circle', words: 'Complies', detail: '' });
    expect(ashrae!.verdict).toEqual({
      icon: 'warning',
      words: 'Does not comply',
      detail: 'interior power over allowance; 3 control requirements not met',
    });
    const incomplete = compareView(
      { ...comparison, editions: [edition({ result: summary({ verdict: 'incomplete', controls: { met: 3, notMet: 0, toVerify: 1 } }) })] },
      context,
    ).columns[1]!;
    expect(incomplete.verdict).toEqual({
      icon: 'edit_note',
      words: 'Design incomplete',
      detail: 'no verdict yet: 1 control requirement to verify',
    });
  });

  it('names the exterior applications an edition does not list, whose watts are then not counted', () => {
    expect(ashrae!.exterior).toMatchObject({
      allowance: '700 W',
      installed: '580 W',
      margin: '120 W',
      marginWords: 'within allowance, 120 W to spare',
      notCounted: ['Building facades'],
    });
    expect(own!.exterior!.notCounted).toEqual([]);
    expect(view.hasExterior).toBe(true);
    const overOneApplication = compareView(
      {
        ...comparison,
        editions: [edition({ result: summary({ exterior: { allowanceW: '900', installedW: '850', marginW: '50', complies: false } }) })],
      },
      context,
    ).columns[1]!;
    expect(overOneApplication.exterior).toMatchObject({
      marginWords: 'over: an application is over its own allowance',
      status: { within: false, label: 'Over allowance' },
    });
  });

  it('does not evaluate an edition where a space has no matching type, and names the space and its type in words', () => {
    expect(notMapped).toMatchObject({ evaluated: false, interior: null, exterior: null, controls: null, unverified: null });
    expect(notMapped!.verdict).toEqual({
      icon: 'block',
      words: 'Not evaluated',
      detail: '1 space has no matching space type in this edition',
    });
    expect(notMapped!.mapping).toBe('1 space has no matching space type in this edition:');
    expect(notMapped!.unmapped).toEqual(['Reading room: Library — In a Reading area']);
    expect(ashrae!.mapping).toBe('Every space maps to a space type of this edition; 1 space takes a row of another name.');
    expect(own!.mapping).toBe('The project’s own space types.');
  });

  it('counts the controls and says which controls the project’s edition recorded that this one does not carry', () => {
    expect(ashrae!.controls).toMatchObject({
      counts: '5 met · 3 not met · 1 to verify',
      notCarried: 'Recorded under IECC 2021, not in this edition: Occupant sensor, Time-switch control.',
      unchanged: null,
    });
    expect(own!.controls).toMatchObject({
      changes: [],
      notCarried: null,
      unchanged: 'The requirements the other editions are set against.',
    });
    expect(iecc2024!.controls).toMatchObject({ changes: [], unchanged: 'Every requirement as under IECC 2021.' });
  });

  it('lists each control whose requirement changes, with every space it changes for', () => {
    expect(ashrae!.controls!.changes).toEqual([
      {
        kind: 'now-required',
        heading: 'Becomes required',
        items: [{ control: 'Automatic full OFF', places: '4 spaces: all but Corridor', statuses: '3 not met, 1 met' }],
      },
      {
        kind: 'to-verify',
        heading: 'Requirement to verify (the tables do not settle it)',
        items: [{ control: 'Local control', places: 'Reading room', statuses: '' }],
      },
      {
        kind: 'no-longer-required',
        heading: 'No longer required',
        items: [{ control: 'Occupant sensor', places: 'Reading room', statuses: '' }],
      },
    ]);
  });

  it('counts the unverified values with the app’s “verify” words', () => {
    expect(own!.unverified).toEqual({
      count: 4,
      words: '4 values to verify',
      note: '4 values this evaluation used rest on a source not yet confirmed against the printed code; the Results page names each one.',
    });
    expect(ashrae!.unverified).toEqual({
      count: 1,
      words: '1 value to verify',
      note: '1 value this evaluation used rests on a source not yet confirmed against the printed code.',
    });
    expect(iecc2024!.unverified!.words).toBe('None: every value used comes from a verified published source');
  });

  it('speaks an SI project’s units: m², W/m², and code-table words converted', () => {
    const si = (overrides: Partial<ComparisonSummary> = {}) =>
      summary({ units: 'si', area: '1161.29', allowanceLpd: '8.827', installedLpd: '7.233', ...overrides });
    const body: ProjectComparison = {
      current: edition({ result: si() }),
      editions: [
        edition({
          edition: 'ashrae-90.1-2019',
          status: 'not-mapped',
          result: null,
          unmapped: [
            { what: 'space', name: 'Office 1', type: 'Office — Enclosed ≤ 250 ft²' },
            { what: 'exterior application', name: 'Walkways less than 10 feet wide', type: '' },
          ],
        }),
      ],
      cautions: [],
    };
    const columns = compareView(body, { ...context, units: 'si' }).columns;
    expect(columns[0]!.interior).toMatchObject({ area: '1,161.3 m²', allowanceDensity: '8.83 W/m²', installedDensity: '7.23 W/m²' });
    // 250 ft² × 0.09290304 m²/ft² = 23.2 m² (NIST SP 811, exact definition of the foot).
    expect(columns[1]!.unmapped).toEqual(['Office 1: Office — Enclosed ≤ 23.2 m²']);
    expect(JSON.stringify(columns)).not.toMatch(/ft²|W\/ft/);
  });

  it('reads the problems of a design that does not fit an edition in words, each with its space', () => {
    const body: ProjectComparison = {
      ...comparison,
      editions: [
        edition({
          edition: 'ashrae-90.1-2013',
          status: 'not-valid',
          result: null,
          problems: [{ path: 'spaces.1.ceilingHeight', message: 'Give the ceiling height: this edition’s allowance depends on it.' }],
        }),
      ],
    };
    const column = compareView(body, context).columns[1]!;
    expect(column.verdict.words).toBe('Not evaluated');
    expect(column.problems).toEqual([
      {
        subject: 'Stacks',
        field: 'Ceiling height',
        message: 'Give the ceiling height: this edition’s allowance depends on it.',
        link: { page: 'spaces', query: { space: 's2', field: 'ceilingHeight' } },
      },
    ]);
  });
});

describe('placesWords', () => {
  const names = spaces.map((space) => space.name);
  it('says every space, every space but a few, or each by name, and exterior applications after', () => {
    const of = (...places: string[]) => places.map((place) => ({ place, exterior: false }));
    expect(placesWords(of(...names), names)).toBe('all 5 spaces');
    expect(placesWords(of('Reading room', 'Stacks', 'Office 1', 'Office 2'), names)).toBe('4 spaces: all but Corridor');
    expect(placesWords(of('Reading room', 'Stacks'), names)).toBe('2 spaces: Reading room, Stacks');
    expect(placesWords([...of('Corridor'), { place: 'Parking lots', exterior: true }], names)).toBe('Corridor; Parking lots (exterior)');
  });

  it('names the first spaces of a long list and counts the rest', () => {
    const many = Array.from({ length: 100 }, (_, index) => `Store ${index + 1}`);
    const words = placesWords(
      many.slice(0, 60).map((place) => ({ place, exterior: false })),
      many,
    );
    expect(words).toMatch(/^60 spaces: Store 1, Store 2, .*Store 40 and 20 more$/);
    expect(words).not.toContain('Store 41');
  });
});

describe('changeGroups', () => {
  it('never reads a requirement the tables cannot settle as "not required"', () => {
    const groups = changeGroups(
      [
        {
          place: 'Corridor',
          exterior: false,
          changes: [
            {
              control: 'Bilevel lighting control',
              requirement: 'to-verify',
              before: 'required',
              status: 'to-verify',
              section: '9.4.1.1(d)',
            },
            {
              control: 'Light-reduction control',
              requirement: 'not-required',
              before: 'to-verify',
              status: 'not-required',
              section: 'C405.2.3',
            },
          ],
        },
      ],
      'IECC 2021',
      ['Corridor'],
    );
    expect(groups.map((group) => [group.heading, group.items.map((item) => item.control)])).toEqual([
      ['Requirement to verify (the tables do not settle it)', ['Bilevel lighting control']],
      ['Not required (to verify under IECC 2021)', ['Light-reduction control']],
    ]);
  });
});
