import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { catchError, map, of, startWith, switchMap } from 'rxjs';
import type { LightingZoneView } from '../../core/api/api-types';
import { UnverifiedCount } from '../../shared/unverified-count';
import { VerifyBadge } from '../../shared/verify-badge';
import { WorkspaceApi } from '../workspace/workspace-api';
import { errorMessage, type SetupForm } from './setup-form';

export type SetupSection = 'identity' | 'site' | 'code' | 'exterior';

const allTimeZones: readonly string[] = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : ['UTC'];

export const methodLabels = { 'space-by-space': 'Space-by-space method', 'building-area': 'Building area method' } as const;

/** One section of the project set-up fields; the wizard shows one per step, the set-up page all. */
@Component({
  selector: 'al-setup-fields',
  imports: [ReactiveFormsModule, MatAutocompleteModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, MatSelectModule, UnverifiedCount, VerifyBadge],
  templateUrl: './setup-fields.html',
  styleUrl: './setup-fields.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupFields {
  private readonly api = inject(WorkspaceApi);
  readonly form = input.required<SetupForm>();
  readonly section = input.required<SetupSection>();
  /** Units are fixed once spaces exist (the service refuses the change). */
  /** The project already holds lengths and areas, which a change of units converts. */
  readonly convertsData = input(false);

  protected readonly methodLabels = methodLabels;
  protected readonly errorMessage = errorMessage;

  protected readonly editions = toSignal(this.api.editions().pipe(catchError(() => of([]))), { initialValue: [] });

  private readonly edition = toSignal(
    toObservable(this.form).pipe(switchMap((form) => form.controls.code.controls.edition.valueChanges.pipe(startWith(form.controls.code.controls.edition.value)))),
    { initialValue: '' },
  );

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

  private readonly timeZoneQuery = toSignal(
    toObservable(this.form).pipe(switchMap((form) => form.controls.site.controls.timeZone.valueChanges.pipe(startWith(form.controls.site.controls.timeZone.value)))),
    { initialValue: '' },
  );

  protected readonly timeZones = computed(() => {
    const query = this.timeZoneQuery().trim().toLocaleLowerCase().replace(/\s+/g, '_');
    const matches = query === '' ? allTimeZones : allTimeZones.filter((zone) => zone.toLocaleLowerCase().includes(query));
    return matches.slice(0, 50);
  });

  protected zoneNumber(zone: LightingZoneView): number {
    return Number(zone.zone);
  }
}
