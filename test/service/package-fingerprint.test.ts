import { describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { compareResults } from '../../service/src/package/compare.js';
import { attachment } from '../../service/src/package/content-disposition.js';
import { figure } from '../../service/src/package/package-pdf.js';
import { canonicalJson, canonicalResult, fixedDecimal, resultFingerprint } from '../../service/src/package/fingerprint.js';
import type { EvaluationDocumentInput } from '../../service/src/compliance/index.js';
import { ashrae2019, run } from '../calc/fixtures.js';

const led = (tag: string, watts: string) => ({ tag, description: tag, inputWatts: watts, use: 'general' as const });

// An invented two-space office on the calculation tests' 90.1-2019 tables.
const office = (overrides: { area?: string; count?: number; extra?: boolean } = {}): EvaluationDocumentInput => ({
  edition: 'ashrae-90.1-2019',
  method: 'building-area',
  units: 'ip',
  luminaireTypes: [led('A', '40')],
  spaces: [
    {
      id: 'o',
      name: 'Offices',
      buildingAreaType: 'office',
      area: overrides.area ?? '8000',
      luminaires: [{ tag: 'A', count: overrides.count ?? 120 }],
    },
    { id: 'r', name: 'Shop', buildingAreaType: 'retail', area: '2000', luminaires: [{ tag: 'A', count: 40 }] },
    ...(overrides.extra ? [{ id: 'x', name: 'Annex', buildingAreaType: 'office', area: '500', luminaires: [{ tag: 'A', count: 5 }] }] : []),
  ],
});

describe('canonical JSON', () => {
  it('sorts object keys at every depth, so key order does not change the text', () => {
    const a = { b: 1, a: { d: [1, { z: true, y: null }], c: 'x' } };
    const b = { a: { c: 'x', d: [1, { y: null, z: true }] }, b: 1 };
    expect(canonicalJson(a)).toBe(canonicalJson(b));
    expect(canonicalJson(a)).toBe('{"a":{"c":"x","d":[1,{"y":null,"z":true}]},"b":1}');
  });

  it('keeps array order, leaves out undefined members, escapes strings as JSON does', () => {
    expect(canonicalJson([2, 1])).not.toBe(canonicalJson([1, 2]));
    expect(canonicalJson({ a: undefined, b: 'say "hi"\n' })).toBe('{"b":"say \\"hi\\"\\n"}');
    expect(canonicalJson(-0)).toBe('0');
  });

  it('refuses numbers that are not safe integers', () => {
    expect(() => canonicalJson({ watts: 0.1 })).toThrow(/integers only/);
    expect(() => canonicalJson(2 ** 60)).toThrow(/integers only/);
  });

  it('writes decimals in one fixed spelling', () => {
    expect(fixedDecimal('007.500')).toBe('7.5');
    expect(fixedDecimal('-0.00')).toBe('0');
    expect(fixedDecimal('12.0')).toBe('12');
    expect(fixedDecimal('-3.25')).toBe('-3.25');
    expect(fixedDecimal('0.05')).toBe('0.05');
  });
});

describe('the fingerprint of a result', () => {
  it('is the SHA-256 of the canonical result, the same for the same document, whatever the key order', () => {
    const result = run(office(), ashrae2019);
    const again = run(office(), ashrae2019);
    expect(resultFingerprint(result)).toMatch(/^[0-9a-f]{64}$/);
    expect(resultFingerprint(again)).toBe(resultFingerprint(result));
    expect(resultFingerprint(result)).toBe(createHash('sha256').update(canonicalResult(result)).digest('hex'));
    const reordered = Object.fromEntries(Object.entries(result).reverse()) as typeof result;
    expect(resultFingerprint(reordered)).toBe(resultFingerprint(result));
  });

  it('reads a decimal field in its fixed spelling, and leaves a name that looks like a number as written', () => {
    const result = run(office(), ashrae2019);
    const padded = { ...result, interior: { ...result.interior, allowanceW: `${result.interior.allowanceW}.000` } };
    expect(resultFingerprint(padded)).toBe(resultFingerprint(result));
    const [first, ...rest] = result.interior.spaces;
    const named = (name: string) => ({ ...result, interior: { ...result.interior, spaces: [{ ...first!, name }, ...rest] } });
    expect(resultFingerprint(named('1.50'))).not.toBe(resultFingerprint(named('1.5')));
  });

  it('changes when one space changes', () => {
    expect(resultFingerprint(run(office({ count: 121 }), ashrae2019))).not.toBe(resultFingerprint(run(office(), ashrae2019)));
  });
});

describe('the comparison of two results', () => {
  it('finds nothing between a result and itself', () => {
    const result = run(office(), ashrae2019);
    expect(compareResults(result, result)).toEqual({
      verdict: null,
      totals: [],
      spaces: { added: [], removed: [], changed: [] },
      controls: [],
      exterior: [],
    });
  });

  it('lists the space changed, its watts and margin, and the building totals that follow', () => {
    // Installed 120 × 40 W = 4800 W in Offices; with 140 luminaires 5600 W (count × rated input).
    const before = run(office(), ashrae2019);
    const after = run(office({ count: 140 }), ashrae2019);
    const comparison = compareResults(before, after);
    expect(comparison.spaces.added).toEqual([]);
    expect(comparison.spaces.removed).toEqual([]);
    expect(comparison.spaces.changed).toHaveLength(1);
    const [changed] = comparison.spaces.changed;
    expect(changed!.name).toBe('Offices');
    expect(changed!.changes).toContainEqual({ field: 'installedW', label: 'Installed (W)', from: '4800', to: '5600' });
    expect(changed!.changes.map((change) => change.field)).toContain('marginW');
    expect(changed!.changes.map((change) => change.field)).not.toContain('allowanceW');
    expect(comparison.totals.map((total) => total.field)).toEqual(expect.arrayContaining(['interior.installedW', 'interior.marginW']));
  });

  it('lists spaces added and removed', () => {
    const small = run(office(), ashrae2019);
    const large = run(office({ extra: true }), ashrae2019);
    expect(compareResults(small, large).spaces.added).toEqual([{ id: 'x', name: 'Annex', level: null }]);
    expect(compareResults(large, small).spaces.removed).toEqual([{ id: 'x', name: 'Annex', level: null }]);
  });

  it('names a verdict that changed', () => {
    // 8000 ft² of office at 0.64 W/ft² plus 2000 ft² of retail at 0.84 W/ft² allow 6800 W (ASHRAE 90.1-2019 Table 9.5.1,
    // as the calculation tests' tables hold it); 250 + 40 luminaires of 40 W install 11,600 W, over the allowance.
    const over = compareResults(run(office(), ashrae2019), run(office({ count: 250 }), ashrae2019));
    expect(over.verdict?.to).toBe('does-not-comply');
    expect(over.totals).toContainEqual(expect.objectContaining({ field: 'interior.complies', from: 'yes', to: 'no' }));
  });
});

describe('the download name', () => {
  it('gives an ASCII filename and the name as written in filename*', () => {
    // RFC 6266 §4.3 and RFC 8187 §3.2: filename* carries UTF-8, percent-encoded.
    expect(attachment('Café “Nord”/Süd - submittal revision 2.pdf')).toBe(
      `attachment; filename="Cafe _Nord__Sud - submittal revision 2.pdf"; filename*=UTF-8''Caf%C3%A9%20%E2%80%9CNord%E2%80%9D_S%C3%BCd%20-%20submittal%20revision%202.pdf`,
    );
    // A quote, a semicolon or a line break cannot end the parameter or the header.
    expect(attachment('"; evil=1\r\n.pdf')).toBe(`attachment; filename="__ evil=1__.pdf"; filename*=UTF-8''_%3B%20evil%3D1__.pdf`);
  });
});

describe('the PDF’s figures', () => {
  it('round to two places, half away from zero, with thousands grouped', () => {
    expect(figure('12345.675', 'W')).toBe('12,345.68 W');
    expect(figure('-1234.5')).toBe('−1,234.5');
    expect(figure('0.004')).toBe('0');
    expect(figure(null)).toBe('—');
  });
});
