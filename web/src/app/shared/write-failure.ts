import { inject, Injectable, type WritableSignal } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import type { AbstractControl } from '@angular/forms';
import type { Observable, Subscription } from 'rxjs';
import { ApiError, type ApiErrorDetail } from '../core/http/api-error';
import { problemLine, problemText } from './problem-words';

/** What an editor does around one write; `WriteFailure.save` runs them in their order. */
export interface SaveSteps<T> {
  /** On while the request is out, off before anything else happens. */
  saving?: WritableSignal<boolean>;
  /** Marked pristine once the write is stored, before `saved`. */
  form?: AbstractControl;
  /** The stored record: into the project's store, the editor closed or started again. */
  saved: (record: T) => void;
  /** A 400, to put beside the editor's fields. Without it a 400 is answered like any refusal. */
  invalid?: (error: ApiError) => void;
  /** A refusal the editor answers in its own words (a duplicate tag, the spaces a write found changed); true when it did. */
  refused?: (error: ApiError) => boolean;
  /** Reads fresh copies when the person takes a stale write's Reload. */
  reload: () => void;
}

/**
 * How the workspace answers a failed write. A stale write (409 `conflict`) says who changed the
 * record and offers to reload it (the caller's reload keeps nothing stale on screen); other errors,
 * other refusals included (an archived project, a type still counted), show the service's message.
 */
@Injectable({ providedIn: 'root' })
export class WriteFailure {
  private readonly snackBar = inject(MatSnackBar);

  /**
   * One write from an editor: `saving` on, the request, then either the stored record (the form
   * pristine, `saved`) or the failure answered: the editor's own words for a refusal it knows,
   * a 400 beside its fields, else `report` (a stale write offers `reload`).
   */
  save<T>(request: Observable<T>, steps: SaveSteps<T>): Subscription {
    steps.saving?.set(true);
    return request.subscribe({
      next: (record) => {
        steps.saving?.set(false);
        steps.form?.markAsPristine();
        steps.saved(record);
      },
      error: (error: unknown) => {
        steps.saving?.set(false);
        if (error instanceof ApiError && steps.refused?.(error)) return;
        if (error instanceof ApiError && error.status === 400 && steps.invalid) {
          steps.invalid(error);
          return;
        }
        this.report(error, steps.reload);
      },
    });
  }

  report(error: unknown, reload: () => void): void {
    if (error instanceof ApiError && error.status === 409 && error.code === 'conflict') {
      this.snackBar
        .open(error.message, 'Reload', { duration: 20_000, politeness: 'assertive' })
        .onAction()
        .subscribe(() => reload());
      return;
    }
    this.snackBar.open(failureWords(error), 'Dismiss', { duration: 8000, politeness: 'assertive' });
  }
}

/** A refused write in words: the service's message and, for a 400, what to fix (field labels, never paths). */
export function failureWords(error: unknown): string {
  if (!(error instanceof ApiError)) return 'The change could not be saved.';
  if (error.status !== 400 || error.details.length === 0) return error.message;
  const shown = error.details.slice(0, 3).map((detail) => problemText(problemLine(detail)));
  const more = error.details.length > shown.length ? ` And ${error.details.length - shown.length} more.` : '';
  return `${error.message} ${shown.join(' ')}${more}`;
}

/** Maps a 400's detail paths onto form fields: `{ area: 'Must be greater than zero.' }`. */
export function fieldErrors(error: unknown, prefix = ''): Record<string, string> {
  if (!(error instanceof ApiError) || error.status !== 400) return {};
  const errors: Record<string, string> = {};
  for (const detail of error.details) {
    const path = prefix && detail.path.startsWith(prefix) ? detail.path.slice(prefix.length) : detail.path;
    errors[path] ??= detail.message;
  }
  return errors;
}

/**
 * Puts each 400 detail beside its field (as a `server` error the field's message shows) and
 * returns the messages no field of the form takes. `controlFor` maps a service path to a control.
 */
export function placeServerErrors(
  details: readonly ApiErrorDetail[],
  controlFor: (path: string) => AbstractControl | null,
): ApiErrorDetail[] {
  const unplaced: ApiErrorDetail[] = [];
  const placed = new Set<string>();
  for (const detail of details) {
    const control = controlFor(detail.path);
    if (control && placed.has(detail.path)) continue; // the first message for a field is the one to fix first
    if (control) {
      placed.add(detail.path);
      control.setErrors({ server: detail.message });
      control.markAsTouched();
    } else {
      unplaced.push(detail);
    }
  }
  return unplaced;
}
