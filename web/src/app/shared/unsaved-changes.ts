import type { CanDeactivateFn } from '@angular/router';

/** A page with edits not yet saved says so; the guard asks before leaving it. */
export interface HasUnsavedChanges {
  hasUnsavedChanges(): boolean;
}

export const unsavedChangesGuard: CanDeactivateFn<HasUnsavedChanges> = (page) =>
  !page?.hasUnsavedChanges?.() || window.confirm('You have changes that are not saved. Leave this page and lose them?');
