import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, untracked } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { ProjectMember, ProjectRole } from '../../core/api/api-types';
import { ApiError } from '../../core/http/api-error';
import { WriteFailure } from '../../shared/write-failure';
import { formatArea } from '../../shared/format';
import type { HasUnsavedChanges } from '../../shared/unsaved-changes';
import { ProjectStore } from '../workspace/project-store';
import { WorkspaceApi } from '../workspace/workspace-api';
import { SetupFields } from './setup-fields';
import { InvitationsPanel } from './invitations-panel';
import { TeamEditor, type TeamEntry } from './team-editor';
import { fillSetup, setupForm, setupValue, showServerErrors } from './setup-form';

/** The project's set-up, editable after the wizard: the same fields, saved with the version read. */
@Component({
  selector: 'al-setup-page',
  imports: [ReactiveFormsModule, MatButtonModule, MatIconModule, MatProgressBarModule, SetupFields, TeamEditor, InvitationsPanel],
  templateUrl: './setup-page.html',
  styleUrl: './setup-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupPage implements HasUnsavedChanges {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(WorkspaceApi);
  private readonly writeFailure = inject(WriteFailure);
  protected readonly form = setupForm();
  protected readonly saving = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly hasDesignData = computed(() => this.store.spaces().length > 0 || this.store.exterior().length > 0);
  protected readonly spacesArea = computed(() => {
    const spaces = this.store.spaces();
    return spaces.length ? formatArea(String(spaces.reduce((sum, space) => sum + Number(space.area), 0)), this.store.units()) : null;
  });
  /** The version of the set-up the form was last filled from. */
  private baseVersion: number | null = null;
  protected readonly teamBusy = signal(false);
  protected readonly teamError = signal<string | null>(null);
  /** The address of the last addition when the team that came back does not hold it. */
  protected readonly teamNotAdded = signal<string | null>(null);

  constructor() {
    effect(() => {
      const project = this.store.project();
      const canEdit = this.store.canEdit();
      untracked(() => {
        if (project && !this.form.dirty) {
          fillSetup(this.form, project);
          this.baseVersion = project.version;
        }
        if (canEdit) this.form.enable({ emitEvent: false });
        else this.form.disable({ emitEvent: false });
      });
    });
  }

  hasUnsavedChanges(): boolean {
    return this.form.dirty;
  }

  protected save(): void {
    const project = this.store.project();
    if (!project) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.failure.set(null);
    // Saved against the set-up the form was filled from: a change someone made since is reported, not overwritten.
    this.writeFailure.save(this.api.updateSetup(project.id, this.baseVersion ?? project.version, setupValue(this.form)), {
      saving: this.saving,
      form: this.form,
      saved: (updated) => {
        fillSetup(this.form, updated);
        // New units come with every stored length and area converted: read the design again.
        if (updated.units !== project.units) this.store.load(updated.id).subscribe();
        else this.store.setProject(updated);
      },
      invalid: (error) => {
        const unplaced = showServerErrors(this.form, error.details);
        if (unplaced.length) this.failure.set(unplaced.map((detail) => detail.message).join(' '));
      },
      reload: () => this.reload(),
    });
  }

  protected addMember(entry: { email: string; role: ProjectRole }): void {
    const project = this.store.project();
    if (!project) return;
    this.changeTeam(this.api.setMember(project.id, entry.email, entry.role), (members) => {
      const added = members.some((member) => member.email.toLocaleLowerCase() === entry.email.toLocaleLowerCase());
      this.teamNotAdded.set(added ? null : entry.email);
    });
  }

  protected removeMember(member: TeamEntry): void {
    const project = this.store.project();
    if (project && member.userId) this.changeTeam(this.api.removeMember(project.id, member.userId));
  }

  /** Someone was added through the invitation form: the team as it is now. */
  protected readTeam(): void {
    const project = this.store.project();
    if (project) this.changeTeam(this.api.members(project.id));
  }

  private changeTeam(request: ReturnType<WorkspaceApi['members']>, check?: (members: ProjectMember[]) => void): void {
    this.teamBusy.set(true);
    this.teamError.set(null);
    this.teamNotAdded.set(null);
    request.subscribe({
      next: (members: ProjectMember[]) => {
        this.teamBusy.set(false);
        check?.(members);
        this.store.setMembers(members);
      },
      error: (error: unknown) => {
        this.teamBusy.set(false);
        this.teamError.set(
          error instanceof ApiError
            ? error.details[0]?.message
              ? `${error.message} ${error.details[0].message}`
              : error.message
            : 'The team could not be changed.',
        );
      },
    });
  }

  protected discard(): void {
    const project = this.store.project();
    if (project) fillSetup(this.form, project);
  }

  private reload(): void {
    const project = this.store.project();
    if (!project) return;
    this.api.project(project.id).subscribe((fresh) => {
      this.form.markAsPristine();
      fillSetup(this.form, fresh);
      this.store.setProject(fresh);
    });
  }
}
