import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { ControlLine, EvaluationResult, UnitSystem } from '../../core/api/api-types';
import { allowanceStatus } from '../../shared/allowance-status';
import { CardRows } from '../../shared/card-rows';
import { areaFigure, formatArea, formatPercent, formatWatts, wattsFigure } from '../../shared/format';
import { InUnits } from '../../shared/in-units';
import type { WorkspaceLink } from '../../shared/problem-words';
import { VerifyBadge } from '../../shared/verify-badge';
import { outstandingLines, requirementWords, statusView } from '../controls/control-status';
import { exteriorGroups } from '../exterior/exterior-groups';
import { controlsToVerify, openItemWords, spacesWithoutLuminaires, verdictReasons } from './verdict-reasons';

export interface UnmetLine {
  key: string;
  /** The space's or exterior application's name. */
  name: string;
  line: ControlLine;
  link: WorkspaceLink;
}

/** Every control line that still needs the engineer (not met, or to verify): spaces first, then exterior applications. */
export function unmetControls(result: EvaluationResult): UnmetLine[] {
  const interior = result.interior.spaces.flatMap((space) =>
    outstandingLines(space.controls).map((line): UnmetLine => ({
      key: `${space.id}:${line.strategy}`,
      name: space.name,
      line,
      link: { page: 'controls', query: { space: space.id } },
    })),
  );
  const exterior = (result.exterior?.applications ?? []).flatMap((application) =>
    outstandingLines(application.controls).map((line): UnmetLine => ({
      key: `${application.key}:${line.strategy}`,
      name: application.label,
      line,
      link: { page: 'exterior' },
    })),
  );
  return [...interior, ...exterior];
}

/**
 * The building's figures: allowance, installed, exempt, margin and the verdict with every reason
 * for it (or the open items that hold it back); per level; the control lines not yet met; the
 * unverified values the evaluation used. While results are being recomputed the verdict is
 * withheld, never shown from the previous evaluation.
 */
@Component({
  selector: 'al-results-summary',
  imports: [CardRows, MatButtonModule, MatIconModule, RouterLink, VerifyBadge, InUnits],
  templateUrl: './results-summary.html',
  styleUrl: './results-summary.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultsSummary {
  readonly result = input.required<EvaluationResult>();
  readonly updating = input(false);
  /** The engineer may confirm a space without luminaires is unlit, from the open items. */
  readonly canEdit = input(false);
  readonly confirmUnlit = output<string>();

  protected readonly format = { watts: formatWatts, percent: formatPercent, area: formatArea };
  protected readonly figures = { watts: wattsFigure, area: areaFigure };
  protected readonly requirementWords = requirementWords;
  protected readonly statusView = statusView;
  protected readonly units = computed<UnitSystem>(() => this.result().units);
  protected readonly interior = computed(() => this.result().interior);
  protected readonly interiorStatus = computed(() =>
    allowanceStatus(this.interior().complies, this.interior().marginW, this.interior().marginPct),
  );
  protected readonly exteriorStatus = computed(() => {
    const exterior = this.result().exterior;
    return exterior ? exteriorGroups(exterior, []).total.status : null;
  });
  protected readonly levels = computed(() =>
    (this.interior().levels ?? []).map((level) => ({ ...level, status: allowanceStatus(Number(level.marginW) >= 0, level.marginW) })),
  );
  protected readonly unmet = computed(() => unmetControls(this.result()));
  /** The additional allowance claims, each with its space's name, what its luminaires use and why not more; unverified ones with their citation. */
  protected readonly additionalLines = computed(() => {
    const result = this.result();
    const names = new Map(result.interior.spaces.map((space) => [space.id, space.name]));
    return (result.interior.additional?.lines ?? []).map((line) => ({
      ...line,
      key: `${line.spaceId}:${line.allowance}`,
      spaceName: names.get(line.spaceId) ?? '',
      unverified: result.unverifiedValues.find((value) => value.what === `Additional allowance: ${line.label}`)?.citation ?? null,
    }));
  });
  /** Exterior lighting exempt from the allowance: the application, the watts left out, the reason and section, and the unverified mark of the list. */
  protected readonly exemptExterior = computed(() => {
    const result = this.result();
    return (result.exterior?.applications ?? []).flatMap((application) =>
      application.exemption === null
        ? []
        : [
            {
              application,
              exemption: application.exemption,
              unverified:
                result.unverifiedValues.find((value) => value.what === `Exterior exemption: ${application.exemption!.label}`)?.citation ??
                null,
            },
          ],
    );
  });
  protected readonly reasons = computed(() => verdictReasons(this.result()));
  protected readonly openSpaces = computed(() => spacesWithoutLuminaires(this.result()));
  protected readonly openControls = computed(() => controlsToVerify(this.result()));
  protected readonly openWords = computed(() => openItemWords(this.result()));
}
