import type { AbstractControl } from '@angular/forms';

/**
 * The one message shown beside a field, in the order a person fixes things: a missing value, too
 * long a text, then the words a check or the service gave (the service's own sentence, a value
 * that could not be read), then the plain number checks. `label` names the field in the sentence.
 */
export function fieldMessage(control: AbstractControl, label?: string): string | null {
  const errors = control.errors;
  if (!errors) return null;
  if (errors['required']) return label ? `${label} is required.` : 'Required.';
  const tooLong = errors['maxlength'] as { requiredLength: number } | undefined;
  if (tooLong) return `Use at most ${tooLong.requiredLength.toLocaleString('en-US')} characters.`;
  const words = Object.values(errors).find((value): value is string => typeof value === 'string');
  if (words) return words;
  if (errors['decimal']) return 'Enter a number.';
  if (errors['negative']) return 'Must not be negative.';
  if (errors['positive']) return 'Must be greater than zero.';
  return label ? `Check the ${label.toLocaleLowerCase()}.` : 'Check this value.';
}
