import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { startWith, switchMap } from 'rxjs';
import type { ControlStrategyView, UnitSystem } from '../../core/api/api-types';
import { areaInUnits } from '../../shared/unit-words';
import { fieldMessage } from '../../shared/field-message';
import { reducesLighting, type ControlForm } from './control-form';
import { exceptionReasonLabels, reasonsFor } from './control-status';

/**
 * What is recorded for one control strategy: provided (device, time-out, how it turns on, zone
 * size) or an exception with its reason. Used for one space's line and for many spaces at once.
 */
@Component({
  selector: 'al-control-fields',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatRadioModule, MatSelectModule],
  templateUrl: './control-fields.html',
  styleUrl: './control-fields.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ControlFields {
  readonly form = input.required<ControlForm>();
  readonly strategy = input<ControlStrategyView | undefined>(undefined);
  readonly strategyKey = input.required<string>();
  readonly units = input<UnitSystem>('ip');
  /** "Not provided" removes a space's entry; recording on many spaces offers only what can be recorded. */
  readonly allowNone = input(true);

  /** "Checked against the adopted code" settles only a requirement to verify: offered where one is. */
  readonly offerChecked = input(true);

  protected readonly reasonLabels = exceptionReasonLabels;
  protected readonly reasons = computed(() => reasonsFor(this.strategyKey(), this.offerChecked()));
  private readonly reason = toSignal(
    toObservable(this.form).pipe(
      switchMap((form) => form.controls.exceptionReason.valueChanges.pipe(startWith(form.controls.exceptionReason.value))),
    ),
    {
      initialValue: '' as const,
    },
  );
  /** The reason chosen in words, also when the control chosen no longer offers it (the field then says why). */
  protected readonly reasonLabel = computed(() => {
    const reason = this.reason();
    return reason === '' ? '' : exceptionReasonLabels[reason];
  });
  /** What the note is for, as the reason chosen asks. */
  protected readonly noteHint = computed(() => {
    const reason = this.reason();
    if (reason === 'other') return 'Required: which exception is claimed, and where the code states it.';
    if (reason === 'verified-not-required') return 'Required: where in the adopted code it was checked (section, amendment).';
    return 'Optional.';
  });
  protected readonly timeoutLimit = computed(() => this.strategy()?.parameters['timeoutMinutes']);
  /** The code tables hold the limit in ft²; an SI project reads it in m². */
  protected readonly zoneLimit = computed(() => {
    const limit = this.strategy()?.parameters['zoneSizeLimitFt2'];
    return limit === undefined ? undefined : areaInUnits(limit, this.units());
  });
  protected readonly asksAutoOn = computed(() => this.strategyKey() === 'occupant-sensor');
  /** Partial OFF and light reduction are checked against how far they reduce the lighting. */
  protected readonly asksReduction = computed(() => reducesLighting(this.strategyKey()));
  protected readonly fieldMessage = fieldMessage;
  protected readonly areaUnit = computed(() => (this.units() === 'ip' ? 'ft²' : 'm²'));
}
