import { all, create } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { metresPerFootText, squareMetresPerSquareFootText } from '../../contract/editions.js';
import { areaToSquareFeet, lengthToFeet, metresPerFoot } from '../../service/src/compliance/units.js';
import { dec } from '../../service/src/compliance/numbers.js';

describe('the shared unit conversions', () => {
  it('are the exact definitions: 1 ft = 0.3048 m, 1 ft² = 0.09290304 m² (NIST SP 811, appendix B)', () => {
    // A general-purpose library (mathjs's unit definitions, in 64-digit decimals) agrees to the last digit.
    const math = create(all!, { number: 'BigNumber', precision: 64 });
    expect(String(math.unit(math.bignumber(1), 'ft').toNumeric('m'))).toBe(metresPerFootText);
    expect(String(math.unit(math.bignumber(1), 'ft^2').toNumeric('m^2'))).toBe(squareMetresPerSquareFootText);
  });

  it('convert back exactly: 3.048 m is 10 ft and 9.290304 m² is 100 ft²', () => {
    expect(lengthToFeet(dec('3.048'), 'si').toString()).toBe('10');
    expect(areaToSquareFeet(dec('9.290304'), 'si').toString()).toBe('100');
    expect(metresPerFoot.toString()).toBe('0.3048');
  });
});
