import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { ControlLine, ControlStrategyView, ProvidedControl, UnitSystem } from '../../core/api/api-types';
import type { ApiErrorDetail } from '../../core/http/api-error';
import { placeServerErrors } from '../../shared/write-failure';
import { VerifyBadge } from '../../shared/verify-badge';
import { ControlFields } from './control-fields';
import { controlForm, providedControl, type ControlForm } from './control-form';
import { exceptionReasonLabels, requirementWords, statusView } from './control-status';

/** One control requirement of a space: its status in icon and words, why, where in the code, and (for the engineer) what is provided. */
@Component({
  selector: 'al-control-line-card',
  imports: [ReactiveFormsModule, MatButtonModule, MatIconModule, VerifyBadge, ControlFields],
  templateUrl: './control-line-card.html',
  styleUrl: './control-line-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ControlLineCard {
  readonly line = input.required<ControlLine>();
  readonly provided = input<ProvidedControl | undefined>(undefined);
  readonly strategy = input<ControlStrategyView | undefined>(undefined);
  readonly canEdit = input(false);
  readonly stale = input(false);
  readonly saving = input(false);
  readonly units = input<UnitSystem>('ip');
  /** The entry to store for this strategy; null removes it. */
  readonly save = output<ProvidedControl | null>();

  protected readonly editing = signal(false);
  /** What the service refused that no field of the form takes. */
  protected readonly refusal = signal<string | null>(null);
  protected form: ControlForm = controlForm(undefined, () => this.line().strategy);
  protected readonly reasonLabels = exceptionReasonLabels;
  protected readonly view = computed(() => statusView(this.line().status));
  protected readonly requirement = computed(() => requirementWords(this.line().requirement));
  /** The doubt is the requirement itself where the data cannot settle it, else the strategy's source. */
  protected readonly undecided = computed(() => this.line().requirement === 'to-verify');
  protected readonly areaUnit = computed(() => (this.units() === 'ip' ? 'ft²' : 'm²'));
  /** "Checked against the adopted code" answers a requirement the data cannot settle, and nothing else. */
  protected readonly offerChecked = computed(
    () => this.line().requirement === 'to-verify' || this.provided()?.exceptionReason === 'verified-not-required',
  );

  /** An open form with edits not yet saved. */
  hasUnsavedChanges(): boolean {
    return this.editing() && this.form.dirty;
  }

  open(): void {
    this.form = controlForm(this.provided(), () => this.line().strategy);
    this.refusal.set(null);
    this.editing.set(true);
  }

  cancel(): void {
    this.editing.set(false);
  }

  /** The form stays open until the page says the entry is stored (`saved`) or refused (`refused`). */
  submit(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    this.refusal.set(null);
    this.save.emit(providedControl(this.line().strategy, this.form.getRawValue()));
  }

  saved(): void {
    this.editing.set(false);
  }

  /** The service's messages beside the fields they name (paths relative to this entry: `exceptionNote`); the rest below the form. */
  refused(details: readonly ApiErrorDetail[], message: string): void {
    const unplaced = placeServerErrors(details, (path) => (path in this.form.controls ? this.form.get(path) : null));
    this.refusal.set(details.length === 0 ? message : unplaced.length > 0 ? unplaced.map((detail) => detail.message).join(' ') : null);
  }
}
