import type { ControlLine, EvaluationResult, SpaceResult, UnverifiedValue } from '../../core/api/api-types';

/**
 * A fixed evaluation for the results specs. Every figure here is invented for the tests (a demo
 * building, not a code table); only its shape follows the service's result.
 */
/** An unverified value as the service cites it (invented wording). */
export const invented: UnverifiedValue = {
  id: 'Invented value',
  what: 'Invented value',
  source: 'IECC 2021 Section C405.9.9 — not yet checked against the printed code',
  note: 'An invented note about 5,000 ft² zones.',
  citation: {
    short: 'IECC 2021 Section C405.9.9 — not yet checked against the printed code',
    layer: 'not-checked',
    checked: false,
    note: 'An invented note about 5,000 ft² zones.',
  },
};

export function controlLine(overrides: Partial<ControlLine>): ControlLine {
  return {
    strategy: 'occupant-sensor',
    label: 'Occupant sensor',
    requirement: 'required',
    met: true,
    status: 'met',
    reason: 'Required: invented reason; provided.',
    section: 'C405.2.1',
    verified: true,
    ...overrides,
  };
}

export function spaceResult(overrides: Partial<SpaceResult>): SpaceResult {
  return {
    id: 's1',
    name: 'Reading room',
    level: 'Level 1',
    area: '1000',
    lpdBasis: { kind: 'space-type', key: 'reading', label: 'Reading area' },
    allowanceW: '1000',
    additionalAllowanceW: '0',
    installedW: '800',
    lighting: 'entered',
    generalW: '800',
    decorativeW: '0',
    displayW: '0',
    exemptW: '0',
    allowedLpd: '1',
    installedLpd: '0.8',
    withinAllowance: true,
    marginW: '200',
    marginPct: '20',
    rcr: null,
    roomGeometryIncreaseApplied: false,
    luminaires: [],
    daylight: {
      geometryEvaluated: false,
      windowArea: '0',
      primarySidelitArea: '0',
      secondarySidelitArea: '0',
      toplitArea: '0',
      primarySidelitW: '0',
      secondarySidelitW: '0',
      toplitW: '0',
      sidelightingControlRequired: false,
      secondarySidelightingControlRequired: false,
      toplightingControlRequired: false,
      reasons: [],
      zones: [],
      section: 'C405.2.4',
    },
    controls: [controlLine({})],
    exempt: [],
    unverified: [],
    section: 'C405.3.2.2',
    ...overrides,
  };
}

export function evaluation(): EvaluationResult {
  return {
    edition: 'iecc-2021',
    dataVersion: 'test',
    amendments: [],
    method: 'space-by-space',
    units: 'ip',
    complies: false,
    verdict: 'does-not-comply',
    openItems: { spacesWithoutLuminaires: 0, controlsToVerify: 0 },
    interior: {
      section: 'C405.3.2.2',
      area: '1500',
      allowanceW: '1500',
      installedW: '1330',
      exemptW: '25',
      decorativeW: '0',
      displayW: '0',
      marginW: '170',
      marginPct: '11.333333',
      complies: true,
      additional: null,
      spaces: [
        spaceResult({}),
        spaceResult({
          id: 's2',
          name: 'Storage',
          level: 'Level 2',
          area: '500',
          allowanceW: '500',
          installedW: '530',
          installedLpd: '1.06',
          withinAllowance: false,
          marginW: '-30',
          marginPct: '-6',
          controls: [
            controlLine({
              strategy: 'light-reduction',
              label: 'Light-reduction control',
              status: 'not-met',
              met: false,
              section: 'C405.2.3',
              verified: false,
            }),
          ],
          unverified: [invented.id],
        }),
      ],
      levels: [
        { level: 'Level 1', area: '1000', allowanceW: '1000', installedW: '800', marginW: '200' },
        { level: 'Level 2', area: '500', allowanceW: '500', installedW: '530', marginW: '-30' },
      ],
    },
    exterior: null,
    controlsComply: false,
    unverifiedValues: [invented],
    cautions: ['Energy code only (test caution).'],
  };
}
