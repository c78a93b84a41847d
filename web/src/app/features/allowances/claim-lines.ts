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
  /** What the evaluation counted for the claim: rate × area, before the display lighting caps it. */
  claimedW: string | null;
}

/** A space's claims with the evaluation's figures for each. */
export function claimLines(spaceId: string, claims: readonly AllowanceClaim[], catalogue: readonly AdditionalAllowanceView[], result: EvaluationResult | null): ClaimLine[] {
  const byKey = new Map(catalogue.map((allowance) => [allowance.key, allowance]));
  const counted = result?.interior.additional?.lines ?? [];
  return claims
    .filter((claim) => claim.spaceId === spaceId)
    .map((claim) => ({
      claim,
      allowance: byKey.get(claim.allowance),
      claimedW: counted.find((line) => line.spaceId === spaceId && line.allowance === claim.allowance)?.claimedW ?? null,
    }));
}

/**
 * What the claims bring, in words: an additional allowance covers display lighting only, so a claim
 * larger than the space's display lighting is partly unused (use it or lose it).
 */
export function usageWords(claimedW: number, usedW: number, displayW: number, watts: (value: number) => string): string {
  if (claimedW === 0) return 'Nothing claimed yet.';
  if (displayW === 0) return `${watts(claimedW)} claimed, none used: no luminaire in this space is entered as display lighting, and the allowance covers display lighting only.`;
  if (usedW < claimedW) return `${watts(usedW)} of the ${watts(claimedW)} claimed is used: the display lighting here is ${watts(displayW)}, and the allowance covers display lighting only.`;
  return `All ${watts(claimedW)} claimed is used, against ${watts(displayW)} of display lighting.`;
}

/** A claimed area: a positive number of at most the space's own floor area, as the service checks. */
export function claimAreaValidator(space: () => SpaceRecord | null, units: () => UnitSystem): ValidatorFn {
  return (control: AbstractControl<string>): ValidationErrors | null => {
    const raw = (control.value ?? '').trim();
    if (raw === '') return null;
    const problem = numberProblem(raw, ranges.area);
    if (problem) return { area: problem };
    const current = space();
    if (current && Number(raw) > Number(current.area)) return { area: `At most ${formatArea(current.area, units())}, the space’s floor area.` };
    return null;
  };
}
