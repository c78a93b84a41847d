import type { ProjectDetail } from '../../core/api/api-types';
import { fillSetup, setupForm, setupValue, showServerErrors } from './setup-form';

// The demo scenario's invented site (NAMES.md): 47.04° N, 122.90° W, America/Los_Angeles, lighting zone 2.
const project = {
  id: 'p1',
  name: 'Harbour Pavilion',
  address: null,
  latitude: '47.04',
  longitude: '-122.9',
  timeZone: 'America/Los_Angeles',
  jurisdiction: 'Alder Bay Building Department',
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'ip',
  lightingZone: 2,
  // The amendment reference/iecc-2021/amendments.json holds.
  amendments: ['washington-2021'],
  // Invented permit details for the test.
  permitNumber: 'BP-2026-0142',
  owner: 'Alder Bay Harbour Trust',
  occupancy: null,
  scope: 'new-building',
  grossFloorArea: '2400',
  designerName: null,
  designerFirm: null,
  designerLicence: null,
  contractorName: 'Noor Abernathy',
  contractorFirm: null,
  contractorLicence: null,
  contractorContact: null,
} as ProjectDetail;

describe('the set-up form', () => {
  it('checks the same ranges and time zones as the service, with its wording', () => {
    const form = setupForm();
    const site = form.controls.site.controls;
    site.latitude.setValue('91');
    site.longitude.setValue('122 54 W');
    site.timeZone.setValue('Pacific/Nowhere');
    expect(site.latitude.errors).toEqual({ coordinate: 'Latitude is from 90° S to 90° N: −90 to 90 in decimal degrees.' });
    expect(site.longitude.errors).toBeNull();
    expect(site.timeZone.errors).toEqual({
      timeZone: 'Choose a time zone from the list: type a city, a region or a name such as Pacific.',
    });
    site.latitude.setValue('4e1');
    expect(site.latitude.errors).not.toBeNull();
    expect(form.controls.identity.controls.name.errors).toEqual({ required: true });
    // The service's floor-area range (compliance/bounds.ts), in its words.
    const area = form.controls.building.controls.grossFloorArea;
    area.setValue('99999999999');
    expect(area.errors).toEqual({ quantity: 'Out of range. Enter a number greater than 0 and at most 5,000,000.' });
    area.setValue('-5');
    expect(area.errors).toEqual({ quantity: 'Must not be negative. Enter a number greater than 0 and at most 5,000,000.' });
    area.setValue('2400');
    expect(area.errors).toBeNull();
  });

  it('round-trips a project with its permit fields and sends blanks as null', () => {
    const form = setupForm();
    fillSetup(form, project);
    form.controls.identity.controls.address.setValue('  ');
    expect(setupValue(form)).toEqual({
      name: 'Harbour Pavilion',
      address: null,
      permitNumber: 'BP-2026-0142',
      owner: 'Alder Bay Harbour Trust',
      latitude: '47.04',
      longitude: '-122.9',
      timeZone: 'America/Los_Angeles',
      jurisdiction: 'Alder Bay Building Department',
      edition: 'iecc-2021',
      method: 'space-by-space',
      units: 'ip',
      amendments: ['washington-2021'],
      occupancy: null,
      scope: 'new-building',
      grossFloorArea: '2400',
      lightingZone: 2,
      designerName: null,
      designerFirm: null,
      designerLicence: null,
      contractorName: 'Noor Abernathy',
      contractorFirm: null,
      contractorLicence: null,
      contractorContact: null,
    });
  });

  it('sends coordinates typed in degrees and minutes as decimal degrees', () => {
    const form = setupForm();
    fillSetup(form, project);
    // Worked by hand (common practice): 47° 02′ 24″ N = 47.04; 122° 54′ W = −122.9.
    form.controls.site.controls.latitude.setValue('47°02′24″N');
    form.controls.site.controls.longitude.setValue('122 54 W');
    expect(setupValue(form)).toMatchObject({ latitude: '47.04', longitude: '-122.9' });
  });

  it("puts the service's messages beside the fields they name and returns the rest", () => {
    const form = setupForm();
    const unplaced = showServerErrors(form, [
      { path: 'edition', message: 'Choose one of ashrae-90.1-2019, ashrae-90.1-2022, iecc-2021.' },
      { path: 'contractorLicence', message: 'Use at most 100 characters.' },
      { path: 'version', message: 'Required.' },
    ]);
    expect(form.controls.code.controls.edition.errors).toEqual({ server: 'Choose one of ashrae-90.1-2019, ashrae-90.1-2022, iecc-2021.' });
    expect(form.controls.people.controls.contractorLicence.errors).toEqual({ server: 'Use at most 100 characters.' });
    expect(unplaced).toEqual([{ path: 'version', message: 'Required.' }]);
  });
});
