import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { ControlLine, EvaluationResult, UnitSystem } from '../../core/api/api-types';
import { allowanceStatus } from '../../shared/allowance-status';
import { areaFigure, wattsFigure } from '../../shared/figures';
import { formatArea, formatPercent, formatWatts } from '../../shared/format';
import { VerifyBadge } from '../../shared/verify-badge';
import { outstandingLines, requirementWords, statusView } from '../controls/control-status';
import { CardRows } from '../../shared/card-rows';

export interface UnmetLine {
  spaceId: string;
  spaceName: string;
  line: ControlLine;
}

/** Every control line that still needs the engineer, space by space, in the result's order. */
export function unmetControls(result: EvaluationResult): UnmetLine[] {
  return result.interior.spaces.flatMap((space) => outstandingLines(space.controls).map((line) => ({ spaceId: space.id, spaceName: space.name, line })));
}

/**
 * The building's figures: allowance, installed, exempt, margin and the verdict; per level; the
 * control lines not yet met; the unverified values the evaluation used. While results are being
 * recomputed the verdict is withheld, never shown from the previous evaluation.
 */
@Component({
  selector: 'al-results-summary',
  imports: [CardRows, MatIconModule, RouterLink, VerifyBadge],
  templateUrl: './results-summary.html',
  styleUrl: './results-summary.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultsSummary {
  readonly result = input.required<EvaluationResult>();
  readonly updating = input(false);

  protected readonly format = { watts: formatWatts, percent: formatPercent, area: formatArea };
  protected readonly figures = { watts: wattsFigure, area: areaFigure };
  protected readonly requirementWords = requirementWords;
  protected readonly statusView = statusView;
  protected readonly units = computed<UnitSystem>(() => this.result().units);
  protected readonly interior = computed(() => this.result().interior);
  protected readonly interiorStatus = computed(() => allowanceStatus(this.interior().complies, this.interior().marginW, this.interior().marginPct));
  protected readonly exteriorStatus = computed(() => {
    const exterior = this.result().exterior;
    return exterior ? allowanceStatus(exterior.complies, String(Number(exterior.allowanceW) - Number(exterior.installedW))) : null;
  });
  protected readonly levels = computed(() =>
    (this.interior().levels ?? []).map((level) => ({ ...level, status: allowanceStatus(Number(level.marginW) >= 0, level.marginW) })),
  );
  protected readonly unmet = computed(() => unmetControls(this.result()));
  protected readonly failures = computed(() => {
    const result = this.result();
    const count = this.unmet().length;
    return [
      result.interior.complies ? '' : 'interior power over allowance',
      result.exterior && !result.exterior.complies ? 'exterior power over allowance' : '',
      result.controlsComply ? '' : `${count} control requirement${count === 1 ? '' : 's'} outstanding`,
    ]
      .filter(Boolean)
      .join('; ');
  });
}
