import { ChangeDetectionStrategy, Component, computed, effect, input, signal, untracked } from '@angular/core';
import { FormControl, ReactiveFormsModule, type AbstractControl, type ValidationErrors } from '@angular/forms';
import type { ErrorStateMatcher } from '@angular/material/core';
import { MatAutocompleteModule, type MatAutocompleteSelectedEvent } from '@angular/material/autocomplete';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { SpaceTypeView, UnitSystem } from '../../core/api/api-types';
import { InUnits } from '../../shared/in-units';
import { inProjectUnits } from '../../shared/unit-words';
import { VerifyBadge } from '../../shared/verify-badge';
import { spaceTypeAllowance } from './space-rows';

export const categoryLabels: Partial<Record<string, string>> = {
  common: 'Common space types',
  'building-specific': 'Building-specific space types',
};

export interface SpaceTypeGroup {
  category: string;
  label: string;
  types: SpaceTypeView[];
}

export function groupSpaceTypes(types: readonly SpaceTypeView[], query: string): SpaceTypeGroup[] {
  const words = query.trim().toLocaleLowerCase().split(/\s+/).filter(Boolean);
  const groups = new Map<string, SpaceTypeView[]>();
  for (const type of types) {
    const haystack = `${type.label} ${type.sourceLabel} ${type.key}`.toLocaleLowerCase();
    if (!words.every((word) => haystack.includes(word))) continue;
    const members = groups.get(type.category) ?? [];
    members.push(type);
    groups.set(type.category, members);
  }
  return [...groups].map(([category, members]) => ({ category, label: categoryLabels[category] ?? category, types: members }));
}

/** A space type chosen from the edition's table: grouped by category, filtered as you type. */
@Component({
  selector: 'al-space-type-picker',
  imports: [ReactiveFormsModule, MatAutocompleteModule, MatFormFieldModule, MatInputModule, InUnits, VerifyBadge],
  template: `
    <mat-form-field appearance="outline" class="picker">
      <mat-label>{{ label() }}</mat-label>
      <input
        matInput
        [formControl]="query"
        [matAutocomplete]="list"
        [errorStateMatcher]="outerError"
        [required]="required()"
        (blur)="settle()"
        autocomplete="off"
      />
      <mat-autocomplete #list="matAutocomplete" [displayWith]="display" (optionSelected)="choose($event)" class="space-type-options">
        @for (group of groups(); track group.category) {
          <mat-optgroup [label]="group.label">
            @for (type of group.types; track type.key) {
              <mat-option [value]="type">
                <span class="option">
                  <span class="name">{{ type.label | inUnits: units() }}</span>
                  @if (!type.verified) {
                    <al-verify-badge [citation]="type.citation" [units]="units()" />
                  }
                  <span class="lpd">{{ density(type) }}</span>
                </span>
                <span class="source-label">{{ type.sourceLabel | inUnits: units() }}</span>
              </mat-option>
            }
          </mat-optgroup>
        } @empty {
          <mat-option disabled>No space type matches.</mat-option>
        }
      </mat-autocomplete>
      @if (chosen(); as type) {
        <mat-hint>{{ density(type) }} · {{ type.sourceLabel }}</mat-hint>
      }
      @if (errors()?.['required']) {
        <mat-error>Choose a space type from the list.</mat-error>
      } @else if (errors()?.['server']; as message) {
        <mat-error>{{ message | inUnits: units() }}</mat-error>
      }
    </mat-form-field>
  `,
  styles: `
    :host {
      display: block;
    }
    .picker {
      width: 100%;
    }
    .option {
      display: flex;
      align-items: center;
      gap: 8px;
    }
    .name {
      flex: 1;
    }
    .lpd {
      font-variant-numeric: tabular-nums;
      color: var(--mat-sys-on-surface-variant);
      white-space: nowrap;
    }
    .source-label {
      display: block;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpaceTypePicker {
  /** The chosen type's key; empty until a row of the table is chosen. */
  readonly control = input.required<FormControl<string>>();
  readonly spaceTypes = input.required<readonly SpaceTypeView[]>();
  readonly units = input<UnitSystem>('ip');
  readonly label = input('Space type');
  readonly required = input(true);

  protected readonly query = new FormControl<string | SpaceTypeView>('', { nonNullable: true });
  private readonly queryText = signal('');
  private readonly key = signal('');
  /** The outer control's errors, followed on every status change so that a refusal the service sends shows at once. */
  protected readonly errors = signal<ValidationErrors | null>(null);

  protected readonly groups = computed(() => groupSpaceTypes(this.spaceTypes(), this.queryText()));
  protected readonly chosen = computed(() => this.spaceTypes().find((type) => type.key === this.key()) ?? null);
  protected readonly outerError: ErrorStateMatcher = { isErrorState: () => this.isOuterInvalid(this.control()) };

  constructor() {
    this.query.valueChanges.subscribe((value) => this.queryText.set(typeof value === 'string' ? value : ''));
    effect((onCleanup) => {
      const control = this.control();
      const types = this.spaceTypes();
      untracked(() => {
        const show = () => {
          this.key.set(control.value);
          this.errors.set(control.errors);
          const type = types.find((candidate) => candidate.key === control.value);
          if (type && this.query.value !== type) this.query.setValue(type, { emitEvent: false });
          if (control.disabled) this.query.disable({ emitEvent: false });
          else this.query.enable({ emitEvent: false });
        };
        show();
        const subscription = control.valueChanges.subscribe(show);
        const status = control.statusChanges.subscribe(show);
        onCleanup(() => {
          subscription.unsubscribe();
          status.unsubscribe();
        });
      });
    });
  }

  protected readonly display = (value: string | SpaceTypeView | null): string =>
    value && typeof value !== 'string' ? inProjectUnits(value.label, this.units()) : (value ?? '');

  protected density(type: SpaceTypeView): string {
    return spaceTypeAllowance(type, this.units());
  }

  protected choose(event: MatAutocompleteSelectedEvent): void {
    const type = event.option.value as SpaceTypeView;
    const control = this.control();
    control.setValue(type.key);
    control.markAsDirty();
    this.queryText.set('');
  }

  /** Typed text counts only when it names a row exactly (by key, label or the edition's label). */
  protected settle(): void {
    const control = this.control();
    control.markAsTouched();
    const value = this.query.value;
    if (typeof value !== 'string') return;
    const text = value.trim().toLocaleLowerCase();
    const match = this.spaceTypes().find((type) =>
      [type.key, type.label, type.sourceLabel].some((name) => name.toLocaleLowerCase() === text),
    );
    if (match) {
      this.query.setValue(match, { emitEvent: false });
      if (control.value !== match.key) {
        control.setValue(match.key);
        control.markAsDirty();
      }
    } else if (control.value !== '') {
      control.setValue('');
      control.markAsDirty();
    }
  }

  private isOuterInvalid(control: AbstractControl): boolean {
    return control.invalid && (control.touched || control.dirty);
  }
}
