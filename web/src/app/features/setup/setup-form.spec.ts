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
} as ProjectDetail;

describe('the set-up form', () => {
  it('checks the same ranges and time zones as the service, with its wording', () => {
    const form = setupForm();
    const site = form.controls.site.controls;
    site.latitude.setValue('91');
    site.longitude.setValue('-122.9');
    site.timeZone.setValue('Pacific/Nowhere');
    expect(site.latitude.errors).toEqual({ range: 'Latitude must be a decimal number from -90 to 90.' });
    expect(site.longitude.errors).toBeNull();
    expect(site.timeZone.errors).toEqual({ timeZone: 'Use an IANA time zone such as America/Los_Angeles.' });
    site.latitude.setValue('4e1');
    expect(site.latitude.errors).not.toBeNull();
    expect(form.controls.identity.controls.name.errors).toEqual({ required: true });
  });

  it('round-trips a project and sends blanks as null', () => {
    const form = setupForm();
    fillSetup(form, project);
    form.controls.identity.controls.address.setValue('  ');
    expect(setupValue(form)).toEqual({
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
    });
  });

  it('puts the service\'s messages beside the fields they name and returns the rest', () => {
    const form = setupForm();
    const unplaced = showServerErrors(form, [
      { path: 'edition', message: 'Choose one of ashrae-90.1-2019, ashrae-90.1-2022, iecc-2021.' },
      { path: 'version', message: 'Required.' },
    ]);
    expect(form.controls.code.controls.edition.errors).toEqual({ server: 'Choose one of ashrae-90.1-2019, ashrae-90.1-2022, iecc-2021.' });
    expect(unplaced).toEqual([{ path: 'version', message: 'Required.' }]);
  });
});
