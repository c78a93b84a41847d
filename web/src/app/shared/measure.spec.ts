import { loadMath, readMeasure, siteNotation } from './measure';

// Conversions are exact by definition: 1 ft = 0.3048 m and 1 in = 1/12 ft (international yard and pound, 1959).
describe('readMeasure', () => {
  // mathjs is its own chunk, loaded once: slow on a loaded machine, so before the tests and with time to spare.
  beforeAll(() => loadMath().then(() => undefined), 60_000);

  it('leaves a plain number as it was typed', async () => {
    expect(await readMeasure('12.50', 'length', 'ip')).toEqual({ kind: 'value', value: '12.50' });
  });

  it('adds feet and inches as people write them', async () => {
    expect(siteNotation(`12' 6"`)).toBe('12 ft + 6 in');
    expect(await readMeasure('12 ft 6 in', 'length', 'ip')).toEqual({ kind: 'value', value: '12.5' });
    expect(await readMeasure(`12' 6"`, 'length', 'ip')).toEqual({ kind: 'value', value: '12.5' });
  });

  it('converts to the project units: 3.2 m is 10.4987 ft, 10 ft is 3.048 m', async () => {
    // 3.2 / 0.3048 = 10.49868…; kept to four places.
    expect(await readMeasure('3.2 m', 'length', 'ip')).toEqual({ kind: 'value', value: '10.4987' });
    expect(await readMeasure('10 ft', 'length', 'si')).toEqual({ kind: 'value', value: '3.048' });
  });

  it('reads arithmetic and products of lengths as areas', async () => {
    expect(await readMeasure('30*20', 'area', 'ip')).toEqual({ kind: 'value', value: '600' });
    expect(await readMeasure('20 ft * 30 ft', 'area', 'ip')).toEqual({ kind: 'value', value: '600' });
    // 100 ft² × 0.09290304 m²/ft² = 9.290304 m², kept to four places.
    expect(await readMeasure('100 ft²', 'area', 'si')).toEqual({ kind: 'value', value: '9.2903' });
    expect(await readMeasure('4 * 6', 'number', 'ip')).toEqual({ kind: 'value', value: '24' });
  });

  it('refuses a measure of the wrong kind, names, functions and assignments, in words', async () => {
    for (const [text, kind] of [
      ['20 ft * 30 ft', 'length'],
      ['12 ft', 'area'],
      ['3 m', 'number'],
      ['2 kg', 'length'],
      ['sqrt(4)', 'number'],
      ['x = 4', 'number'],
      ['width * 2', 'length'],
      ['1/0', 'number'],
      ['12 ft 6', 'length'],
      ['9^9^9', 'number'],
      ['ft^9', 'area'],
    ] as const) {
      const reading = await readMeasure(text, kind, 'ip');
      expect(reading.kind, text).toBe('problem');
      if (reading.kind === 'problem') expect(reading.message).toMatch(/^Write (a|an) /);
    }
  });
});
