import { ChangeDetectionStrategy, Component, computed, effect, ElementRef, input, output, untracked, viewChild } from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { DaylightZoneKind, LuminaireGroup, LuminaireTypeRecord, SpaceRecord } from '../../core/api/api-types';
import { ranges } from '../../shared/number-range';
import { fieldMessage } from '../../shared/field-message';
import { MeasureInput } from '../../shared/measure-input';
import { quantityValidator } from '../spaces/space-form';
import { zoneLabels } from './luminaire-counts';

type ZoneChoice = DaylightZoneKind | 'none';

function groupForm(group?: LuminaireGroup) {
  return new FormGroup({
    tag: new FormControl(group?.tag ?? '', { nonNullable: true, validators: [Validators.required] }),
    count: new FormControl(group?.count ?? '', { nonNullable: true, validators: [Validators.required, quantityValidator(ranges.count)] }),
    zone: new FormControl<ZoneChoice>(group?.zone ?? 'none', { nonNullable: true }),
  });
}

/** One space's luminaire groups, each with the daylight zone it sits in. */
@Component({
  selector: 'al-space-counts',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, MeasureInput],
  templateUrl: './space-counts.html',
  styleUrl: './space-counts.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpaceCounts {
  readonly space = input.required<SpaceRecord>();
  readonly types = input.required<readonly LuminaireTypeRecord[]>();
  readonly canEdit = input(false);
  readonly saving = input(false);
  readonly save = output<LuminaireGroup[]>();
  readonly closed = output<void>();

  protected readonly groups = new FormArray<ReturnType<typeof groupForm>>([]);
  protected readonly zoneChoices = Object.keys(zoneLabels) as ZoneChoice[];
  protected readonly zoneLabels = zoneLabels;
  protected readonly fieldMessage = fieldMessage;
  private readonly useByTag = computed(() => new Map(this.types().map((type) => [type.tag, type.use])));
  private readonly heading = viewChild.required<ElementRef<HTMLElement>>('heading');

  constructor() {
    effect(() => {
      const space = this.space();
      const canEdit = this.canEdit();
      untracked(() => {
        this.groups.clear({ emitEvent: false });
        space.luminaires.forEach((group) => this.groups.push(groupForm(group), { emitEvent: false }));
        this.groups.markAsPristine();
        if (canEdit) this.groups.enable({ emitEvent: false });
        else this.groups.disable({ emitEvent: false });
      });
    });
  }

  /** On a phone the panel takes the list's place: the focus goes to its heading, which comes into view. */
  focusHeading(): void {
    const heading = this.heading().nativeElement;
    heading.scrollIntoView({ block: 'start' });
    heading.focus({ preventScroll: true });
  }

  hasUnsavedChanges(): boolean {
    return this.groups.dirty;
  }

  /** Only general lighting is assigned to a daylight zone (the service's rule). */
  protected isGeneral(tag: string): boolean {
    return this.useByTag().get(tag) === 'general';
  }

  protected add(): void {
    this.groups.push(groupForm());
    this.groups.markAsDirty();
  }

  protected removeAt(index: number): void {
    this.groups.removeAt(index);
    this.groups.markAsDirty();
  }

  protected submit(): void {
    if (this.groups.invalid) {
      this.groups.markAllAsTouched();
      return;
    }
    this.save.emit(
      this.groups.getRawValue().map(({ tag, count, zone }) => {
        const group: LuminaireGroup = { tag, count: count.trim() };
        if (zone !== 'none' && this.isGeneral(tag)) group.zone = zone;
        return group;
      }),
    );
  }
}
