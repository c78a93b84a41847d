import { ApiError } from '../core/http/api-error';
import { failureWords } from './write-failure';
import { problemLine, problemText } from './problem-words';

// Invented project: two spaces, two luminaire types, one exterior application.
const context = {
  spaces: [
    { id: 'a1', name: 'Apparatus bay' },
    { id: 'b2', name: 'Bunk room' },
  ],
  luminaireTags: ['H1', 'L2'],
  exteriorApplications: [{ label: 'Walkways less than 10 feet wide' }],
};

describe('service problems in words', () => {
  it('names the space at the path’s place in the document and the field by its label, linked to where it is fixed', () => {
    const line = problemLine(
      { path: 'spaces.1.area', message: 'Out of range. Enter a number greater than 0 and at most 5,000,000.' },
      context,
    );
    expect(line).toEqual({
      subject: 'Bunk room',
      field: 'Floor area',
      message: 'Out of range. Enter a number greater than 0 and at most 5,000,000.',
      link: { page: 'spaces', query: { space: 'b2', field: 'area' } },
    });
    expect(problemText(line)).toBe('Bunk room — Floor area: Out of range. Enter a number greater than 0 and at most 5,000,000.');
  });

  it('sends windows to the Daylight page, controls to the Controls page and counts to the Luminaires page', () => {
    expect(
      problemLine({ path: 'spaces.0.windows.1.sillHeight', message: 'The sill must be below the head of the window.' }, context),
    ).toMatchObject({
      subject: 'Apparatus bay',
      field: 'Window 2: sill height',
      link: { page: 'daylight', query: { space: 'a1' } },
    });
    expect(problemLine({ path: 'spaces.0.controls.0.timeoutMinutes', message: 'Too long.' }, context)).toMatchObject({
      field: 'Controls: time-out',
      link: { page: 'controls', query: { space: 'a1' } },
    });
    expect(problemLine({ path: 'spaces.1.luminaires.0.tag', message: 'No luminaire type has the tag "Q".' }, context)).toMatchObject({
      field: 'Luminaire counts',
      link: { page: 'luminaires' },
    });
  });

  it('names luminaire types by tag, applications by name, and set-up fields by label', () => {
    expect(
      problemLine(
        { path: 'luminaireTypes.1.limitWatts', message: 'Low-voltage track counts at its transformer rating: enter the rating.' },
        context,
      ),
    ).toMatchObject({
      subject: 'Luminaire type L2',
      field: 'Limiter or transformer rating',
    });
    expect(problemLine({ path: 'exterior.applications.0.key', message: 'Listed more than once.' }, context)).toMatchObject({
      subject: 'Walkways less than 10 feet wide',
      field: 'Application',
      link: { page: 'exterior' },
    });
    expect(problemLine({ path: 'edition', message: 'No code edition is chosen.' })).toMatchObject({
      subject: null,
      field: 'Code edition',
      link: { page: 'setup' },
    });
  });

  it('reads a quoted code-table key as words, and leaves no path, key or field name in the text', () => {
    const line = problemLine(
      { path: 'exterior.applications.0.key', message: 'IECC 2021 has no exterior application “walkways-less-than-10-feet-wide”.' },
      context,
    );
    expect(line.message).toBe('IECC 2021 has no exterior application “Walkways less than 10 feet wide”.');
    const words = problemText(
      problemLine(
        {
          path: 'spaces.0.controlSpaceType',
          message: 'With the space-by-space method the space type sets the controls; leave the control space type out.',
        },
        context,
      ),
    );
    expect(words).not.toMatch(/spaces\.0|controlSpaceType/);
    expect(words).toContain('Control space type');
  });

  it('falls back to the place in the list when the document is not known', () => {
    expect(problemLine({ path: 'spaces.4.area', message: 'Required.' })).toMatchObject({ subject: 'Space 5', link: { page: 'spaces' } });
  });

  it('gives a refused write’s message with what to fix, never the paths', () => {
    const error = new ApiError(400, 'validation_failed', 'The request is not valid.', [
      { path: 'controls.0.zoneSize', message: 'Must be greater than zero.' },
    ]);
    expect(failureWords(error)).toBe('The request is not valid. Controls: zone size: Must be greater than zero.');
  });
});
