import { Pipe, type PipeTransform } from '@angular/core';
import type { UnitSystem } from '../core/api/api-types';
import { inProjectUnits } from './unit-words';

/** `{{ type.label | inUnits: units }}`: code-table text in the project's units. */
@Pipe({ name: 'inUnits' })
export class InUnits implements PipeTransform {
  transform(text: string | null | undefined, units: UnitSystem): string {
    return text ? inProjectUnits(text, units) : '';
  }
}
