import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, untracked, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { ProjectRole } from '../../core/api/api-types';

export interface TeamEntry {
  userId?: string;
  name?: string;
  email: string;
  role: ProjectRole;
}

export const roleLabels: Record<ProjectRole, string> = {
  engineer: 'Engineer (designer of record)',
  reviewer: 'Reviewer (plan reviewer or commissioning agent)',
  contractor: 'Contractor',
};

const roleIcons: Record<ProjectRole, string> = { engineer: 'engineering', reviewer: 'rule', contractor: 'construction' };

/** A project's team: who is on it in which role, and (for those who may) a form to add or remove people. */
@Component({
  selector: 'al-team-editor',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, MatTooltipModule],
  template: `
    <ul class="team" aria-label="Team members">
      @for (member of members(); track member.email) {
        <li>
          <mat-icon aria-hidden="true">{{ icons[member.role] }}</mat-icon>
          <span class="who">{{ member.name ?? member.email }}</span>
          <span class="role">{{ labels[member.role] }}</span>
          @if (member.name) {
            <span class="email">{{ member.email }}</span>
          }
          @if (canManage() && removable(member)) {
            <button
              mat-icon-button
              type="button"
              (click)="removed.emit(member)"
              [disabled]="busy()"
              [attr.aria-label]="'Remove ' + (member.name ?? member.email)"
              matTooltip="Remove from the project"
            >
              <mat-icon>person_remove</mat-icon>
            </button>
          }
        </li>
      }
    </ul>
    @if (canManage()) {
      <form class="add" [formGroup]="form" (ngSubmit)="add()" novalidate>
        <mat-form-field appearance="outline" subscriptSizing="dynamic">
          <mat-label>E-mail address</mat-label>
          <input matInput type="email" formControlName="email" autocomplete="off" />
          <mat-hint
            ><span role="status" class="not-added">{{ notAddedShown() ? notAddedMessage : '' }}</span>
            @if (!notAddedShown()) {
              <span>The person needs an account</span>
            }
          </mat-hint>
          @if (form.controls.email.hasError('required')) {
            <mat-error>Enter an e-mail address.</mat-error>
          } @else if (form.controls.email.hasError('email')) {
            <mat-error>Enter a valid e-mail address.</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Role</mat-label>
          <mat-select formControlName="role">
            <mat-option value="reviewer">Reviewer</mat-option>
            <mat-option value="contractor">Contractor</mat-option>
            <mat-option value="engineer">Engineer</mat-option>
          </mat-select>
        </mat-form-field>
        <button mat-stroked-button type="submit" [disabled]="busy()"><mat-icon>person_add</mat-icon>Add to the team</button>
      </form>
      @if (error(); as message) {
        <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
      }
    }
  `,
  styles: `
    .team {
      list-style: none;
      margin: 0 0 12px;
      padding: 0;
      display: grid;
      gap: 8px;
    }
    li {
      display: flex;
      align-items: center;
      gap: 12px;
      flex-wrap: wrap;
    }
    .who {
      font: var(--mat-sys-title-small);
    }
    .role,
    .email {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .add {
      display: flex;
      gap: 12px;
      align-items: baseline;
      flex-wrap: wrap;
    }
    .add mat-form-field:first-child {
      flex: 1 1 280px;
    }
    .not-added {
      color: var(--mat-sys-on-surface);
    }
    .failure {
      display: flex;
      gap: 8px;
      align-items: center;
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TeamEditor {
  readonly members = input.required<readonly TeamEntry[]>();
  readonly canManage = input(false);
  readonly busy = input(false);
  /** The service's message when the last change was refused. */
  readonly error = input<string | null>(null);
  /**
   * The address of the last addition when the team that came back does not hold it. The service
   * answers the same whether or not an address has an account, so the words say no more than that.
   */
  readonly notAdded = input<string | null>(null);
  readonly added = output<{ email: string; role: ProjectRole }>();
  readonly removed = output<TeamEntry>();

  protected readonly labels = roleLabels;
  protected readonly icons = roleIcons;
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    role: ['reviewer' as ProjectRole, Validators.required],
  });
  private readonly formDirective = viewChild(FormGroupDirective);
  private readonly engineers = computed(() => this.members().filter((member) => member.role === 'engineer').length);
  private readonly typed = toSignal(this.form.controls.email.valueChanges, { initialValue: '' });
  protected readonly notAddedMessage =
    'No one was added for that address. Check it, or invite the person by e-mail on the Set-up page: the invitation makes their account.';
  /** Shown while the field still holds that address; typing another one clears it. */
  protected readonly notAddedShown = computed(() => {
    const address = this.notAdded();
    return address !== null && sameAddress(address, this.typed());
  });
  /** The address sent last; the field keeps it until the team that comes back holds it. */
  private submitted: { email: string; role: ProjectRole } | null = null;

  constructor() {
    effect(() => {
      const members = this.members();
      untracked(() => {
        const submitted = this.submitted;
        if (!submitted || !members.some((member) => sameAddress(member.email, submitted.email))) return;
        this.submitted = null;
        // Reset through the directive too, so the emptied field is not shown as an error of the last submit.
        this.formDirective()?.resetForm({ email: '', role: submitted.role });
      });
    });
  }

  /** A project always keeps an engineer of record. */
  protected removable(member: TeamEntry): boolean {
    return member.role !== 'engineer' || this.engineers() > 1;
  }

  protected add(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, role } = this.form.getRawValue();
    this.submitted = { email: email.trim(), role };
    this.added.emit(this.submitted);
  }
}

function sameAddress(a: string, b: string): boolean {
  return a.trim().toLocaleLowerCase() === b.trim().toLocaleLowerCase();
}
