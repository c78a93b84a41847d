import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule, type MatAutocompleteSelectedEvent } from '@angular/material/autocomplete';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { searchTypes, type TypeOption } from './space-import-match';

/** One name of the sheet that no type of the edition matched: the engineer says which type it means. */
@Component({
  selector: 'al-space-import-name-picker',
  imports: [ReactiveFormsModule, MatAutocompleteModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <div class="name">
      <span class="sheet-name">“{{ name() }}”</span>
      <span class="rows">{{ rows() }} row{{ rows() === 1 ? '' : 's' }}</span>
    </div>
    <mat-form-field appearance="outline" subscriptSizing="dynamic" class="picker">
      <mat-label>{{ kindLabel() }} it means</mat-label>
      <input matInput [formControl]="query" [matAutocomplete]="list" autocomplete="off" />
      <mat-autocomplete #list="matAutocomplete" [displayWith]="display" (optionSelected)="choose($event)">
        @for (type of options(); track type.key) {
          <mat-option [value]="type">{{ type.label }}</mat-option>
        } @empty {
          <mat-option disabled>No type matches; try other words.</mat-option>
        }
      </mat-autocomplete>
      @if (chosen(); as type) {
        <mat-hint
          ><mat-icon aria-hidden="true" class="ok">check</mat-icon>Matched to {{ type.label }}; remembered for this project when you
          import.</mat-hint
        >
      }
    </mat-form-field>
  `,
  styles: `
    :host {
      display: grid;
      grid-template-columns: minmax(160px, 1fr) minmax(240px, 2fr);
      gap: 12px;
      align-items: center;
    }
    .name {
      display: flex;
      flex-direction: column;
    }
    .sheet-name {
      font: var(--mat-sys-title-small);
      overflow-wrap: anywhere;
    }
    .rows {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .picker {
      width: 100%;
    }
    mat-hint {
      display: inline-flex;
      align-items: center;
      gap: 4px;
    }
    .ok {
      font-size: 16px;
      width: 16px;
      height: 16px;
      color: var(--mat-sys-primary);
    }
    @media (max-width: 599px) {
      :host {
        grid-template-columns: 1fr;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpaceImportNamePicker {
  readonly name = input.required<string>();
  readonly rows = input.required<number>();
  readonly kindLabel = input.required<string>();
  readonly types = input.required<readonly TypeOption[]>();
  readonly chosenKey = input<string | null>(null);
  readonly matched = output<string>();

  protected readonly query = new FormControl<string | TypeOption>('', { nonNullable: true });
  private readonly queryText = signal('');
  protected readonly chosen = computed(() => this.types().find((type) => type.key === this.chosenKey()) ?? null);
  /** Before anything is typed, the types that share a word with the sheet's name come first. */
  protected readonly options = computed(() => {
    const typed = this.queryText();
    if (typed.trim() !== '') return searchTypes(this.types(), typed);
    const likely = searchTypes(this.types(), this.name());
    const likelyKeys = new Set(likely.map((type) => type.key));
    return likely.length === this.types().length ? likely : [...likely, ...this.types().filter((type) => !likelyKeys.has(type.key))];
  });

  constructor() {
    this.query.valueChanges.subscribe((value) => this.queryText.set(typeof value === 'string' ? value : ''));
  }

  protected readonly display = (value: string | TypeOption | null): string =>
    value && typeof value !== 'string' ? value.label : (value ?? '');

  protected choose(event: MatAutocompleteSelectedEvent): void {
    const type = event.option.value as TypeOption;
    this.queryText.set('');
    this.matched.emit(type.key);
  }
}
