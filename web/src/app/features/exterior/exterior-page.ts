import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal, viewChildren } from '@angular/core';
import { NgTemplateOutlet } from '@angular/common';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { Citation, ControlLine, ExteriorApplicationInput, ExteriorApplicationRecord } from '../../core/api/api-types';
import { CautionsBanner, defaultCautions } from '../../shared/cautions-banner';
import { WriteFailure } from '../../shared/write-failure';
import { quantityFigure, rateFigure, wattsFigure } from '../../shared/format';
import type { HasUnsavedChanges } from '../../shared/unsaved-changes';
import { InUnits } from '../../shared/in-units';
import { inProjectUnits } from '../../shared/unit-words';
import { UnverifiedCount } from '../../shared/unverified-count';
import { VerifyBadge } from '../../shared/verify-badge';
import { statusView } from '../controls/control-status';
import { ProjectStore } from '../workspace/project-store';
import { WorkspaceApi } from '../workspace/workspace-api';
import { ExteriorApplicationForm, exteriorControls } from './exterior-application-form';
import { exteriorGroups, quantityUnit } from './exterior-groups';
import { CardRows } from '../../shared/card-rows';
import { ExteriorSchedule } from './exterior-schedule';

/** The site's lighting zone, its lighted applications, and the exterior allowance: tradable pooled, nontradable each alone. */
@Component({
  selector: 'al-exterior-page',
  imports: [
    CardRows,
    NgTemplateOutlet,
    FormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTooltipModule,
    CautionsBanner,
    InUnits,
    UnverifiedCount,
    VerifyBadge,
    ExteriorApplicationForm,
    ExteriorSchedule,
  ],
  templateUrl: './exterior-page.html',
  styleUrl: './exterior-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ExteriorPage implements HasUnsavedChanges {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(WorkspaceApi);
  private readonly failure = inject(WriteFailure);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly figures = { watts: wattsFigure, quantity: quantityFigure, rate: rateFigure };
  protected readonly statusView = statusView;
  protected readonly controlNames: Partial<Record<string, string>> = Object.fromEntries(
    exteriorControls.map((control) => [control.strategy, control.label]),
  );
  protected readonly quantityUnit = quantityUnit;
  private readonly forms = viewChildren(ExteriorApplicationForm);
  protected readonly saving = signal(false);
  /** 'new', an application's id, or null when no form is open. */
  protected readonly editing = signal<string | null>(null);

  hasUnsavedChanges(): boolean {
    return this.forms().some((form) => form.hasUnsavedChanges());
  }

  protected readonly updating = computed(() => this.store.results().status !== 'ready');
  protected readonly result = computed(() => {
    const state = this.store.results();
    return state.status === 'ready' ? state.result : state.status === 'updating' ? state.previous : null;
  });
  protected readonly cautions = computed(() => this.result()?.cautions ?? defaultCautions);
  protected readonly groups = computed(() => {
    const exterior = this.result()?.exterior;
    return exterior ? exteriorGroups(exterior, this.store.exterior()) : null;
  });
  protected readonly zones = computed(() => this.store.tables()?.lightingZones ?? []);
  protected readonly zone = linkedSignal(() => this.store.project()?.lightingZone ?? null);
  protected readonly currentZone = computed(
    () => this.zones().find((zone) => Number(zone.zone) === this.store.project()?.lightingZone) ?? null,
  );
  protected readonly catalogue = computed(() => this.store.tables()?.exteriorApplications ?? []);
  protected readonly usedKeys = computed(() => this.store.exterior().map((application) => application.key));
  /** Applications saved but not in the result shown (a result is being recomputed). */
  protected readonly pending = computed(() => {
    const shown = new Set((this.result()?.exterior?.applications ?? []).map((application) => application.key));
    return this.store.exterior().filter((application) => !shown.has(application.key));
  });

  private readonly unverifiedApplications = computed(
    () =>
      new Map(
        this.catalogue()
          .filter((entry) => !entry.verified)
          .map((entry) => [entry.key, entry.citation]),
      ),
  );
  /** The lighting zones and the project's applications whose values are not checked: each shows a "verify" mark. */
  protected readonly unverifiedCount = computed(
    () =>
      this.zones().filter((zone) => !zone.verified).length +
      this.store.exterior().filter((application) => this.unverifiedApplications().has(application.key)).length,
  );

  protected citationOf(key: string): Citation | null {
    return this.unverifiedApplications().get(key) ?? null;
  }

  protected controlSummary(lines: readonly ControlLine[]): ControlLine[] {
    return lines.filter((line) => line.status !== 'not-required');
  }

  protected saveZone(): void {
    const project = this.store.project();
    const zone = this.zone();
    if (!project || zone === null || zone === project.lightingZone) return;
    this.failure.save(this.api.updateSetup(project.id, project.version, { lightingZone: zone }), {
      saving: this.saving,
      saved: (saved) => this.store.setProject(saved),
      reload: () => this.api.project(project.id).subscribe((fresh) => this.store.setProject(fresh)),
    });
  }

  protected saveApplication(application: ExteriorApplicationInput, record: ExteriorApplicationRecord | null): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    const request = record
      ? this.api.replaceExteriorApplication(projectId, record.id, record.version, application)
      : this.api.createExteriorApplication(projectId, application);
    this.failure.save(request, {
      saving: this.saving,
      saved: (saved) => {
        this.editing.set(null);
        this.store.upsertExterior(saved);
      },
      reload: () => this.reload(),
    });
  }

  /** No question first: the snackbar's Undo brings the application back with its id. */
  protected remove(record: ExteriorApplicationRecord, label: string): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    this.failure.save(this.api.deleteExteriorApplication(projectId, record.id, record.version), {
      saving: this.saving,
      saved: () => {
        this.store.removeExterior(record.id);
        this.snackBar
          .open(`${inProjectUnits(label, this.store.units())}${record.description ? ` (${record.description})` : ''} removed`, 'Undo', {
            duration: 8000,
          })
          .onAction()
          .subscribe(() =>
            this.api.restoreExteriorApplication(projectId, record.id).subscribe({
              next: (restored) => this.store.upsertExterior(restored),
              error: (error: unknown) => this.failure.report(error, () => this.reload()),
            }),
          );
      },
      reload: () => this.reload(),
    });
  }

  private reload(): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    this.api.exteriorApplications(projectId).subscribe((applications) => {
      this.store.replaceExterior(applications);
    });
  }
}
