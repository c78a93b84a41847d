import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { evaluate, metresPerFoot, squareMetresPerSquareFoot, validateDocument } from '../../service/src/compliance/index.js';
import type { EvaluationDocumentInput } from '../../service/src/compliance/index.js';
import { dec } from '../../service/src/compliance/numbers.js';
import { ashrae2019, iecc2021, run } from './fixtures.js';

const spaceTypes = ['office-enclosed-small', 'office-open', 'conference', 'corridor', 'restroom', 'storage-50-plus', 'library-reading'];

/** Enough rooms per entry that a generated area fits the size a space type's name carries (≤ 250 ft² offices, ≥ 50 ft² storage). */
const roomsFor = (type: string, area: number) =>
  type === 'office-enclosed-small' ? Math.ceil(area / 250) : type === 'storage-50-plus' ? 1 : undefined;

const spaceArbitrary = fc.record({
  type: fc.constantFrom(...spaceTypes),
  area: fc.integer({ min: 50, max: 20000 }),
  length: fc.integer({ min: 10, max: 200 }),
  width: fc.integer({ min: 10, max: 200 }),
  ceiling: fc.integer({ min: 8, max: 30 }),
  count: fc.integer({ min: 0, max: 200 }),
  watts: fc.integer({ min: 1, max: 400 }),
});

type SpaceSpec = typeof spaceArbitrary extends fc.Arbitrary<infer T> ? T : never;

function document(specs: SpaceSpec[], scale = 1): EvaluationDocumentInput {
  return {
    edition: 'ashrae-90.1-2019',
    method: 'space-by-space',
    units: 'ip',
    luminaireTypes: specs.map((spec, index) => ({ tag: `L${index}`, description: '', inputWatts: spec.watts, use: 'general' as const })),
    spaces: specs.map((spec, index) => ({
      id: `s${index}`,
      name: `Space ${index}`,
      spaceType: spec.type,
      area: spec.area * scale,
      ...(roomsFor(spec.type, spec.area * scale) ? { rooms: roomsFor(spec.type, spec.area * scale) } : {}),
      luminaires: [{ tag: `L${index}`, count: spec.count }],
    })),
  };
}

describe('properties', () => {
  it('installed power is additive over spaces', () => {
    fc.assert(
      fc.property(fc.array(spaceArbitrary, { minLength: 1, maxLength: 6 }), (specs) => {
        const whole = run(document(specs), ashrae2019);
        const parts = specs.map((spec) => dec(run(document([spec]), ashrae2019).interior.installedW));
        expect(dec(whole.interior.installedW).equals(parts.reduce((total, part) => total.plus(part), dec(0)))).toBe(true);
      }),
      { numRuns: 50 },
    );
  });

  it('scaling every area scales the allowance', () => {
    fc.assert(
      fc.property(fc.array(spaceArbitrary, { minLength: 1, maxLength: 6 }), fc.integer({ min: 2, max: 9 }), (specs, factor) => {
        const base = dec(run(document(specs), ashrae2019).interior.allowanceW);
        const scaled = dec(run(document(specs, factor), ashrae2019).interior.allowanceW);
        // Both are reported to 0.1 W, so they agree within the rounding of each (0.05 W, and 0.05 W × factor).
        expect(
          scaled
            .minus(base.times(factor))
            .abs()
            .lessThanOrEqualTo(dec('0.05').times(factor + 1)),
        ).toBe(true);
      }),
      { numRuns: 50 },
    );
  });

  it('IP and SI documents give the same verdict and the same watts', () => {
    // Lengths × 0.3048 and areas × 0.09290304 (mathjs units), so both documents describe the same building.
    fc.assert(
      fc.property(fc.array(spaceArbitrary, { minLength: 1, maxLength: 4 }), fc.boolean(), (specs, iecc) => {
        const edition = iecc ? iecc2021 : ashrae2019;
        const types = iecc
          ? ['office-enclosed', 'office-open', 'conference', 'corridor', 'restroom', 'storage', 'library-reading']
          : spaceTypes;
        const make = (units: 'ip' | 'si'): EvaluationDocumentInput => {
          const length = (feet: number) => (units === 'ip' ? String(feet) : dec(feet).times(metresPerFoot).toFixed());
          const area = (squareFeet: number) =>
            units === 'ip' ? String(squareFeet) : dec(squareFeet).times(squareMetresPerSquareFoot).toFixed();
          return {
            edition: edition.id,
            method: 'space-by-space',
            units,
            luminaireTypes: specs.map((spec, index) => ({
              tag: `L${index}`,
              description: '',
              inputWatts: spec.watts,
              use: 'general' as const,
            })),
            spaces: specs.map((spec, index) => ({
              id: `s${index}`,
              name: `Space ${index}`,
              spaceType: types[spaceTypes.indexOf(spec.type)]!,
              area: area(spec.length * spec.width),
              ...(roomsFor(spec.type, spec.length * spec.width) ? { rooms: roomsFor(spec.type, spec.length * spec.width) } : {}),
              length: length(spec.length),
              width: length(spec.width),
              ceilingHeight: length(spec.ceiling),
              enclosed: true,
              luminaires: [{ tag: `L${index}`, count: spec.count, zone: 'primary-sidelit' as const }],
              windows: [{ width: length(Math.min(4, spec.length)), headHeight: length(7), wall: 'south' as const }],
            })),
          };
        };
        const ip = validateDocument(make('ip'), edition);
        const si = validateDocument(make('si'), edition);
        if (!ip.valid || !si.valid) throw new Error('generated document not valid');
        const a = evaluate(ip.document, edition);
        const b = evaluate(si.document, edition);
        expect(b.complies).toBe(a.complies);
        expect(b.interior.complies).toBe(a.interior.complies);
        expect(dec(b.interior.allowanceW).minus(dec(a.interior.allowanceW)).abs().lessThan('1e-20')).toBe(true);
        expect(b.interior.installedW).toBe(a.interior.installedW);
        expect(b.interior.spaces.map((space) => space.roomGeometryIncreaseApplied)).toEqual(
          a.interior.spaces.map((space) => space.roomGeometryIncreaseApplied),
        );
        expect(b.interior.spaces.map((space) => space.daylight.sidelightingControlRequired)).toEqual(
          a.interior.spaces.map((space) => space.daylight.sidelightingControlRequired),
        );
      }),
      { numRuns: 40 },
    );
  });
});
