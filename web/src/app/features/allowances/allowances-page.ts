import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  linkedSignal,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink } from '@angular/router';
import { catchError, of, switchMap } from 'rxjs';
import type { AdditionalAllowanceView, AllowanceClaim, EvaluationResult, SpaceRecord } from '../../core/api/api-types';
import { ApiError } from '../../core/http/api-error';
import { allowanceStatus } from '../../shared/allowance-status';
import { CardRows } from '../../shared/card-rows';
import { SpacePicker } from '../../shared/space-picker';
import { placeServerErrors, WriteFailure } from '../../shared/write-failure';
import { areaFigure, densityFigure, formatArea, formatWatts, unitLabels, wattsFigure } from '../../shared/format';
import { inProjectUnits } from '../../shared/unit-words';
import type { HasUnsavedChanges } from '../../shared/unsaved-changes';
import { VerifyBadge } from '../../shared/verify-badge';
import { densityInUnits } from '../spaces/space-rows';
import { ProjectStore } from '../workspace/project-store';
import { WorkspaceApi } from '../workspace/workspace-api';
import { AllowancesApi, type AllowanceClaimInput } from './allowances-api';
import { claimAreaValidator, claimLines, salesFloorType, usageWords, type ClaimLine } from './claim-lines';

/**
 * Each space's claims on the edition's additional allowances (retail display on a sales floor,
 * decorative on any space where the edition offers it), with the rate and source of each, and what
 * the evaluation lets the space use: each covers only the luminaires it is for.
 */
@Component({
  selector: 'al-allowances-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatListModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTooltipModule,
    CardRows,
    SpacePicker,
    VerifyBadge,
  ],
  templateUrl: './allowances-page.html',
  styleUrl: './allowances-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllowancesPage implements HasUnsavedChanges {
  protected readonly store = inject(ProjectStore);
  private readonly workspace = inject(WorkspaceApi);
  private readonly api = inject(AllowancesApi);
  private readonly failure = inject(WriteFailure);
  private readonly snackBar = inject(MatSnackBar);

  /** The space to open, from `?space=`. */
  readonly space = input<string>();

  protected readonly figures = { watts: wattsFigure, area: areaFigure };
  protected readonly labels = computed(() => unitLabels(this.store.units()));
  protected readonly spaceBySpace = computed(() => this.store.project()?.method === 'space-by-space');
  private readonly edition = computed(() => this.store.project()?.edition ?? null);

  protected readonly catalogue = toSignal(
    toObservable(this.edition).pipe(
      switchMap((edition) => (edition ? this.workspace.additionalAllowances(edition) : of<AdditionalAllowanceView[]>([]))),
      catchError(() => of<AdditionalAllowanceView[]>([])),
    ),
    { initialValue: [] },
  );

  private readonly reloads = signal(0);
  protected readonly claims = signal<AllowanceClaim[] | null>(null);
  protected readonly loadError = signal<string | null>(null);
  protected readonly saving = signal(false);

  /** The evaluation to read, the last one while a new one is computed. */
  private readonly result = computed<EvaluationResult | null>(() => {
    const state = this.store.results();
    return state.status === 'ready' ? state.result : state.status === 'updating' ? state.previous : null;
  });
  protected readonly updating = computed(() => this.store.results().status !== 'ready');
  protected readonly resultsProblem = computed(() => {
    const state = this.store.results();
    return state.status === 'incomplete' || state.status === 'failed' ? state.message : null;
  });

  protected readonly salesFloors = computed(() => this.store.spaces().filter((space) => space.spaceType === salesFloorType));
  /** The edition offers an allowance for decorative lighting (90.1; not the IECC), which any space may claim. */
  protected readonly offersDecorative = computed(() => this.catalogue().some((allowance) => allowance.kind === 'decorative'));
  /** The spaces that may claim something: every space where decorative lighting may be claimed, else the sales floors. */
  protected readonly claimable = computed(() => (this.offersDecorative() ? this.store.spaces() : this.salesFloors()));
  /** Claims the evaluation refuses until they are removed: any under the building area method, a retail display one off a sales floor. */
  protected readonly strayClaims = computed(() => {
    const sales = new Set(this.salesFloors().map((space) => space.id));
    const names = new Map(this.store.spaces().map((space) => [space.id, space.name]));
    return (this.claims() ?? [])
      .filter((claim) => !this.spaceBySpace() || (this.kindOf(claim.allowance) !== 'decorative' && !sales.has(claim.spaceId)))
      .map((claim) => ({ claim, spaceName: names.get(claim.spaceId) ?? 'A deleted space', label: this.allowanceLabel(claim.allowance) }));
  });

  private readonly chosenId = linkedSignal<string | undefined, string | null>({
    source: this.space,
    computation: (space, previous) => space ?? previous?.value ?? null,
  });
  protected readonly selected = computed<SpaceRecord | null>(() => {
    const floors = this.claimable();
    return floors.find((space) => space.id === this.chosenId()) ?? floors[0] ?? null;
  });
  protected readonly selectedResult = computed(() => {
    const space = this.selected();
    return space ? (this.store.resultBySpace().get(space.id) ?? null) : null;
  });
  protected readonly lines = computed<ClaimLine[]>(() => {
    const space = this.selected();
    return space ? claimLines(space.id, this.claims() ?? [], this.catalogue(), this.result()) : [];
  });

  protected readonly claimCount = computed(() => {
    const counts = new Map<string, number>();
    for (const claim of this.claims() ?? []) counts.set(claim.spaceId, (counts.get(claim.spaceId) ?? 0) + 1);
    return counts;
  });

  /** The space's figures from the evaluation: display and decorative lighting, what its claims come to, and what they may use. */
  protected readonly usage = computed(() => {
    const result = this.selectedResult();
    if (!result) return null;
    const lines = this.lines();
    const total = (of: readonly ClaimLine[], field: 'claimedW' | 'usableW') => of.reduce((sum, line) => sum + Number(line[field] ?? 0), 0);
    const watts = (value: number) => formatWatts(String(value));
    const decorative = lines.filter((line) => line.allowance?.kind === 'decorative');
    const display = lines.filter((line) => line.allowance?.kind !== 'decorative');
    const words = [
      ...(display.length > 0
        ? [usageWords(total(display, 'claimedW'), total(display, 'usableW'), Number(result.displayW), watts, 'display')]
        : []),
      ...(decorative.length > 0
        ? [usageWords(total(decorative, 'claimedW'), total(decorative, 'usableW'), Number(result.decorativeW), watts, 'decorative')]
        : []),
    ];
    return {
      displayW: result.displayW,
      decorativeW: result.decorativeW,
      claimedW: String(total(lines, 'claimedW')),
      usedW: result.additionalAllowanceW,
      words: words.length > 0 ? words.join(' ') : 'Nothing claimed yet.',
      status: allowanceStatus(result.withinAllowance, result.marginW, result.marginPct),
    };
  });

  /** The building's totals, with the edition's once-per-building wattage where it states one. */
  protected readonly building = computed(() => this.result()?.interior.additional ?? null);

  protected readonly editing = signal<AllowanceClaim | null>(null);
  private readonly formDirective = viewChild(FormGroupDirective);
  protected readonly form = new FormGroup({
    allowance: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    area: new FormControl('', {
      nonNullable: true,
      validators: [
        Validators.required,
        claimAreaValidator(
          () => this.selected(),
          () => this.store.units(),
        ),
      ],
    }),
  });
  /** Each allowance once per space: what is left to claim here (and the one being changed); retail display on a sales floor only. */
  protected readonly choices = computed(() => {
    const claimed = new Set(this.lines().map((line) => line.claim.allowance));
    const editing = this.editing()?.allowance;
    const onSalesFloor = this.selected()?.spaceType === salesFloorType;
    return this.catalogue().filter(
      (allowance) => (onSalesFloor || allowance.kind === 'decorative') && (!claimed.has(allowance.key) || allowance.key === editing),
    );
  });
  /** The kind of the allowance chosen in the form, for the words of the area's hint. */
  private readonly chosenAllowance = toSignal(this.form.controls.allowance.valueChanges, { initialValue: '' });
  protected readonly claimsDecorative = computed(() => this.kindOf(this.chosenAllowance()) === 'decorative');

  constructor() {
    effect(() => {
      const projectId = this.store.projectId();
      this.reloads();
      if (!projectId) return;
      untracked(() =>
        this.api.claims(projectId).subscribe({
          next: (claims) => {
            this.loadError.set(null);
            this.claims.set(claims);
          },
          error: (error: unknown) => this.loadError.set(error instanceof ApiError ? error.message : 'The claims could not be loaded.'),
        }),
      );
    });
    effect(() => {
      this.selected();
      untracked(() => this.cancel());
    });
    effect(() => {
      if (this.store.canEdit()) this.form.enable({ emitEvent: false });
      else this.form.disable({ emitEvent: false });
    });
  }

  hasUnsavedChanges(): boolean {
    return this.form.dirty;
  }

  protected select(spaceId: string): void {
    this.chosenId.set(spaceId);
  }

  protected rate(allowance: AdditionalAllowanceView | undefined): string {
    return allowance ? densityFigure(densityInUnits(allowance.lpdWPerFt2, this.store.units())) : '—';
  }

  private kindOf(key: string): AdditionalAllowanceView['kind'] | undefined {
    return this.catalogue().find((allowance) => allowance.key === key)?.kind;
  }

  protected allowanceLabel(key: string): string {
    return this.catalogue().find((allowance) => allowance.key === key)?.label ?? 'An allowance this edition does not offer';
  }

  /** Code-table words name feet; an SI project reads metres. */
  protected inUnits(words: string): string {
    return inProjectUnits(words, this.store.units());
  }

  protected spaceArea(space: SpaceRecord): string {
    return formatArea(space.area, this.store.units());
  }

  protected change(claim: AllowanceClaim): void {
    this.editing.set(claim);
    this.form.reset({ allowance: claim.allowance, area: claim.area });
  }

  /** Resets through the form's directive too, so a submitted form shows no message for the blank fields that follow. */
  protected cancel(): void {
    this.editing.set(null);
    const blank = { allowance: '', area: '' };
    const directive = this.formDirective();
    if (directive) directive.resetForm(blank);
    else this.form.reset(blank);
  }

  protected save(): void {
    const projectId = this.store.projectId();
    const space = this.selected();
    if (!projectId || !space) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    const input: AllowanceClaimInput = { spaceId: space.id, allowance: value.allowance, area: value.area.trim() };
    const editing = this.editing();
    this.failure.save(editing ? this.api.replace(projectId, editing.id, editing.version, input) : this.api.create(projectId, input), {
      saving: this.saving,
      saved: (saved) => {
        this.claims.update((claims) => {
          const list = claims ?? [];
          return list.some((claim) => claim.id === saved.id)
            ? list.map((claim) => (claim.id === saved.id ? saved : claim))
            : [...list, saved];
        });
        this.cancel();
        this.store.refreshResults();
      },
      invalid: (error) => {
        const unplaced = placeServerErrors(error.details, (path) =>
          path === 'area' ? this.form.controls.area : path === 'allowance' ? this.form.controls.allowance : null,
        );
        if (unplaced.length) this.snackBar.open(unplaced.map((detail) => detail.message).join(' '), 'Dismiss', { duration: 8000 });
      },
      reload: () => this.reload(),
    });
  }

  protected remove(claim: AllowanceClaim): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    this.failure.save(this.api.remove(projectId, claim.id, claim.version), {
      saving: this.saving,
      saved: () => {
        this.claims.update((claims) => (claims ?? []).filter((other) => other.id !== claim.id));
        this.store.refreshResults();
        const words = `Claim on “${this.allowanceLabel(claim.allowance)}” removed`;
        // Undo brings the claim back with its id; one the evaluation could not take (retail display off a sales floor) is not offered back.
        const takeable =
          this.spaceBySpace() &&
          (this.kindOf(claim.allowance) === 'decorative' || this.salesFloors().some((space) => space.id === claim.spaceId));
        this.snackBar
          .open(words, takeable ? 'Undo' : undefined, { duration: 8000 })
          .onAction()
          .subscribe(() =>
            this.api.restore(projectId, claim.id).subscribe({
              next: (restored) => {
                this.claims.update((claims) => [...(claims ?? []).filter((other) => other.id !== restored.id), restored]);
                this.store.refreshResults();
              },
              error: (error: unknown) => this.failure.report(error, () => this.reload()),
            }),
          );
      },
      reload: () => this.reload(),
    });
  }

  private reload(): void {
    this.reloads.update((count) => count + 1);
  }
}
