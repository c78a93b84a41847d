import { describe, expect, it } from 'vitest';
import { validateDocument } from '../../service/src/compliance/index.js';
import type { EvaluationDocumentInput } from '../../service/src/compliance/index.js';
import { ashrae2022, run } from './fixtures.js';

const led = (tag: string, watts: string, use: 'general' | 'decorative' | 'display' | 'exempt' = 'general') => ({
  tag,
  description: tag,
  inputWatts: watts,
  use,
});

/** A 400 ft² meeting room with 300 W of general lighting and the decorative pendants given. */
const meetingRoom = (decorativeCount: number, claimArea: number): EvaluationDocumentInput => ({
  edition: 'ashrae-90.1-2022',
  method: 'space-by-space',
  units: 'ip',
  luminaireTypes: [led('G', '30'), led('P', '25', 'decorative')],
  spaces: [
    {
      id: 'm',
      name: 'Meeting room',
      spaceType: 'conference',
      area: 400,
      luminaires: [{ tag: 'G', count: 10 }, ...(decorativeCount > 0 ? [{ tag: 'P', count: decorativeCount }] : [])],
    },
  ],
  retailDisplay: { claims: [{ allowance: 'decorative', spaceId: 'm', area: claimArea }] },
});

describe('decorative additional allowance (90.1 space-by-space)', () => {
  it('grants the rate × claimed area when the decorative luminaires use it all', () => {
    // Conference 0.88 W/ft² (90.1-2022 Table 9.5.2.1-1, via BESD) × 400 ft² = 352 W.
    // Decorative 0.75 W/ft² (§9.5.2.2(a), from memory) × 200 ft² = 150 W; decorative installed 8 × 25 = 200 W.
    // Granted min(150, 200) = 150 W; allowance 352 + 150 = 502 W; installed 300 + 200 = 500 W.
    const result = run(meetingRoom(8, 200), ashrae2022);
    const space = result.interior.spaces[0]!;
    expect(space.additionalAllowanceW).toBe('150');
    expect(space.allowanceW).toBe('502');
    expect(space.installedW).toBe('500');
    expect(space.withinAllowance).toBe(true);
    const line = result.interior.additional!.lines[0]!;
    expect(line).toMatchObject({ kind: 'decorative', claimedW: '150', usableW: '150', limitedBy: null, section: '9.5.2.2(a)' });
    expect(result.interior.additional!.decorativeW).toBe('200');
    // A decorative claim has no fixed adder (that belongs to retail display) and asks for none.
    expect(result.interior.additional!.fixedW).toBe('0');
    expect(result.unverifiedValues.some((value) => value.what === 'Retail display fixed adder')).toBe(false);
    // The rate is from memory: listed among the unverified values, citing its own section.
    const flagged = result.unverifiedValues.find((value) => value.what === 'Additional allowance: Decorative lighting');
    expect(flagged).toBeDefined();
    expect(flagged!.citation.short).toContain('9.5.2.2(a)');
  });

  it('is use it or lose it: what the decorative luminaires do not use is not traded to general lighting', () => {
    // Claim 400 ft² × 0.75 = 300 W (from memory); decorative installed 2 × 25 = 50 W, so only 50 W is granted.
    // Allowance 352 + 50 = 402 W; installed 300 + 50 = 350 W. Without the cap it would read 652 W.
    const result = run(meetingRoom(2, 400), ashrae2022);
    const space = result.interior.spaces[0]!;
    expect(space.additionalAllowanceW).toBe('50');
    expect(space.allowanceW).toBe('402');
    const line = result.interior.additional!.lines[0]!;
    expect(line.claimedW).toBe('300');
    expect(line.usableW).toBe('50');
    expect(line.limitedBy).toContain('cannot be traded to other lighting (ASHRAE 90.1-2022 §9.5.2.2(a))');
    expect(result.interior.additional!.usableW).toBe('50');
  });

  it('grants nothing where the space has no decorative luminaires, and says why', () => {
    // General lighting 10 × 30 = 300 W only: the 150 W claimed is lost, the allowance stays at 352 W.
    const result = run(meetingRoom(0, 200), ashrae2022);
    expect(result.interior.spaces[0]!.additionalAllowanceW).toBe('0');
    expect(result.interior.spaces[0]!.allowanceW).toBe('352');
    const line = result.interior.additional!.lines[0]!;
    expect(line.usableW).toBe('0');
    expect(line.limitedBy).toBe(
      'The space has no decorative luminaires left to use this allowance, so none of it is counted: it cannot be traded to other lighting (ASHRAE 90.1-2022 §9.5.2.2(a)).',
    );
  });

  it('keeps retail display and decorative apart in one sales area', () => {
    // Sales area 0.85 W/ft² × 1000 = 850 W (Table 9.5.2.1-2, via BESD).
    // Retail area 1: 0.40 × 1000 = 400 W claimed (§9.5.2.2(b), via pnnl/ruleset-checking-tool); display 2 × 100 = 200 W → 200 W used.
    // Decorative: 0.75 × 1000 = 750 W claimed (from memory); decorative 4 × 25 = 100 W → 100 W used.
    // The display claim's unused 200 W does not cover decorative lighting, nor the other way round.
    // Fixed adder 750 W (§9.5.2.2(b)) covers display watts not yet covered: 200 − 200 = 0 W, so none of it is used.
    const result = run(
      {
        edition: 'ashrae-90.1-2022',
        method: 'space-by-space',
        units: 'ip',
        luminaireTypes: [led('D', '100', 'display'), led('P', '25', 'decorative'), led('G', '50')],
        spaces: [
          {
            id: 's',
            name: 'Shop',
            spaceType: 'sales-area',
            area: 1000,
            luminaires: [
              { tag: 'D', count: 2 },
              { tag: 'P', count: 4 },
              { tag: 'G', count: 10 },
            ],
          },
        ],
        retailDisplay: {
          claims: [
            { allowance: 'retail-area-1', spaceId: 's', area: 1000 },
            { allowance: 'decorative', spaceId: 's', area: 1000 },
          ],
        },
      },
      ashrae2022,
    );
    expect(result.interior.spaces[0]!.additionalAllowanceW).toBe('300');
    expect(result.interior.additional!.usableW).toBe('300');
    expect(result.interior.allowanceW).toBe('1150');
    const [retail, decorative] = result.interior.additional!.lines;
    expect(retail).toMatchObject({ kind: 'retail-display', claimedW: '400', usableW: '200' });
    expect(decorative).toMatchObject({ kind: 'decorative', claimedW: '750', usableW: '100' });
  });

  it('is open to any space, but not over its area and not under the building area method', () => {
    const problems = (document: EvaluationDocumentInput) => validateDocument(document, ashrae2022).problems.map((problem) => problem.path);
    expect(problems(meetingRoom(2, 400))).toEqual([]);
    expect(problems(meetingRoom(2, 401))).toEqual(['retailDisplay.claims.0.area']);
    expect(
      problems({
        ...meetingRoom(2, 100),
        method: 'building-area',
        spaces: [{ ...meetingRoom(2, 100).spaces[0]!, spaceType: undefined, buildingAreaType: 'office' }],
      }),
    ).toEqual(['retailDisplay.claims.0']);
  });
});
