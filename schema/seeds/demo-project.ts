/**
 * The invented demo project: Alder Bay Library & Makerspace, two levels, about 18,000 ft², IECC 2021
 * by the space-by-space method, exterior lighting zone 2. Everything here is made up for the demo;
 * wattages are plausible LED figures, not any product's.
 */

export const demoSetup = {
  address: '210 Tideline Avenue, Alder Bay',
  latitude: '47.04',
  longitude: '-122.90',
  time_zone: 'America/Los_Angeles',
  jurisdiction: 'Alder Bay Building Department',
  edition_id: 'iecc-2021',
  method: 'space-by-space',
  units: 'ip',
  lighting_zone: 2,
} as const;

export const demoLuminaireTypes = [
  { tag: 'A', description: '2×4 LED troffer, 4000 K', inputWatts: '33', use: 'general' },
  { tag: 'B', description: '2×2 LED troffer, 3500 K', inputWatts: '26', use: 'general' },
  { tag: 'C', description: 'Linear LED pendant, 8 ft, up/down', inputWatts: '58', use: 'general' },
  { tag: 'D', description: '6 in LED downlight', inputWatts: '13', use: 'general' },
  { tag: 'E', description: '4 ft LED strip, enclosed and gasketed', inputWatts: '24', use: 'general' },
  { tag: 'F', description: 'Stack aisle linear LED, 8 ft', inputWatts: '42', use: 'general' },
  { tag: 'G', description: 'Decorative glass pendant over the café counter', inputWatts: '9', use: 'decorative' },
  {
    tag: 'T',
    description: 'Line-voltage track over the new-books wall, 8 ft with a current limiter',
    inputWatts: '180',
    use: 'general',
    basis: 'line-voltage-track',
    length: '8',
  },
  { tag: 'X', description: 'LED exit sign', inputWatts: '2', use: 'exempt', exemptReason: 'Exit sign' },
  {
    tag: 'M',
    description: 'Emergency egress unit, normally off',
    inputWatts: '4',
    use: 'exempt',
    exemptReason: 'Emergency egress lighting that is normally off',
  },
] as const;

type Control = {
  strategy: string;
  provided: boolean;
  timeoutMinutes?: string;
  reductionPercent?: string;
  autoOn?: 'manual' | 'partial' | 'full';
  device?: string;
  exceptionReason?: string;
};

const sensor = (autoOn: 'manual' | 'partial' | 'full' = 'partial'): Control => ({
  strategy: 'occupant-sensor',
  provided: true,
  timeoutMinutes: '20',
  autoOn,
  device: 'Ceiling dual-technology occupant sensor',
});
const timeSwitch: Control = { strategy: 'time-switch', provided: true, device: 'Lighting control panel schedule, astronomical clock' };
const dimming: Control = {
  strategy: 'light-reduction',
  provided: true,
  reductionPercent: '90',
  device: '0–10 V dimming wall station, down to 10 %',
};
const sidelighting: Control = {
  strategy: 'daylight-sidelighting',
  provided: true,
  device: 'Closed-loop photosensor, continuous dimming to 10 %',
};
const stepDimming: Control = {
  strategy: 'light-reduction',
  provided: true,
  reductionPercent: '50',
  device: 'Occupant sensor with a 50 % low-level step',
};
const partialOff: Control = {
  strategy: 'automatic-partial-off',
  provided: true,
  timeoutMinutes: '20',
  reductionPercent: '50',
  device: 'Corridor sensors, 50 % step when vacant',
};
// Open plan offices: zones of at most 600 ft², each reduced by at least 80 % when vacant (IECC C405.2.1.3).
const openPlanZones = (zoneSize: string): Control & { zoneSize: string } => ({
  strategy: 'automatic-partial-off',
  provided: true,
  timeoutMinutes: '20',
  reductionPercent: '80',
  zoneSize,
  device: 'Zoned ceiling sensors, each vacant zone down to 20 %',
});
const specific: Control = {
  strategy: 'specific-application',
  provided: true,
  device: 'Separate switch leg for display and decorative lighting',
};

interface DemoSpace {
  name: string;
  level: string;
  spaceType: string;
  area: string;
  length?: string;
  width?: string;
  ceilingHeight?: string;
  enclosed?: boolean;
  luminaires: { tag: string; count: number; zone?: 'primary-sidelit' | 'secondary-sidelit' | 'toplit' }[];
  controls: Control[];
  /** Glazing: low-e double glazing, visible transmittance about 0.6 (invented, a plausible figure); nothing outside blocks the daylight. */
  windows?: {
    width: string;
    headHeight: string;
    sillHeight?: string;
    wall: 'north' | 'east' | 'south' | 'west';
    offset?: string;
    visibleTransmittance?: string;
    daylightBlocked?: boolean;
  }[];
}

const l1 = 'Level 1';
const l2 = 'Level 2';

/** An enclosed staff office on level 2 with one east window; the luminaires nearest it are in the primary sidelit zone. */
function office(name: string, length: string, width: string, sidelitLuminaires: number, windowWidth: string): DemoSpace {
  return {
    name,
    level: l2,
    spaceType: 'office-enclosed',
    area: String(Number(length) * Number(width)),
    length,
    width,
    ceilingHeight: '9',
    enclosed: true,
    luminaires: [
      { tag: 'B', count: sidelitLuminaires, zone: 'primary-sidelit' },
      { tag: 'B', count: 2 },
    ],
    controls: [sensor('manual'), dimming],
    windows: [
      {
        width: windowWidth,
        headHeight: '7.5',
        sillHeight: '3',
        wall: 'east',
        offset: '2',
        visibleTransmittance: '0.55',
        daylightBlocked: false,
      },
    ],
  };
}

export const demoSpaces: DemoSpace[] = [
  {
    name: '101 Entry lobby',
    level: l1,
    spaceType: 'lobby-otherwise',
    area: '600',
    length: '30',
    width: '20',
    ceilingHeight: '12',
    luminaires: [
      { tag: 'D', count: 24 },
      { tag: 'X', count: 2 },
    ],
    controls: [timeSwitch, dimming],
  },
  {
    name: '102 Main reading room',
    level: l1,
    spaceType: 'library-in-a-reading-area',
    area: '2400',
    length: '60',
    width: '40',
    ceilingHeight: '14',
    luminaires: [
      { tag: 'C', count: 6, zone: 'primary-sidelit' },
      { tag: 'C', count: 6, zone: 'secondary-sidelit' },
      { tag: 'C', count: 14 },
      { tag: 'T', count: 1 },
      { tag: 'X', count: 2 },
      { tag: 'M', count: 4 },
    ],
    controls: [timeSwitch, dimming, sidelighting, specific],
    windows: [
      { width: '12', headHeight: '10', sillHeight: '3', wall: 'south', offset: '6', visibleTransmittance: '0.62', daylightBlocked: false },
      { width: '12', headHeight: '10', sillHeight: '3', wall: 'south', offset: '24', visibleTransmittance: '0.62', daylightBlocked: false },
      { width: '12', headHeight: '10', sillHeight: '3', wall: 'south', offset: '42', visibleTransmittance: '0.62', daylightBlocked: false },
    ],
  },
  {
    name: '103 Stacks',
    level: l1,
    spaceType: 'library-in-the-stacks',
    area: '2600',
    length: '65',
    width: '40',
    ceilingHeight: '12',
    luminaires: [
      { tag: 'F', count: 64 },
      { tag: 'X', count: 2 },
      { tag: 'M', count: 4 },
    ],
    controls: [sensor('full'), dimming],
  },
  {
    name: "104 Children's reading area",
    level: l1,
    spaceType: 'library-in-a-reading-area',
    area: '1200',
    length: '40',
    width: '30',
    ceilingHeight: '12',
    luminaires: [
      { tag: 'B', count: 8, zone: 'primary-sidelit' },
      { tag: 'B', count: 8, zone: 'secondary-sidelit' },
      { tag: 'B', count: 16 },
      { tag: 'X', count: 1 },
    ],
    controls: [timeSwitch, dimming, sidelighting],
    windows: [
      { width: '10', headHeight: '8', sillHeight: '2.5', wall: 'west', offset: '4', visibleTransmittance: '0.62', daylightBlocked: false },
      { width: '10', headHeight: '8', sillHeight: '2.5', wall: 'west', offset: '16', visibleTransmittance: '0.62', daylightBlocked: false },
    ],
  },
  {
    name: '105 Community room',
    level: l1,
    spaceType: 'conference-meeting-multipurpose-room',
    area: '1100',
    length: '44',
    width: '25',
    ceilingHeight: '11',
    luminaires: [
      { tag: 'A', count: 30 },
      { tag: 'X', count: 2 },
    ],
    controls: [sensor(), dimming],
  },
  {
    name: '106 Café',
    level: l1,
    spaceType: 'dining-area-in-cafeteria-or-fast-food-dining',
    area: '700',
    length: '35',
    width: '20',
    ceilingHeight: '11',
    luminaires: [
      { tag: 'D', count: 16 },
      { tag: 'G', count: 6 },
    ],
    controls: [timeSwitch, dimming, specific],
  },
  {
    name: '107 Café kitchen',
    level: l1,
    spaceType: 'food-preparation-area',
    area: '250',
    length: '25',
    width: '10',
    ceilingHeight: '10',
    enclosed: true,
    luminaires: [{ tag: 'E', count: 10 }],
    controls: [sensor('manual'), dimming],
  },
  {
    name: '108 Circulation workroom',
    level: l1,
    spaceType: 'office-open-plan',
    area: '500',
    length: '25',
    width: '20',
    ceilingHeight: '10',
    luminaires: [{ tag: 'B', count: 12 }],
    controls: [sensor(), dimming, openPlanZones('250')],
  },
  {
    name: '109 Restroom, women',
    level: l1,
    spaceType: 'restroom-otherwise',
    area: '280',
    length: '20',
    width: '14',
    ceilingHeight: '9',
    enclosed: true,
    luminaires: [{ tag: 'D', count: 12 }],
    controls: [sensor('full'), stepDimming],
  },
  {
    name: '110 Restroom, men',
    level: l1,
    spaceType: 'restroom-otherwise',
    area: '260',
    length: '20',
    width: '13',
    ceilingHeight: '9',
    enclosed: true,
    luminaires: [{ tag: 'D', count: 11 }],
    controls: [sensor('full'), stepDimming],
  },
  {
    name: '111 Corridor',
    level: l1,
    spaceType: 'corridor-otherwise',
    area: '900',
    length: '120',
    width: '7.5',
    ceilingHeight: '9',
    luminaires: [
      { tag: 'B', count: 16 },
      { tag: 'X', count: 3 },
      { tag: 'M', count: 4 },
    ],
    controls: [sensor('full'), partialOff],
  },
  {
    name: '112 Stair A',
    level: l1,
    spaceType: 'stairwell',
    area: '220',
    ceilingHeight: '24',
    enclosed: true,
    luminaires: [
      { tag: 'E', count: 4 },
      { tag: 'X', count: 1 },
    ],
    controls: [{ strategy: 'occupant-sensor', provided: false, exceptionReason: 'exit-stairway-ramp-passageway' }],
  },
  {
    name: '113 Electrical room',
    level: l1,
    spaceType: 'electrical-mechanical-room',
    area: '180',
    ceilingHeight: '10',
    enclosed: true,
    luminaires: [{ tag: 'E', count: 3 }],
    controls: [sensor('manual')],
  },
  {
    name: '114 Storage',
    level: l1,
    spaceType: 'storage-room',
    area: '320',
    ceilingHeight: '10',
    enclosed: true,
    luminaires: [{ tag: 'E', count: 5 }],
    controls: [sensor('manual')],
  },
  {
    name: '115 Custodial closet',
    level: l1,
    spaceType: 'storage-room',
    area: '60',
    ceilingHeight: '9',
    enclosed: true,
    luminaires: [{ tag: 'E', count: 1 }],
    controls: [sensor('manual')],
  },
  {
    name: '201 Makerspace',
    level: l2,
    spaceType: 'workshop',
    area: '1500',
    length: '50',
    width: '30',
    ceilingHeight: '12',
    luminaires: [
      { tag: 'A', count: 10, zone: 'primary-sidelit' },
      { tag: 'A', count: 10, zone: 'secondary-sidelit' },
      { tag: 'A', count: 36 },
      { tag: 'X', count: 2 },
    ],
    controls: [timeSwitch, dimming, sidelighting],
    windows: [
      { width: '16', headHeight: '9', sillHeight: '3', wall: 'north', offset: '8', visibleTransmittance: '0.58', daylightBlocked: false },
      { width: '16', headHeight: '9', sillHeight: '3', wall: 'north', offset: '28', visibleTransmittance: '0.58', daylightBlocked: false },
    ],
  },
  {
    name: '202 Tool storage',
    level: l2,
    spaceType: 'storage-room',
    area: '200',
    ceilingHeight: '10',
    enclosed: true,
    luminaires: [{ tag: 'E', count: 3 }],
    controls: [sensor('manual')],
  },
  office('203 Office', '15', '10', 2, '6'),
  office('204 Office', '15', '10', 2, '6'),
  office('205 Office, branch manager', '15', '12', 3, '8'),
  {
    name: '206 Staff workroom',
    level: l2,
    spaceType: 'office-open-plan',
    area: '700',
    length: '35',
    width: '20',
    ceilingHeight: '10',
    luminaires: [
      { tag: 'B', count: 6, zone: 'primary-sidelit' },
      { tag: 'B', count: 10 },
    ],
    controls: [sensor(), dimming, sidelighting, openPlanZones('350')],
    windows: [
      { width: '10', headHeight: '8', sillHeight: '3', wall: 'south', offset: '5', visibleTransmittance: '0.62', daylightBlocked: false },
      { width: '10', headHeight: '8', sillHeight: '3', wall: 'south', offset: '20', visibleTransmittance: '0.62', daylightBlocked: false },
    ],
  },
  {
    name: '207 Staff break room',
    level: l2,
    spaceType: 'lounge-breakroom-otherwise',
    area: '300',
    length: '20',
    width: '15',
    ceilingHeight: '9',
    enclosed: true,
    luminaires: [{ tag: 'B', count: 7 }],
    controls: [sensor(), dimming],
  },
  {
    name: '208 Group study rooms',
    level: l2,
    spaceType: 'conference-meeting-multipurpose-room',
    area: '400',
    length: '20',
    width: '20',
    ceilingHeight: '9',
    luminaires: [{ tag: 'B', count: 14 }],
    controls: [sensor(), dimming],
  },
  {
    name: '209 Copy and print',
    level: l2,
    spaceType: 'copy-print-room',
    area: '120',
    ceilingHeight: '9',
    enclosed: true,
    luminaires: [{ tag: 'E', count: 1 }],
    controls: [sensor('manual')],
  },
  {
    name: '210 Computer training lab',
    level: l2,
    spaceType: 'classroom-lecture-hall-training-room-otherwise',
    area: '700',
    length: '35',
    width: '20',
    ceilingHeight: '10',
    luminaires: [
      { tag: 'B', count: 18 },
      { tag: 'X', count: 1 },
    ],
    controls: [sensor(), dimming],
  },
  {
    name: '211 Corridor',
    level: l2,
    spaceType: 'corridor-otherwise',
    area: '800',
    length: '107',
    width: '7.5',
    ceilingHeight: '9',
    luminaires: [
      { tag: 'B', count: 14 },
      { tag: 'X', count: 3 },
      { tag: 'M', count: 4 },
    ],
    controls: [sensor('full'), partialOff],
  },
  {
    name: '212 Restroom',
    level: l2,
    spaceType: 'restroom-otherwise',
    area: '240',
    length: '16',
    width: '15',
    ceilingHeight: '9',
    enclosed: true,
    luminaires: [{ tag: 'D', count: 10 }],
    controls: [sensor('full'), stepDimming],
  },
  {
    name: '213 Stair B',
    level: l2,
    spaceType: 'stairwell',
    area: '220',
    ceilingHeight: '24',
    enclosed: true,
    luminaires: [
      { tag: 'E', count: 4 },
      { tag: 'X', count: 1 },
    ],
    controls: [{ strategy: 'occupant-sensor', provided: false, exceptionReason: 'exit-stairway-ramp-passageway' }],
  },
  {
    name: '214 Mechanical room',
    level: l2,
    spaceType: 'electrical-mechanical-room',
    area: '400',
    ceilingHeight: '12',
    luminaires: [{ tag: 'E', count: 6 }],
    controls: [timeSwitch],
  },
];

export const demoExterior = [
  { key: 'parking-lots-and-drives', description: 'East parking lot, 38 stalls and drive aisles', quantity: '12000', installedWatts: '440' },
  { key: 'walkways-less-than-10-feet-wide', description: 'Walk from the lot to the entry, 200 ft', quantity: '200', installedWatts: '80' },
  {
    key: 'pedestrian-and-vehicular-entrances-and-exits',
    description: 'Main and staff entry doors, 12 ft of door width',
    quantity: '12',
    installedWatts: '120',
  },
  { key: 'entry-canopies', description: 'Main entry canopy', quantity: '300', installedWatts: '60' },
  { key: 'building-facades', description: 'West facade wash at the reading room', quantity: '1600', installedWatts: '110' },
];
