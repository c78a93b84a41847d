import { areaInUnits, inProjectUnits } from './unit-words';

describe('code-table text in the project units', () => {
  // 1 ft = 0.3048 m and 1 ft² = 0.09290304 m² exactly (NIST SP 811).
  it('writes areas, lengths and rates in metres for an SI project', () => {
    expect(inProjectUnits('at most 5,000 ft² per device', 'si')).toBe('at most 464.5 m² per device');
    expect(inProjectUnits('Walkways less than 10 feet wide', 'si')).toBe('Walkways less than 3 m wide');
    expect(inProjectUnits('Atrium — Less than 40 ft in height', 'si')).toBe('Atrium — Less than 12.2 m in height');
    expect(inProjectUnits('Office — Enclosed and > 150 ft² and ≤ 300 ft²', 'si')).toBe('Office — Enclosed and > 13.9 m² and ≤ 27.9 m²');
    expect(inProjectUnits('Enclosed and <= 250 ft2', 'si')).toBe('Enclosed and <= 23.2 m²');
    expect(inProjectUnits('High-bay area (25 - 50 feet floor-to-ceiling height)', 'si')).toBe(
      'High-bay area (7.6 - 15.2 m floor-to-ceiling height)',
    );
    expect(inProjectUnits('an installed density under 0.45 W/ft²', 'si')).toBe('an installed density under 4.84 W/m²');
    expect(inProjectUnits('minimum 30 W per linear ft', 'si')).toBe('minimum 98.43 W/m');
    expect(inProjectUnits('Building facades (W/ft)', 'si')).toBe('Building facades (W/m)');
  });

  it('leaves IP text as the tables hold it', () => {
    expect(inProjectUnits('Walkways less than 10 feet wide', 'ip')).toBe('Walkways less than 10 feet wide');
    expect(areaInUnits('5000', 'ip')).toBe('5,000');
    expect(areaInUnits('5000', 'si')).toBe('464.5');
  });
});
