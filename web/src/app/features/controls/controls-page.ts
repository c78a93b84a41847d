import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, signal, viewChildren } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { RouterLink } from '@angular/router';
import type { ProvidedControl, SpaceRecord } from '../../core/api/api-types';
import { WriteFailure } from '../../shared/write-failure';
import { formatArea } from '../../shared/format';
import { InUnits } from '../../shared/in-units';
import { SpacePicker } from '../../shared/space-picker';
import { UnverifiedCount } from '../../shared/unverified-count';
import type { HasUnsavedChanges } from '../../shared/unsaved-changes';
import { ProjectStore } from '../workspace/project-store';
import { WorkspaceApi } from '../workspace/workspace-api';
import { BulkControlPanel } from './bulk-control-panel';
import { replaceControl } from './control-form';
import { ControlLineCard } from './control-line-card';
import { outstandingLines } from './control-status';
import { RevisionMarker } from '../../shared/revision-marker';

/** Per space: the control requirements the evaluation derives, and what the engineer records as provided or excepted. */
@Component({
  selector: 'al-controls-page',
  imports: [
    RevisionMarker,
    MatIconModule,
    MatListModule,
    MatProgressBarModule,
    MatSlideToggleModule,
    RouterLink,
    BulkControlPanel,
    ControlLineCard,
    InUnits,
    SpacePicker,
    UnverifiedCount,
  ],
  templateUrl: './controls-page.html',
  styleUrl: './controls-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ControlsPage implements HasUnsavedChanges {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(WorkspaceApi);
  private readonly failure = inject(WriteFailure);

  /** The space to open, from `?space=` (links from the Results page). */
  readonly space = input<string>();

  private readonly cards = viewChildren(ControlLineCard);
  protected readonly outstandingOnly = signal(false);
  protected readonly saving = signal(false);
  protected readonly updating = computed(() => this.store.results().status !== 'ready');
  protected readonly formatArea = formatArea;

  protected readonly rows = computed(() => {
    const results = this.store.resultBySpace();
    return this.store.spaces().map((space) => {
      const result = results.get(space.id);
      return { space, result, outstanding: result ? outstandingLines(result.controls).length : 0 };
    });
  });
  protected readonly visibleRows = computed(() =>
    this.outstandingOnly() ? this.rows().filter((row) => row.outstanding > 0) : this.rows(),
  );
  /** The engineer's choice; follows `?space=` when the link changes, and survives results arriving. */
  private readonly chosenId = linkedSignal<string | undefined, string | null>({
    source: this.space,
    computation: (space, previous) => space ?? previous?.value ?? null,
  });
  protected readonly selectedId = computed(() => this.chosenId() ?? this.rows()[0]?.space.id ?? null);
  protected readonly selected = computed(() => this.rows().find((row) => row.space.id === this.selectedId()) ?? null);
  protected readonly strategyByKey = computed(
    () => new Map((this.store.tables()?.controlStrategies ?? []).map((strategy) => [strategy.key, strategy])),
  );
  protected readonly lines = computed(() => {
    const lines = this.selected()?.result?.controls ?? [];
    return {
      applicable: lines.filter((line) => line.status !== 'not-required'),
      notRequired: lines.filter((line) => line.status === 'not-required'),
    };
  });

  /** The requirements shown for the space that carry a "verify" mark (those not required sit folded away). */
  protected readonly unverifiedCount = computed(() => this.lines().applicable.filter((line) => !line.verified).length);

  protected typeLabel(row: { space: SpaceRecord; result?: { lpdBasis: { label: string } } }): string {
    if (row.result) return row.result.lpdBasis.label;
    const byArea = this.store.project()?.method === 'building-area';
    const key = byArea ? row.space.buildingAreaType : row.space.spaceType;
    const types: readonly { key: string; label: string }[] =
      (byArea ? this.store.tables()?.buildingAreaTypes : this.store.tables()?.spaceTypes) ?? [];
    return types.find((type) => type.key === key)?.label ?? 'No type chosen';
  }

  hasUnsavedChanges(): boolean {
    return this.cards().some((card) => card.hasUnsavedChanges());
  }

  protected provided(space: SpaceRecord, strategy: string): ProvidedControl | undefined {
    return space.controls.find((control) => control.strategy === strategy);
  }

  protected select(spaceId: string): void {
    this.chosenId.set(spaceId);
  }

  protected save(space: SpaceRecord, strategy: string, next: ProvidedControl | null): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    const controls = replaceControl(space.controls, strategy, next);
    const card = () => this.cards().find((candidate) => candidate.line().strategy === strategy);
    this.failure.save(this.api.patchSpace(projectId, space.id, space.version, { controls }), {
      saving: this.saving,
      saved: (saved) => {
        card()?.saved();
        this.store.upsertSpace(saved);
      },
      invalid: (error) => {
        // The service names the entry by its place in the list sent: `controls.2.exceptionNote`.
        const prefix = `controls.${controls.findIndex((control) => control.strategy === strategy)}.`;
        const details = error.details.map((detail) =>
          detail.path.startsWith(prefix) ? { ...detail, path: detail.path.slice(prefix.length) } : detail,
        );
        card()?.refused(details, error.message);
      },
      reload: () => this.reload(space.id),
    });
  }

  private reload(spaceId: string): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    this.api.spaces(projectId).subscribe((spaces) => {
      const fresh = spaces.find((space) => space.id === spaceId);
      if (fresh) this.store.upsertSpace(fresh);
    });
  }
}
