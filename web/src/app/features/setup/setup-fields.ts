import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked, type Signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule, type AbstractControl } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, MatFormFieldModule, type MatFormFieldDefaultOptions } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { catchError, map, of, startWith, switchMap } from 'rxjs';
import type { AmendmentView, LightingZoneView, ProjectScope, UnitSystem } from '../../core/api/api-types';
import { unitLabels } from '../../shared/format';
import { UnverifiedCount } from '../../shared/unverified-count';
import { VerifyBadge } from '../../shared/verify-badge';
import { WorkspaceApi } from '../workspace/workspace-api';
import { coordinateExamples, coordinateInWords, parseCoordinate, siteWarnings, type Axis } from './coordinates';
import { fieldMessage as errorMessage } from '../../shared/field-message';
import type { SetupForm } from './setup-form';
import { isTimeZone, searchTimeZones, timeZoneLabel } from './time-zones';

export type SetupSection = 'identity' | 'site' | 'code' | 'building' | 'exterior' | 'people';

export const methodLabels = { 'space-by-space': 'Space-by-space method', 'building-area': 'Building area method' } as const;

export const scopeLabels: Record<ProjectScope, string> = {
  'new-building': 'New building',
  addition: 'Addition',
  alteration: 'Alteration',
  'tenant-improvement': 'Tenant improvement',
};

/** A control's value as a signal, following the form input when it is replaced. */
function controlValue<T>(form: Signal<SetupForm>, pick: (form: SetupForm) => AbstractControl<T>, initialValue: T): Signal<T> {
  return toSignal(toObservable(form).pipe(switchMap((current) => pick(current).valueChanges.pipe(startWith(pick(current).value)))), {
    initialValue,
  });
}

/** One section of the project set-up fields; the wizard shows one per step, the set-up page all. */
@Component({
  selector: 'al-setup-fields',
  imports: [
    ReactiveFormsModule,
    MatAutocompleteModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatRadioModule,
    MatSelectModule,
    UnverifiedCount,
    VerifyBadge,
  ],
  templateUrl: './setup-fields.html',
  styleUrl: './setup-fields.scss',
  // Hints and messages take the lines they need, so a long one never runs under the next field.
  providers: [
    {
      provide: MAT_FORM_FIELD_DEFAULT_OPTIONS,
      useValue: { appearance: 'outline', subscriptSizing: 'dynamic' } satisfies MatFormFieldDefaultOptions,
    },
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupFields {
  private readonly api = inject(WorkspaceApi);
  readonly form = input.required<SetupForm>();
  readonly section = input.required<SetupSection>();
  /** The project already holds lengths and areas, which a change of units converts. */
  readonly convertsData = input(false);
  /** The spaces' floor areas added up, in words, beside the gross floor area. */
  readonly spacesArea = input<string | null>(null);

  protected readonly methodLabels = methodLabels;
  protected readonly errorMessage = errorMessage;

  protected readonly editions = toSignal(this.api.editions().pipe(catchError(() => of([]))), { initialValue: [] });

  private readonly edition = controlValue(this.form, (form) => form.controls.code.controls.edition, '');
  private readonly units = controlValue<UnitSystem>(this.form, (form) => form.controls.code.controls.units, 'ip');
  protected readonly areaUnit = computed(() => unitLabels(this.units()).area);
  protected readonly scopes = Object.entries(scopeLabels).map(([value, label]) => ({ value: value as ProjectScope, label }));

  protected readonly methods = computed(() => {
    const edition = this.editions().find((candidate) => candidate.id === this.edition());
    return edition?.methods ?? (['space-by-space', 'building-area'] as const);
  });

  protected readonly zones = toSignal(
    toObservable(this.edition).pipe(
      switchMap((edition) =>
        edition
          ? this.api.lightingZones(edition).pipe(
              map((zones): { status: 'ready'; zones: LightingZoneView[] } => ({ status: 'ready', zones })),
              catchError(() => of({ status: 'failed' as const })),
              startWith({ status: 'loading' as const }),
            )
          : of({ status: 'no-edition' as const }),
      ),
    ),
    { initialValue: { status: 'no-edition' as const } },
  );
  /** The zones offered whose definition is not checked: each carries a "verify" mark. */
  protected readonly unverifiedZones = computed(() => {
    const zones = this.zones();
    return zones.status === 'ready' ? zones.zones.filter((zone) => !zone.verified).length : 0;
  });

  /**
   * The edition's jurisdiction amendments, as the service lists them for the edition chosen. Only
   * the section that shows them reads them, so that one instance alone drops and names them.
   */
  private readonly amendmentEdition = computed(() => (this.section() === 'code' ? this.edition() : ''));
  protected readonly amendments = toSignal(
    toObservable(this.amendmentEdition).pipe(
      switchMap((edition) =>
        edition
          ? this.api.amendments(edition).pipe(
              map((amendments): { status: 'ready'; edition: string; amendments: AmendmentView[] } => ({
                status: 'ready',
                edition,
                amendments,
              })),
              catchError(() => of({ status: 'failed' as const })),
              startWith({ status: 'loading' as const }),
            )
          : of({ status: 'no-edition' as const }),
      ),
    ),
    { initialValue: { status: 'no-edition' as const } },
  );
  protected readonly amendmentChoices = computed(() => {
    const state = this.amendments();
    return state.status === 'ready' ? state.amendments : [];
  });
  private readonly chosenAmendments = controlValue<string[]>(this.form, (form) => form.controls.code.controls.amendments, []);
  /** The choice in words for the closed field: the titles, or the model code alone. */
  protected readonly amendmentSummary = computed(() => {
    const chosen = this.chosenAmendments();
    if (chosen.length === 0) return 'Model code only';
    return chosen.map((key) => this.amendmentTitles.get(key) ?? 'An amendment this edition does not list').join('; ');
  });
  /** Titles of every amendment seen, so that one dropped with a change of edition is still named in words. */
  private readonly amendmentTitles = new Map<string, string>();
  /** The amendments a change of edition dropped, in words, until the next change. */
  protected readonly droppedAmendments = signal<readonly string[]>([]);

  private readonly timeZone = controlValue(this.form, (form) => form.controls.site.controls.timeZone, '');
  private readonly latitude = controlValue(this.form, (form) => form.controls.site.controls.latitude, '');
  private readonly longitude = controlValue(this.form, (form) => form.controls.site.controls.longitude, '');

  protected readonly timeZones = computed(() => searchTimeZones(this.timeZone()));
  protected readonly zoneLabel = timeZoneLabel;

  /** Each coordinate read back in words, so a converted or flipped value shows before it is saved. */
  protected readonly reading = computed(() => ({
    latitude: this.read(this.latitude(), 'latitude'),
    longitude: this.read(this.longitude(), 'longitude'),
  }));

  protected readonly siteWarnings = computed(() => {
    const latitude = parseCoordinate(this.latitude(), 'latitude');
    const longitude = parseCoordinate(this.longitude(), 'longitude');
    const zone = this.timeZone().trim();
    return siteWarnings(
      latitude.kind === 'ok' ? latitude.decimal : null,
      longitude.kind === 'ok' ? longitude.decimal : null,
      zone !== '' && isTimeZone(zone) ? zone : null,
    );
  });

  constructor() {
    // An amendment belongs to its edition: once the new edition's list is read, those it lacks are dropped, and the page says so.
    effect(() => {
      const state = this.amendments();
      untracked(() => {
        if (state.status !== 'ready') return;
        for (const amendment of state.amendments) this.amendmentTitles.set(amendment.key, amendment.title);
        const control = this.form().controls.code.controls.amendments;
        const known = new Set(state.amendments.map((amendment) => amendment.key));
        const dropped = control.value.filter((key) => !known.has(key));
        if (dropped.length === 0) return;
        control.setValue(control.value.filter((key) => known.has(key)));
        control.markAsDirty();
        this.droppedAmendments.set(dropped.map((key) => this.amendmentTitles.get(key) ?? 'an amendment of the former edition'));
      });
    });
  }

  private read(raw: string, axis: Axis): string {
    const parsed = parseCoordinate(raw, axis);
    if (parsed.kind !== 'ok') return `Decimal degrees or degrees, minutes and seconds: ${coordinateExamples[axis]}`;
    const words = coordinateInWords(parsed.decimal, axis);
    return parsed.converted ? `${words}: saved as ${parsed.decimal.replace(/^-/, '−')}` : words;
  }

  /** A coordinate typed in degrees and minutes becomes the decimal the project keeps, once the field is left. */
  protected settle(axis: Axis): void {
    const control = this.form().controls.site.controls[axis];
    const parsed = parseCoordinate(control.value, axis);
    if (parsed.kind === 'ok' && parsed.converted) control.setValue(parsed.decimal);
  }

  protected zoneNumber(zone: LightingZoneView): number {
    return Number(zone.zone);
  }
}
