import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import {
  ReactiveFormsModule,
  Validators,
  type AbstractControl,
  type FormControl,
  type FormGroup,
  type NonNullableFormBuilder,
  type ValidationErrors,
} from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

export type NewPasswordGroup = FormGroup<{ password: FormControl<string>; repeat: FormControl<string> }>;

/** The repeated password must equal the first; the error sits on the repeat field. */
export function sameAsPassword(control: AbstractControl): ValidationErrors | null {
  const password = control.parent?.get('password')?.value as string | undefined;
  return control.value && password !== undefined && control.value !== password ? { mismatch: 'The two passwords differ.' } : null;
}

/** The new password and its repeat, with the length the service takes; a change of the first checks the repeat again. */
export function newPasswordGroup(fb: NonNullableFormBuilder): NewPasswordGroup {
  const group = fb.group({
    password: ['', [Validators.required, Validators.minLength(12), Validators.maxLength(64)]],
    repeat: ['', [Validators.required, sameAsPassword]],
  });
  group.controls.password.valueChanges.subscribe(() => group.controls.repeat.updateValueAndValidity({ emitEvent: false }));
  return group;
}

/** The two fields of a new password; `rulesId` names the sentence that states the rules. A `service` error is the service's refusal. */
@Component({
  selector: 'al-new-password-fields',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule],
  template: `
    <ng-container [formGroup]="group()">
      <mat-form-field appearance="outline">
        <mat-label>New password</mat-label>
        <input
          matInput
          type="password"
          formControlName="password"
          autocomplete="new-password"
          [attr.aria-describedby]="rulesId()"
          required
        />
        @let password = group().controls.password;
        @if (password.hasError('required')) {
          <mat-error>Enter the new password.</mat-error>
        } @else if (password.hasError('minlength')) {
          <mat-error>Use at least 12 characters.</mat-error>
        } @else if (password.hasError('maxlength')) {
          <mat-error>Use at most 64 characters.</mat-error>
        } @else if (password.hasError('service')) {
          <mat-error>{{ password.getError('service') }}</mat-error>
        }
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>New password again</mat-label>
        <input matInput type="password" formControlName="repeat" autocomplete="new-password" required />
        @let repeat = group().controls.repeat;
        @if (repeat.hasError('required')) {
          <mat-error>Enter the new password again.</mat-error>
        } @else if (repeat.hasError('mismatch')) {
          <mat-error>The two passwords differ.</mat-error>
        }
      </mat-form-field>
    </ng-container>
  `,
  styles: `
    :host {
      display: contents;
    }
    /* Beside other fields in a row, as on the Account page. */
    :host(.row) mat-form-field {
      flex: 1 1 220px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewPasswordFields {
  readonly group = input.required<NewPasswordGroup>();
  readonly rulesId = input.required<string>();
}
