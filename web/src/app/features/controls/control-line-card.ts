import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import type { ControlLine, ControlStrategyView, ProvidedControl, UnitSystem } from '../../core/api/api-types';
import { VerifyBadge } from '../../shared/verify-badge';
import { controlForm, providedControl, type ControlForm } from './control-form';
import { exceptionReasonLabels, requirementWords, statusView } from './control-status';

/** One control requirement of a space: its status in icon and words, why, where in the code, and (for the engineer) what is provided. */
@Component({
  selector: 'al-control-line-card',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, MatSelectModule, VerifyBadge],
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
  protected form: ControlForm = controlForm(undefined);
  protected readonly reasons = Object.entries(exceptionReasonLabels) as [keyof typeof exceptionReasonLabels, string][];
  protected readonly reasonLabels = exceptionReasonLabels;
  protected readonly view = computed(() => statusView(this.line().status));
  protected readonly requirement = computed(() => requirementWords(this.line().requirement));
  protected readonly timeoutLimit = computed(() => this.strategy()?.parameters['timeoutMinutes']);
  protected readonly zoneLimit = computed(() => this.strategy()?.parameters['zoneSizeLimitFt2']);
  protected readonly asksAutoOn = computed(() => this.line().strategy === 'occupant-sensor');
  protected readonly verifyNote = computed(() => {
    const strategy = this.strategy();
    if (this.line().requirement === 'to-verify') return 'The requirement itself could not be decided from the data; check it against the adopted code text.';
    return strategy?.note ? `${strategy.source}: ${strategy.note}` : (strategy?.source ?? 'The source of this requirement is not verified.');
  });
  protected readonly areaUnit = computed(() => (this.units() === 'ip' ? 'ft²' : 'm²'));

  /** An open form with edits not yet saved. */
  hasUnsavedChanges(): boolean {
    return this.editing() && this.form.dirty;
  }

  open(): void {
    this.form = controlForm(this.provided());
    this.editing.set(true);
  }

  cancel(): void {
    this.editing.set(false);
  }

  submit(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    this.save.emit(providedControl(this.line().strategy, this.form.getRawValue()));
    this.editing.set(false);
  }
}
