import { FormArray, FormControl, FormGroup, type AbstractControl, type ValidationErrors, type ValidatorFn } from '@angular/forms';
import type { Skylight, Wall, WindowOpening } from '../../core/api/api-types';

/** The service's decimal syntax (document.ts). */
const decimalPattern = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

export interface Room {
  length: number | null;
  width: number | null;
}

function decimal(bound: 'positive' | 'non-negative', optional: boolean): ValidatorFn {
  return (control: AbstractControl<string>): ValidationErrors | null => {
    const text = control.value.trim();
    if (text === '') return optional ? null : { required: true };
    if (!decimalPattern.test(text)) return { decimal: true };
    const number = Number(text);
    if (number < 0) return { negative: true };
    if (bound === 'positive' && number === 0) return { positive: true };
    return null;
  };
}

const number = (text: string) => (text.trim() === '' ? null : Number(text));

/** Visible transmittance: blank (not recorded) or a fraction from 0 to 1, as the service bounds it. */
function transmittance(control: AbstractControl<string>): ValidationErrors | null {
  const text = control.value.trim();
  if (text === '') return null;
  if (!decimalPattern.test(text)) return { decimal: true };
  const value = Number(text);
  return value < 0 || value > 1 ? { range: 'Enter a number from 0 to 1.' } : null;
}

/** Whether daylight is blocked: not recorded, yes or no. A blank is never read as "no". */
export type Blocked = '' | 'yes' | 'no';
const blockedOf = (value: boolean | undefined): Blocked => (value === undefined ? '' : value ? 'yes' : 'no');

export type WindowForm = FormGroup<{
  wall: FormControl<Wall>;
  width: FormControl<string>;
  headHeight: FormControl<string>;
  sillHeight: FormControl<string>;
  offset: FormControl<string>;
  visibleTransmittance: FormControl<string>;
  daylightBlocked: FormControl<Blocked>;
}>;

export type SkylightForm = FormGroup<{
  length: FormControl<string>;
  width: FormControl<string>;
  x: FormControl<string>;
  y: FormControl<string>;
  visibleTransmittance: FormControl<string>;
  daylightBlocked: FormControl<Blocked>;
}>;

export type OpeningsForm = FormGroup<{ windows: FormArray<WindowForm>; skylights: FormArray<SkylightForm> }>;

/** The same geometry rules as the service: sill below head; each opening inside its wall or the ceiling. */
function windowRules(room: () => Room): ValidatorFn {
  return (group: AbstractControl): ValidationErrors | null => {
    const value = (group as WindowForm).getRawValue();
    const errors: ValidationErrors = {};
    const head = number(value.headHeight);
    const sill = number(value.sillHeight);
    if (head !== null && sill !== null && sill >= head) errors['sillAboveHead'] = true;
    const { length, width } = room();
    const wallLength = value.wall === 'north' || value.wall === 'south' ? length : width;
    const span = number(value.width);
    if (wallLength !== null && span !== null) {
      const end = (number(value.offset) ?? 0) + span;
      if (end > wallLength) errors['pastWall'] = wallLength;
    }
    return Object.keys(errors).length ? errors : null;
  };
}

function skylightRules(room: () => Room): ValidatorFn {
  return (group: AbstractControl): ValidationErrors | null => {
    const value = (group as SkylightForm).getRawValue();
    const errors: ValidationErrors = {};
    const { length, width } = room();
    const along = number(value.length);
    const across = number(value.width);
    if (length !== null && along !== null && (number(value.x) ?? 0) + along > length) errors['pastLength'] = length;
    if (width !== null && across !== null && (number(value.y) ?? 0) + across > width) errors['pastWidth'] = width;
    return Object.keys(errors).length ? errors : null;
  };
}

export function windowForm(room: () => Room, opening?: WindowOpening): WindowForm {
  return new FormGroup(
    {
      wall: new FormControl<Wall>(opening?.wall ?? 'south', { nonNullable: true }),
      width: new FormControl(opening?.width ?? '', { nonNullable: true, validators: [decimal('positive', false)] }),
      headHeight: new FormControl(opening?.headHeight ?? '', { nonNullable: true, validators: [decimal('positive', false)] }),
      sillHeight: new FormControl(opening?.sillHeight ?? '', { nonNullable: true, validators: [decimal('non-negative', true)] }),
      offset: new FormControl(opening?.offset ?? '', { nonNullable: true, validators: [decimal('non-negative', true)] }),
      visibleTransmittance: new FormControl(opening?.visibleTransmittance ?? '', { nonNullable: true, validators: [transmittance] }),
      daylightBlocked: new FormControl<Blocked>(blockedOf(opening?.daylightBlocked), { nonNullable: true }),
    },
    { validators: [windowRules(room)] },
  );
}

export function skylightForm(room: () => Room, skylight?: Skylight): SkylightForm {
  return new FormGroup(
    {
      length: new FormControl(skylight?.length ?? '', { nonNullable: true, validators: [decimal('positive', false)] }),
      width: new FormControl(skylight?.width ?? '', { nonNullable: true, validators: [decimal('positive', false)] }),
      x: new FormControl(skylight?.x ?? '', { nonNullable: true, validators: [decimal('non-negative', true)] }),
      y: new FormControl(skylight?.y ?? '', { nonNullable: true, validators: [decimal('non-negative', true)] }),
      visibleTransmittance: new FormControl(skylight?.visibleTransmittance ?? '', { nonNullable: true, validators: [transmittance] }),
      daylightBlocked: new FormControl<Blocked>(blockedOf(skylight?.daylightBlocked), { nonNullable: true }),
    },
    { validators: [skylightRules(room)] },
  );
}

export function openingsForm(room: () => Room, windows: readonly WindowOpening[], skylights: readonly Skylight[]): OpeningsForm {
  return new FormGroup({
    windows: new FormArray(windows.map((opening) => windowForm(room, opening))),
    skylights: new FormArray(skylights.map((skylight) => skylightForm(room, skylight))),
  });
}

/** Starts the form again from stored openings: the same form, so whatever follows its events keeps following it. */
export function fillOpenings(
  form: OpeningsForm,
  room: () => Room,
  windows: readonly WindowOpening[],
  skylights: readonly Skylight[],
): void {
  form.controls.windows.clear({ emitEvent: false });
  form.controls.skylights.clear({ emitEvent: false });
  for (const opening of windows) form.controls.windows.push(windowForm(room, opening), { emitEvent: false });
  for (const skylight of skylights) form.controls.skylights.push(skylightForm(room, skylight), { emitEvent: false });
  form.markAsPristine();
  form.markAsUntouched();
  form.updateValueAndValidity();
}

const optional = (text: string) => (text.trim() === '' ? undefined : text.trim());

/** The glazing fields of either opening, leaving out what is not recorded. */
function glazing(value: { visibleTransmittance: string; daylightBlocked: Blocked }): {
  visibleTransmittance?: string;
  daylightBlocked?: boolean;
} {
  const entry: { visibleTransmittance?: string; daylightBlocked?: boolean } = {};
  const vt = optional(value.visibleTransmittance);
  if (vt !== undefined) entry.visibleTransmittance = vt;
  if (value.daylightBlocked !== '') entry.daylightBlocked = value.daylightBlocked === 'yes';
  return entry;
}

/** The wire shape, leaving out blank optional fields (the engine then centres the opening). */
export function openingsValue(form: OpeningsForm): { windows: WindowOpening[]; skylights: Skylight[] } {
  const { windows, skylights } = form.getRawValue();
  return {
    windows: windows.map((opening) => {
      const entry: WindowOpening = { wall: opening.wall, width: opening.width.trim(), headHeight: opening.headHeight.trim() };
      const sill = optional(opening.sillHeight);
      const offset = optional(opening.offset);
      if (sill !== undefined) entry.sillHeight = sill;
      if (offset !== undefined) entry.offset = offset;
      return { ...entry, ...glazing(opening) };
    }),
    skylights: skylights.map((skylight) => {
      const entry: Skylight = { length: skylight.length.trim(), width: skylight.width.trim() };
      const x = optional(skylight.x);
      const y = optional(skylight.y);
      if (x !== undefined) entry.x = x;
      if (y !== undefined) entry.y = y;
      return { ...entry, ...glazing(skylight) };
    }),
  };
}
