import type {
  ExteriorApplicationRecord,
  FieldTestHistoryDetail,
  HistoryEntry,
  LuminaireTypeRecord,
  SetupSnapshot,
  SpaceRecord,
} from '../../core/api/api-types';
import {
  describeEntry,
  describeImport,
  historyItems,
  noLabels,
  relativeTime,
  restoredWords,
  unitsAtEntry,
  unitsChanges,
  type HistoryLabels,
} from './history-entry';

// Invented people, spaces and values throughout; the labels are those our code tables give.
const ines = { id: 'u1', name: 'Ines Halvorsen' };
const stamp = { version: 1, updatedAt: '2026-03-02T09:00:00Z', updatedBy: 'Ines Halvorsen' };

const labels: HistoryLabels = {
  spaceTypes: new Map([
    ['office-enclosed', 'Office — Enclosed'],
    ['storage-room', 'Storage Room'],
  ]),
  buildingAreaTypes: new Map([['library', 'Library']]),
  controlStrategies: new Map([
    ['occupant-sensor', 'Occupant sensor'],
    ['time-switch', 'Time-switch control'],
  ]),
  exteriorApplications: new Map([
    ['parking-lots-and-drives', { label: 'Parking lots and drives', unit: 'W/ft2' }],
    ['walkways-narrow', { label: 'Walkways less than 10 feet wide', unit: 'W/ft' }],
  ]),
  editions: new Map([
    ['iecc-2021', 'IECC 2021'],
    ['ashrae-90.1-2019', 'ASHRAE/IES 90.1-2019'],
  ]),
};

function space(changes: Partial<SpaceRecord> = {}): SpaceRecord {
  return {
    id: '7d3f0e7c-1111-4a55-9d7e-0c1f2b3a4d5e',
    position: 3,
    name: 'Exam 1',
    level: 'Level 1',
    spaceType: 'office-enclosed',
    area: '120',
    ceilingHeight: '9',
    luminaires: [{ tag: 'A', count: '4', luminaireTypeId: 'a1' }],
    controls: [],
    windows: [
      { width: '4', headHeight: '7', wall: 'east' },
      { width: '4', headHeight: '7', wall: 'south' },
    ],
    skylights: [],
    ...stamp,
    ...changes,
  };
}

const typeA: LuminaireTypeRecord = {
  id: 'a1',
  tag: 'A',
  description: '2×4 troffer',
  inputWatts: '30',
  use: 'general',
  basis: 'rated',
  ...stamp,
};
const lot: ExteriorApplicationRecord = {
  id: 'e1',
  key: 'parking-lots-and-drives',
  description: 'North lot',
  quantity: '4000',
  installedWatts: '150',
  controls: [],
  ...stamp,
};
const setup: SetupSnapshot = {
  name: 'Tidewater Clinic',
  address: null,
  latitude: '47.04',
  longitude: '-122.9',
  timeZone: 'America/Los_Angeles',
  jurisdiction: null,
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'ip',
  lightingZone: 2,
  version: 3,
};

let nextId = 100;
function entry(
  fields: Omit<HistoryEntry, 'id' | 'at' | 'user' | 'restorable' | 'entityId' | 'name'> & Partial<HistoryEntry>,
): HistoryEntry {
  return {
    id: String(nextId++),
    at: '2026-03-02T10:15:00Z',
    user: ines,
    entityId: 'x',
    name: null,
    restorable: false,
    ...fields,
  } as HistoryEntry;
}

const say = (item: HistoryEntry, units: 'ip' | 'si' = 'ip') => describeEntry(item, labels, units).sentence;

describe('a history entry in words', () => {
  describe('spaces', () => {
    it('lists only the changed fields, with labels and the project units', () => {
      const change = entry({
        entity: 'space',
        action: 'update',
        name: 'Exam 1',
        before: space(),
        after: space({ area: '150', ceilingHeight: '10', version: 2 }),
      });
      expect(say(change)).toBe('Ines Halvorsen changed space “Exam 1”: floor area 120 → 150 ft²; ceiling height 9 → 10 ft');
      expect(say(change, 'si')).toBe('Ines Halvorsen changed space “Exam 1”: floor area 120 → 150 m²; ceiling height 9 → 10 m');
    });

    it('sums up children: luminaire counts, controls, windows', () => {
      const before = space({ controls: [{ strategy: 'time-switch', provided: true }] });
      const after = space({
        luminaires: [
          { tag: 'A', count: '6', luminaireTypeId: 'a1' },
          { tag: 'B', count: '2', luminaireTypeId: 'b1' },
        ],
        controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: '15', autoOn: 'manual' }],
        windows: [...before.windows, { width: '3', headHeight: '7', wall: 'north' }],
      });
      const words = describeEntry(entry({ entity: 'space', action: 'update', name: 'Exam 1', before, after }), labels, 'ip');
      expect(words.changes).toEqual([
        'luminaires: A × 4 → A × 6, B × 2 added',
        'controls: occupant sensor added',
        'controls: time-switch control removed',
        '2 windows → 3 windows',
      ]);
    });

    it('says what changed inside a control, and names the type and level in words', () => {
      const before = space({ controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: '15', device: 'Wall sensor' }] });
      const after = space({
        level: 'Level 2',
        spaceType: 'storage-room',
        controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: '20', reductionPercent: '50', device: 'Ceiling sensor' }],
      });
      expect(describeEntry(entry({ entity: 'space', action: 'update', name: 'Exam 1', before, after }), labels, 'ip').changes).toEqual([
        'level “Level 1” → “Level 2”',
        'space type Office — Enclosed → Storage Room',
        'controls: occupant sensor time-out 15 → 20 min, reduction set to 50 %, device “Wall sensor” → “Ceiling sensor”',
      ]);
    });

    it('reads a set value and a cleared one', () => {
      const before = space({ ceilingHeight: undefined, length: '12' });
      const after = space({ ceilingHeight: '10', length: undefined, rooms: '4' });
      expect(describeEntry(entry({ entity: 'space', action: 'update', name: 'Exam 1', before, after }), labels, 'si').changes).toEqual([
        'like rooms in the entry set to 4',
        'ceiling height set to 10 m',
        'room length cleared (was 12 m)',
      ]);
    });

    it('reads a save that changed nothing shown as such', () => {
      expect(
        say(
          entry({
            entity: 'space',
            action: 'update',
            name: 'Exam 1',
            before: space(),
            after: space({ version: 2, updatedAt: '2026-03-03T09:00:00Z' }),
          }),
        ),
      ).toBe('Ines Halvorsen saved space “Exam 1” without a change');
    });

    it('adds, imports, deletes and restores', () => {
      expect(say(entry({ entity: 'space', action: 'create', name: 'Exam 1', before: null, after: space() }))).toBe(
        'Ines Halvorsen added space “Exam 1” (Level 1, 120 ft², Office — Enclosed)',
      );
      expect(say(entry({ entity: 'space', action: 'import', name: 'Exam 1', before: null, after: space() }), 'si')).toBe(
        'Ines Halvorsen imported space “Exam 1” from a spreadsheet (Level 1, 120 m², Office — Enclosed)',
      );
      expect(say(entry({ entity: 'space', action: 'delete', name: 'Exam 1', before: space(), after: null, restorable: true }))).toBe(
        'Ines Halvorsen deleted space “Exam 1” (Level 1, 120 ft², Office — Enclosed)',
      );
      expect(say(entry({ entity: 'space', action: 'restore', name: 'Exam 1', before: null, after: space() }))).toBe(
        'Ines Halvorsen restored space “Exam 1”',
      );
    });

    it('reads one import as one line', () => {
      const at = '2026-03-02T11:00:00Z';
      // Newest first, as the history lists them.
      const rows = ['Exam 1', 'Exam 2', 'Exam 3', 'Exam 4', 'Exam 5']
        .map((name) => entry({ entity: 'space', action: 'import', name, at, before: null, after: space({ name }) }))
        .reverse();
      const other = entry({ entity: 'space', action: 'delete', name: 'Store', before: space({ name: 'Store' }), after: null });
      const items = historyItems([...rows, other]);
      expect(items.map((item) => (item.kind === 'import' ? item.entries.length : item.kind))).toEqual([5, 'entry']);
      expect(describeImport(rows, labels, 'ip').sentence).toBe(
        'Ines Halvorsen imported 5 spaces from a spreadsheet: “Exam 1”, “Exam 2”, “Exam 3” and 2 more',
      );
    });
  });

  describe('luminaire types and exterior applications', () => {
    it('reads a luminaire type by its tag, its watts and words for its use and basis', () => {
      expect(say(entry({ entity: 'luminaire-type', action: 'create', name: 'A', before: null, after: typeA }))).toBe(
        'Ines Halvorsen added luminaire type “A” (30 W, general lighting)',
      );
      const changed = { ...typeA, inputWatts: '28', basis: 'line-voltage-track' as const, length: '12', version: 2 };
      expect(say(entry({ entity: 'luminaire-type', action: 'update', name: 'A', before: typeA, after: changed }))).toBe(
        'Ines Halvorsen changed luminaire type “A”: rated input 30 → 28 W; wattage basis rated input watts → line-voltage track (by length or limiter); track length set to 12 ft',
      );
      expect(say(entry({ entity: 'luminaire-type', action: 'delete', name: 'A', before: typeA, after: null }))).toBe(
        'Ines Halvorsen deleted luminaire type “A” (30 W, general lighting)',
      );
    });

    it('reads an exterior application by its description and catalogue name, the quantity in its unit', () => {
      expect(say(entry({ entity: 'exterior-application', action: 'delete', name: 'North lot', before: lot, after: null }))).toBe(
        'Ines Halvorsen deleted exterior application “North lot” (Parking lots and drives, 4,000 ft², 150 W installed)',
      );
      const bigger = { ...lot, quantity: '5000', controls: [{ strategy: 'exterior-daylight-off', provided: true }], version: 2 };
      expect(say(entry({ entity: 'exterior-application', action: 'update', name: 'North lot', before: lot, after: bigger }), 'si')).toBe(
        'Ines Halvorsen changed exterior application “North lot” (Parking lots and drives): quantity 4,000 → 5,000 m²; controls: off in daylight added',
      );
      const walkway = { ...lot, key: 'walkways-narrow', description: '', quantity: '300' };
      expect(say(entry({ entity: 'exterior-application', action: 'create', name: 'walkways-narrow', before: null, after: walkway }))).toBe(
        'Ines Halvorsen added exterior application “Walkways less than 10 feet wide” (300 linear ft, 150 W installed)',
      );
      // The reason's words are the project's own list (contract/editions.ts, from memory).
      const exempt = { ...lot, exemptWatts: '60', exemptReason: 'athletic-playing-area' as const, exemptNote: 'Court lights', version: 2 };
      expect(say(entry({ entity: 'exterior-application', action: 'update', name: 'North lot', before: lot, after: exempt }))).toBe(
        'Ines Halvorsen changed exterior application “North lot” (Parking lots and drives): exempt set to 60 W; reason it is exempt set to lighting of athletic playing areas; exemption note set to “Court lights”',
      );
    });
  });

  describe('submittal packages', () => {
    it('tells a draft from the final package, with its revision and the start of its fingerprint', () => {
      const made = (draft: boolean) =>
        entry({
          entity: 'package',
          action: 'create',
          before: null,
          after: null,
          package: { revision: 3, draft, fingerprint: 'ab'.repeat(32) },
        });
      expect(say(made(true))).toBe('Ines Halvorsen made a draft submittal package, revision 3: fingerprint abababababab…');
      expect(say(made(false))).toBe('Ines Halvorsen made the final submittal package, revision 3: fingerprint abababababab…');
    });
  });

  describe('the project and its team', () => {
    it('reads set-up changes with the edition and method in words', () => {
      const after = {
        ...setup,
        jurisdiction: 'Tidewater County',
        edition: 'ashrae-90.1-2019' as const,
        method: 'building-area' as const,
        lightingZone: 3,
        version: 4,
      };
      expect(say(entry({ entity: 'project', action: 'update', name: 'Tidewater Clinic', before: setup, after }))).toBe(
        'Ines Halvorsen changed the set-up: jurisdiction set to “Tidewater County”; code edition IECC 2021 → ASHRAE/IES 90.1-2019; compliance method space-by-space method → building area method; exterior lighting zone 2 → 3',
      );
      const amended = describeEntry(
        entry({
          entity: 'project',
          action: 'update',
          name: 'x',
          before: { ...setup, amendments: [] },
          after: { ...setup, amendments: ['washington-2021'] },
        }),
        labels,
        'ip',
      );
      expect(amended.changes).toEqual(['jurisdiction amendments: model code only → 1 chosen']);
      expect(say(entry({ entity: 'project', action: 'create', name: 'Tidewater Clinic', before: null, after: setup }))).toBe(
        'Ines Halvorsen created the project “Tidewater Clinic”',
      );
    });

    it('reads the permit fields and the time zone in words, and a copy with its original', () => {
      // Invented permit details; America/Los_Angeles keeps UTC−8 as standard time (IANA tz database).
      const before = { ...setup, timeZone: 'America/Denver', permitNumber: null, scope: null, grossFloorArea: '2400' };
      const after = {
        ...setup,
        permitNumber: 'BP-2026-0417',
        owner: 'Town of Tidewater',
        scope: 'alteration' as const,
        grossFloorArea: '2600',
        contractorLicence: 'EC-7731',
      };
      const words = describeEntry(entry({ entity: 'project', action: 'update', name: 'Tidewater Clinic', before, after }), labels, 'ip');
      expect(words.changes).toEqual([
        expect.stringMatching(/^time zone Denver \(America\) — Mountain Time, UTC−7 → Los Angeles \(America\) — Pacific Time, UTC−8$/),
        'permit number set to “BP-2026-0417”',
        'owner set to “Town of Tidewater”',
        'scope of work set to alteration',
        'gross floor area 2,400 → 2,600 ft²',
        'contractor’s licence number set to “EC-7731”',
      ]);
      // An entry written before the permit fields existed has none of them: nothing is said about them.
      expect(
        describeEntry(
          entry({ entity: 'project', action: 'update', name: 'x', before: setup, after: { ...setup, permitNumber: null } }),
          labels,
          'ip',
        ).summary,
      ).toBe('saved the set-up without a change');
      expect(
        say(
          entry({
            entity: 'project',
            action: 'copy',
            name: 'Tidewater Clinic (copy)',
            before: null,
            after: setup,
            copiedFrom: { id: 'p1', name: 'Tidewater Clinic' },
          }),
        ),
      ).toBe('Ines Halvorsen made this project “Tidewater Clinic (copy)” as a copy of “Tidewater Clinic”');
    });

    it('reads a sales floor’s claims on an additional allowance', () => {
      const claim = { id: 'c1', spaceId: 's1', allowance: 'retail-area-3', area: '800', ...stamp };
      expect(say(entry({ entity: 'additional-allowance', action: 'create', name: 'Sales floor', before: null, after: claim }))).toBe(
        'Ines Halvorsen claimed an additional allowance on “Sales floor” for 800 ft²',
      );
      expect(
        say(
          entry({
            entity: 'additional-allowance',
            action: 'update',
            name: 'Sales floor',
            before: claim,
            after: { ...claim, area: '1000' },
          }),
        ),
      ).toBe('Ines Halvorsen changed an additional allowance claimed on “Sales floor”: area claimed 800 → 1,000 ft²');
      expect(say(entry({ entity: 'additional-allowance', action: 'delete', name: 'Sales floor', before: claim, after: null }))).toBe(
        'Ines Halvorsen removed an additional allowance claimed on “Sales floor” for 800 ft²',
      );
      expect(say(entry({ entity: 'additional-allowance', action: 'restore', name: 'Sales floor', before: null, after: claim }))).toBe(
        'Ines Halvorsen restored an additional allowance claimed on “Sales floor” for 800 ft²',
      );
    });

    it('reads a change of units with what was converted', () => {
      const conversion = {
        from: 'ip' as const,
        to: 'si' as const,
        rows: { spaces: 29, space_windows: 4, space_skylights: 0, luminaire_types: 1 },
      };
      expect(
        say(
          entry({
            entity: 'project',
            action: 'convert-units',
            name: 'Tidewater Clinic',
            before: setup,
            after: { ...setup, units: 'si', version: 4 },
            conversion,
          }),
        ),
      ).toBe('Ines Halvorsen changed the units from IP to SI (29 spaces, 4 windows and 1 luminaire type converted)');
      const empty = { from: 'si' as const, to: 'ip' as const, rows: { spaces: 0 } };
      expect(
        say(
          entry({
            entity: 'project',
            action: 'convert-units',
            name: 'x',
            before: { ...setup, units: 'si' },
            after: setup,
            conversion: empty,
          }),
        ),
      ).toBe('Ines Halvorsen changed the units from SI to IP (nothing stored needed converting)');
    });

    it('reads archiving and bringing back', () => {
      expect(say(entry({ entity: 'project', action: 'archive', name: 'Tidewater Clinic', before: null, after: null }))).toBe(
        'Ines Halvorsen archived the project',
      );
      expect(say(entry({ entity: 'project', action: 'unarchive', name: 'Tidewater Clinic', before: null, after: null }))).toBe(
        'Ines Halvorsen unarchived the project',
      );
    });

    it('reads team changes with the role in words, and an address that added no one in neutral words', () => {
      const member = (
        action: 'add-member' | 'change-role' | 'remove-member' | 'add-member-no-account',
        before: { role: 'reviewer' } | null,
        after: { role: 'contractor' | 'engineer' } | null,
      ) => say(entry({ entity: 'project_member', action, name: 'contractor@alderbay.example', before, after }));
      expect(member('add-member', null, { role: 'contractor' })).toBe(
        'Ines Halvorsen added contractor@alderbay.example to the team as contractor',
      );
      expect(member('change-role', { role: 'reviewer' }, { role: 'engineer' })).toBe(
        'Ines Halvorsen changed the role of contractor@alderbay.example from reviewer to engineer',
      );
      expect(member('remove-member', { role: 'reviewer' }, null)).toBe(
        'Ines Halvorsen removed contractor@alderbay.example from the team (was reviewer)',
      );
      expect(member('add-member-no-account', null, null)).toBe(
        'Ines Halvorsen asked to add contractor@alderbay.example to the team; no one was added',
      );
    });

    it('reads a verdict with its comment, a reply and a bulk confirmation of the check items', () => {
      const title = '101 Entry lobby: Occupancy sensing';
      const review = (action: 'verdict' | 'reply' | 'bulk-confirm', detail: object, name: string | null = title) =>
        entry({ entity: 'review-item', action, name, before: null, after: null, review: { round: 1, ...detail } });
      expect(say(review('verdict', { verdict: 'needs-revision', comment: 'Show the sensor’s time-out.' }))).toBe(
        'Ines Halvorsen marked the check item “101 Entry lobby: Occupancy sensing” as ‘Needs revision’: comment: “Show the sensor’s time-out.”',
      );
      expect(say(review('verdict', { verdict: 'not-applicable' }))).toBe(
        'Ines Halvorsen marked the check item “101 Entry lobby: Occupancy sensing” as ‘Not applicable’',
      );
      expect(say(review('reply', { text: 'Changed to 15 minutes.' }))).toBe(
        'Ines Halvorsen replied on the check item “101 Entry lobby: Occupancy sensing”: “Changed to 15 minutes.”',
      );
      expect(say(review('bulk-confirm', { verdict: 'confirmed', kind: 'daylight-response', count: 4 }, 'Daylight response'))).toBe(
        'Ines Halvorsen confirmed every Daylight response item that had no verdict (4 items)',
      );
      expect(say(review('bulk-confirm', { verdict: 'confirmed', unchanged: true, count: 1 }, 'unchanged items'))).toBe(
        'Ines Halvorsen confirmed every unchanged check item that had no verdict (1 item)',
      );
      expect(describeEntry(review('reply', { text: 'x' }), labels, 'ip').icon).toBe('forum');
    });

    it('reads a functional test and its retest, with the measured values and notes', () => {
      const test = (action: 'record' | 'retest', fieldTest: FieldTestHistoryDetail) =>
        entry({ entity: 'field-test', action, name: 'Occupant sensor in 201 Makerspace', before: null, after: null, fieldTest });
      expect(
        say(
          test('record', {
            result: 'fail',
            measured: { timeoutMinutes: '35', lightLevel: '42.5' },
            lightLevelUnit: 'fc',
            notes: 'Stays on.',
            retest: false,
          }),
        ),
      ).toBe(
        'Ines Halvorsen tested “Occupant sensor in 201 Makerspace”, which failed: time-out 35 min; light level 42.5 fc; notes: “Stays on.”',
      );
      expect(say(test('retest', { result: 'pass', measured: { overrideMinutes: '120' }, retest: true }))).toBe(
        'Ines Halvorsen retested “Occupant sensor in 201 Makerspace”, which passed: override 120 min',
      );
      expect(say(test('record', { result: 'pass', measured: { lightLevel: '300' }, lightLevelUnit: 'lux', retest: false }))).toBe(
        'Ines Halvorsen tested “Occupant sensor in 201 Makerspace”, which passed: light level 300 lx',
      );
      expect(describeEntry(test('retest', { result: 'pass', retest: true }), labels, 'ip').icon).toBe('replay');
    });

    it('reads a saved exterior schedule, from what it was to what it is', () => {
      const before = { onMinutesBeforeSunset: 10, offMinutesAfterSunrise: 10, setback: { start: '00:00', end: '06:00' } };
      const after = {
        onMinutesBeforeSunset: 15,
        offMinutesAfterSunrise: 20,
        setback: { start: '23:00', end: '06:00', reductionPercent: 50 },
      };
      expect(say(entry({ entity: 'exterior-schedule', action: 'update', before, after }))).toBe(
        'Ines Halvorsen saved the exterior schedule: from on 10 min before sunset, off 10 min after sunrise, set back 00:00–06:00 by the edition’s reduction; to on 15 min before sunset, off 20 min after sunrise, set back 23:00–06:00 by 50 %',
      );
      expect(say(entry({ entity: 'exterior-schedule', action: 'create', before: null, after: { ...after, setback: null } }))).toBe(
        'Ines Halvorsen saved the exterior schedule: to on 15 min before sunset, off 20 min after sunrise, no night setback',
      );
    });

    it('reads invitations: sent, withdrawn, and accepted by the person who joined', () => {
      const invitation = (
        action: 'invite' | 'withdraw-invitation' | 'accept-invitation',
        before: { role: 'reviewer' } | null,
        after: { role: 'reviewer'; expiresAt?: string } | null,
        user = ines,
      ) => say(entry({ entity: 'invitation', action, name: 'surveyor@elsewhere.example', before, after, user }));
      expect(invitation('invite', null, { role: 'reviewer', expiresAt: '2026-03-09T10:15:00Z' })).toBe(
        'Ines Halvorsen invited surveyor@elsewhere.example by e-mail to join the team as reviewer',
      );
      expect(invitation('withdraw-invitation', { role: 'reviewer' }, null)).toBe(
        'Ines Halvorsen withdrew the invitation of surveyor@elsewhere.example (as reviewer)',
      );
      expect(invitation('accept-invitation', null, { role: 'reviewer' }, { id: 'u9', name: 'Noor Castellanos' })).toBe(
        'Noor Castellanos accepted the invitation sent to surveyor@elsewhere.example and joined the team as reviewer',
      );
    });

    it('names someone whose account is gone without an id', () => {
      expect(say(entry({ entity: 'project', action: 'archive', user: null, name: 'x', before: null, after: null }))).toBe(
        'Someone archived the project',
      );
    });
  });

  it('never shows a key, field name, id or table name, even with no labels at hand', () => {
    const all: HistoryEntry[] = [
      entry({
        entity: 'space',
        action: 'update',
        name: 'Exam 1',
        before: space({ controls: [{ strategy: 'occupant-sensor', provided: true }] }),
        after: space({
          spaceType: 'storage-room',
          controlSpaceType: 'office-enclosed',
          controls: [{ strategy: 'occupant-sensor', provided: false, exceptionReason: 'exit-stairway-ramp-passageway' }],
        }),
      }),
      entry({ entity: 'space', action: 'delete', name: 'Exam 1', before: space(), after: null }),
      entry({
        entity: 'luminaire-type',
        action: 'update',
        name: 'A',
        before: typeA,
        after: { ...typeA, use: 'exempt', exemptReason: 'Exit signs' },
      }),
      entry({
        entity: 'exterior-application',
        action: 'create',
        name: 'parking-lots-and-drives',
        before: null,
        after: { ...lot, description: '' },
      }),
      entry({
        entity: 'project',
        action: 'convert-units',
        name: 'x',
        before: setup,
        after: { ...setup, units: 'si' },
        conversion: { from: 'ip', to: 'si', rows: { spaces: 2, some_new_table: 3 } },
      }),
      entry({
        entity: 'project',
        action: 'update',
        name: 'x',
        before: setup,
        after: { ...setup, timeZone: 'America/Los_Angeles', edition: 'ashrae-90.1-2022' },
      }),
      entry({
        entity: 'project_member',
        action: 'add-member',
        name: 'reviewer@alderbay.example',
        before: null,
        after: { role: 'reviewer' },
      }),
      entry({
        entity: 'review-item',
        action: 'bulk-confirm',
        name: 'Automatic shutoff',
        before: null,
        after: null,
        review: { round: 2, verdict: 'confirmed', kind: 'automatic-shutoff', count: 3 },
      }),
      entry({
        entity: 'review-item',
        action: 'verdict',
        name: null,
        before: null,
        after: null,
        review: { round: 1, verdict: 'needs-revision' },
      }),
    ];
    for (const item of all) {
      const words = describeEntry(item, noLabels, 'ip').sentence;
      expect(words, words).not.toMatch(/\b[a-z0-9]+(-[a-z0-9]+){2,}\b/); // no-hyphen-keys
      expect(words, words).not.toMatch(
        /_|luminaire-type|exterior-application|project_member|convert-units|controlSpaceType|spaceType|ceilingHeight|inputWatts|7d3f0e7c/,
      );
    }
    expect(describeEntry(all[0]!, noLabels, 'ip').changes).toEqual([
      'space type office enclosed → storage room',
      'space type for controls set to office enclosed',
      'controls: occupant sensor no longer provided, exception claimed (interior exit stairway, exit ramp or exit passageway)',
    ]);
  });

  it('names the item brought back', () => {
    expect(
      restoredWords(entry({ entity: 'space', action: 'delete', name: 'Exam 3', before: space({ name: 'Exam 3' }), after: null }), labels),
    ).toBe('Space “Exam 3” restored');
    const claim = { id: 'c1', spaceId: 's1', allowance: 'retail-area-3', area: '800', ...stamp };
    expect(
      restoredWords(entry({ entity: 'additional-allowance', action: 'delete', name: 'Sales floor', before: claim, after: null }), labels),
    ).toBe('The claim on “Sales floor” restored');
  });
});

describe('the units of an entry', () => {
  const conversion = (id: string, from: 'ip' | 'si', to: 'ip' | 'si') =>
    entry({
      id,
      entity: 'project',
      action: 'convert-units',
      name: 'x',
      before: { ...setup, units: from },
      after: { ...setup, units: to },
      conversion: { from, to, rows: {} },
    });

  it('are those the project has, unless the units were changed since', () => {
    const changes = unitsChanges([conversion('500', 'ip', 'si')]);
    expect(unitsAtEntry('499', 'si', changes)).toBe('ip');
    expect(unitsAtEntry('501', 'si', changes)).toBe('si');
  });

  it('are those before the first change of units made after the entry', () => {
    // Newest first, as the history lists them: back to IP at 900, to SI at 500.
    const changes = unitsChanges([conversion('900', 'si', 'ip'), conversion('500', 'ip', 'si')]);
    expect(unitsAtEntry('950', 'ip', changes)).toBe('ip');
    expect(unitsAtEntry('700', 'ip', changes)).toBe('si');
    expect(unitsAtEntry('12', 'ip', changes)).toBe('ip');
  });
});

describe('the time of an entry', () => {
  const now = new Date('2026-03-02T12:00:00Z');
  it('reads relative to now', () => {
    expect(relativeTime('2026-03-02T11:59:50Z', now)).toBe('just now');
    expect(relativeTime('2026-03-02T11:55:00Z', now)).toBe('5 minutes ago');
    expect(relativeTime('2026-03-02T09:00:00Z', now)).toBe('3 hours ago');
    expect(relativeTime('2026-03-01T10:00:00Z', now)).toBe('yesterday');
    expect(relativeTime('2026-02-16T12:00:00Z', now)).toBe('2 weeks ago');
    expect(relativeTime('2025-11-02T12:00:00Z', now)).toBe('4 months ago');
  });
});
