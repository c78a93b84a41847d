import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import type { ControlStrategyView, UnitSystem } from '../../core/api/api-types';
import { areaInUnits } from '../../shared/unit-words';
import { fieldMessage } from '../spaces/space-form';
import { reducesLighting, type ControlForm } from './control-form';
import { exceptionReasonLabels } from './control-status';

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

  protected readonly reasons = Object.entries(exceptionReasonLabels) as [keyof typeof exceptionReasonLabels, string][];
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
