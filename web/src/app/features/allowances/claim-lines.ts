import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import type { AdditionalAllowanceView, AllowanceClaim, EvaluationResult, SpaceRecord, UnitSystem } from '../../core/api/api-types';
import { formatArea } from '../../shared/format';
import { numberProblem, ranges } from '../../shared/number-range';

/** The service's sales floor space type (compliance/document.ts): the display allowances are for it alone. */
export const salesFloorType = 'sales-area';

export interface ClaimLine {
  claim: AllowanceClaim;
  /** Undefined when the edition no longer offers the allowance claimed. */
  allowance: AdditionalAllowanceView | undefined;
  /** What the evaluation counted for the claim: rate × area, before the lighting it is for caps it. */
  claimedW: string | null;
  /** What of it the space's display (retail display) or decorative (decorative) luminaires use. */
  usableW: string | null;
}

/** A space's claims with the evaluation's figures for each. */
export function claimLines(
  spaceId: string,
  claims: readonly AllowanceClaim[],
  catalogue: readonly AdditionalAllowanceView[],
  result: EvaluationResult | null,
): ClaimLine[] {
  const byKey = new Map(catalogue.map((allowance) => [allowance.key, allowance]));
  const counted = result?.interior.additional?.lines ?? [];
  return claims
    .filter((claim) => claim.spaceId === spaceId)
    .map((claim) => {
      const line = counted.find((candidate) => candidate.spaceId === spaceId && candidate.allowance === claim.allowance);
      return { claim, allowance: byKey.get(claim.allowance), claimedW: line?.claimedW ?? null, usableW: line?.usableW ?? null };
    });
}

/**
 * What the claims of one kind bring, in words: a retail display allowance covers display lighting
 * only and a decorative one decorative lighting only, so a claim larger than that lighting of the
 * space is partly unused (use it or lose it).
 */
export function usageWords(
  claimedW: number,
  usedW: number,
  lightingW: number,
  watts: (value: number) => string,
  use: 'display' | 'decorative' = 'display',
): string {
  if (claimedW === 0) return 'Nothing claimed yet.';
  if (lightingW === 0)
    return `${watts(claimedW)} claimed, none used: no luminaire in this space is entered as ${use} lighting, and the allowance covers ${use} lighting only.`;
  if (usedW < claimedW)
    return `${watts(usedW)} of the ${watts(claimedW)} claimed is used: the ${use} lighting here is ${watts(lightingW)}, and the allowance covers ${use} lighting only.`;
  return `All ${watts(claimedW)} claimed is used, against ${watts(lightingW)} of ${use} lighting.`;
}

/** A claimed area: a positive number of at most the space's own floor area, as the service checks. */
export function claimAreaValidator(space: () => SpaceRecord | null, units: () => UnitSystem): ValidatorFn {
  return (control: AbstractControl<string>): ValidationErrors | null => {
    const raw = (control.value ?? '').trim();
    if (raw === '') return null;
    const problem = numberProblem(raw, ranges.area);
    if (problem) return { area: problem };
    const current = space();
    if (current && Number(raw) > Number(current.area))
      return { area: `At most ${formatArea(current.area, units())}, the space’s floor area.` };
    return null;
  };
}
