import { Directive, inject, input } from '@angular/core';
import { NgControl } from '@angular/forms';
import type { UnitSystem } from '../core/api/api-types';
import { loadMath, needsReading, readMeasure, type MeasureKind } from './measure';

/**
 * A numeric field that also takes what people type on site: "12 ft 6 in", "30*20", "3.2 m".
 * On leaving the field (or Enter) the text is read and replaced by the decimal it stands for in the
 * project's units; text that cannot be read stays, with the field's `measure` error saying what to write.
 */
@Directive({
  selector: 'input[alMeasure]',
  host: { '(blur)': 'read()', '(keydown.enter)': 'read()' },
})
export class MeasureInput {
  readonly alMeasure = input.required<MeasureKind>();
  readonly measureUnits = input<UnitSystem>('ip');
  private readonly field = inject(NgControl, { self: true });

  constructor() {
    // Fetched while the form is open, so reading on blur is immediate.
    void loadMath();
  }

  protected async read(): Promise<void> {
    const control = this.field.control;
    const text = typeof control?.value === 'string' ? control.value : '';
    if (!control || !needsReading(text)) return;
    const reading = await readMeasure(text, this.alMeasure(), this.measureUnits());
    if (control.value !== text) return;
    if (reading.kind === 'value') {
      control.setValue(reading.value);
      control.markAsDirty();
    } else {
      control.setErrors({ measure: reading.message, ...(control.errors ?? {}) });
      control.markAsTouched();
    }
  }
}
