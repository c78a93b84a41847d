import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { SpaceRecord } from '../../core/api/api-types';
import { placeServerErrors, WriteFailure } from '../../shared/write-failure';
import { InUnits } from '../../shared/in-units';
import { ProblemList } from '../../shared/problem-list';
import { problemLine, type ProblemLine } from '../../shared/problem-words';
import { ProjectStore } from '../workspace/project-store';
import { WorkspaceApi } from '../workspace/workspace-api';
import { ControlFields } from './control-fields';
import { controlForm, providedControl } from './control-form';

/** A space as the chooser lists it: its type's key under the project's method, and the type in words. */
interface Choice {
  space: SpaceRecord;
  typeKey: string | undefined;
  type: string;
}

/** Many spaces get what is provided or excepted; "not provided" is what they have before. */
function provisionForm(strategy: () => string) {
  const form = controlForm(undefined, strategy);
  form.controls.mode.setValue('provided');
  return form;
}

/**
 * One provided control, or one exception with its reason, recorded on many spaces in one step:
 * choose spaces by type, level or name, then what to record. All or nothing on the service; a
 * stale space (someone saved it meanwhile) is named, with a way to read the spaces again.
 */
@Component({
  selector: 'al-bulk-control-panel',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatExpansionModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    ControlFields,
    InUnits,
    ProblemList,
  ],
  templateUrl: './bulk-control-panel.html',
  styleUrl: './bulk-control-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BulkControlPanel {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(WorkspaceApi);
  private readonly failure = inject(WriteFailure);

  protected readonly filters = new FormGroup({
    type: new FormControl('', { nonNullable: true }),
    level: new FormControl('', { nonNullable: true }),
    text: new FormControl('', { nonNullable: true }),
  });
  protected readonly strategy = new FormControl('', { nonNullable: true, validators: [Validators.required] });
  protected readonly provision = provisionForm(() => this.strategy.value);
  /** One form, so Enter and the button submit through Angular, never as a page load. */
  protected readonly record = new FormGroup({ strategy: this.strategy, provision: this.provision });

  private readonly filterValue = toSignal(this.filters.valueChanges, { initialValue: this.filters.getRawValue() });
  protected readonly strategyKey = toSignal(this.strategy.valueChanges, { initialValue: '' });
  protected readonly selected = signal<ReadonlySet<string>>(new Set());
  protected readonly saving = signal(false);
  /** The spaces someone else changed since they were read, by name, after a refused write. */
  protected readonly stale = signal<readonly string[] | null>(null);
  protected readonly problems = signal<readonly ProblemLine[]>([]);
  protected readonly done = signal<string | null>(null);

  private readonly typeLabels = computed(() => {
    const tables = this.store.tables();
    return new Map([...(tables?.spaceTypes ?? []), ...(tables?.buildingAreaTypes ?? [])].map((type) => [type.key, type.label]));
  });
  private readonly choices = computed<Choice[]>(() => {
    const byArea = this.store.project()?.method === 'building-area';
    return this.store.spaces().map((space) => {
      const typeKey = byArea ? space.buildingAreaType : space.spaceType;
      return { space, typeKey, type: (typeKey && this.typeLabels().get(typeKey)) || 'No type chosen' };
    });
  });
  /** The types and levels the project's spaces use, for the filters. */
  protected readonly types = computed(() =>
    [...new Map(this.choices().flatMap((choice) => (choice.typeKey ? [[choice.typeKey, choice.type] as const] : []))).entries()].sort(
      (a, b) => a[1].localeCompare(b[1]),
    ),
  );
  protected readonly levels = computed(() => [
    ...new Set(
      this.store
        .spaces()
        .map((space) => space.level)
        .filter((level): level is string => !!level),
    ),
  ]);
  protected readonly shown = computed(() => {
    const { type, level, text } = this.filterValue();
    const words = (text ?? '').trim().toLocaleLowerCase();
    return this.choices().filter(
      (choice) =>
        (!type || choice.typeKey === type) &&
        (!level || choice.space.level === level) &&
        (words === '' || `${choice.space.name} ${choice.type} ${choice.space.level ?? ''}`.toLocaleLowerCase().includes(words)),
    );
  });
  protected readonly allShown = computed(
    () => this.shown().length > 0 && this.shown().every((choice) => this.selected().has(choice.space.id)),
  );
  protected readonly someShown = computed(() => !this.allShown() && this.shown().some((choice) => this.selected().has(choice.space.id)));
  private readonly chosenSpaces = computed(() => this.store.spaces().filter((space) => this.selected().has(space.id)));

  /** The strategies the evaluation applies to the project's spaces (all interior ones before the first result). */
  protected readonly strategies = computed(() => {
    const all = this.store.tables()?.controlStrategies ?? [];
    const results = this.store.resultBySpace();
    const applied = new Set<string>([...results.values()].flatMap((result) => result.controls.map((line) => line.strategy)));
    const listed =
      applied.size > 0
        ? all.filter((strategy) => applied.has(strategy.key))
        : all.filter((strategy) => !strategy.key.startsWith('exterior-'));
    return listed.map((strategy) => {
      const needed = this.chosenSpaces().filter((space) =>
        results.get(space.id)?.controls.some((line) => line.strategy === strategy.key && line.status !== 'not-required'),
      ).length;
      return { view: strategy, needed };
    });
  });
  protected readonly strategyView = computed(() => this.strategies().find((entry) => entry.view.key === this.strategyKey())?.view);
  /** "Checked against the adopted code" is offered where a chosen space's requirement is still to verify. */
  protected readonly offerChecked = computed(() => {
    const results = this.store.resultBySpace();
    return this.chosenSpaces().some((space) =>
      results.get(space.id)?.controls.some((line) => line.strategy === this.strategyKey() && line.requirement === 'to-verify'),
    );
  });

  constructor() {
    // The fields and rules follow the control chosen: a value only another control reads is neither checked nor sent.
    this.strategy.valueChanges.subscribe(() => this.provision.updateValueAndValidity());
  }

  protected toggle(spaceId: string, checked: boolean): void {
    this.selected.update((selected) => {
      const next = new Set(selected);
      if (checked) next.add(spaceId);
      else next.delete(spaceId);
      return next;
    });
  }

  protected toggleShown(checked: boolean): void {
    this.selected.update((selected) => {
      const next = new Set(selected);
      for (const choice of this.shown()) {
        if (checked) next.add(choice.space.id);
        else next.delete(choice.space.id);
      }
      return next;
    });
  }

  protected clear(): void {
    this.selected.set(new Set());
  }

  protected apply(): void {
    const projectId = this.store.projectId();
    const spaces = this.chosenSpaces();
    const strategy = this.strategyView();
    this.strategy.markAsTouched();
    this.provision.markAllAsTouched();
    if (!projectId || spaces.length === 0 || !strategy || this.provision.invalid) return;
    const control = providedControl(strategy.key, this.provision.getRawValue());
    if (!control) return;
    this.stale.set(null);
    this.problems.set([]);
    this.done.set(null);
    this.failure.save(this.api.setControlOnSpaces(projectId, spaces, control), {
      saving: this.saving,
      saved: (saved) => {
        this.store.upsertSpaces(saved);
        const what = control.provided ? `“${strategy.label}” recorded as provided` : `An exception to “${strategy.label}” recorded`;
        this.done.set(`${what} on ${saved.length === 1 ? '1 space' : `${saved.length} spaces`}.`);
      },
      refused: (error) => {
        if (error.status !== 409 || error.code !== 'conflict') return false;
        // Each detail sits at the changed space's place in the request.
        const names = error.details.flatMap((detail) => {
          const index = /^spaces\.(\d+)$/.exec(detail.path)?.[1];
          const space = index === undefined ? undefined : spaces[Number(index)];
          return space ? [space.name] : [];
        });
        this.stale.set(names.length > 0 ? names : [error.message]);
        return true;
      },
      invalid: (error) => {
        // What names a field of the control (`control.exceptionNote`) goes beside it; the rest is listed.
        const unplaced = placeServerErrors(error.details, (path) => {
          const field = path.startsWith('control.') ? path.slice('control.'.length) : '';
          return field in this.provision.controls ? this.provision.get(field) : null;
        });
        this.problems.set(unplaced.map((detail) => problemLine(detail, { spaces })));
      },
      reload: () => this.reload(),
    });
  }

  /** Reads the spaces again after a refused write; the choice of spaces stays, with their new versions. */
  protected reload(): void {
    this.store.reloadSpaces().subscribe(() => this.stale.set(null));
  }
}
