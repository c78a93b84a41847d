import { inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import type { CanDeactivateFn } from '@angular/router';
import { of } from 'rxjs';
import { askToDiscard } from './confirm-dialog';

/** A page with edits not yet saved says so; the guard asks before leaving it. */
export interface HasUnsavedChanges {
  hasUnsavedChanges(): boolean;
}

export const unsavedChangesGuard: CanDeactivateFn<HasUnsavedChanges> = (page) =>
  !page?.hasUnsavedChanges?.()
    ? of(true)
    : askToDiscard(inject(MatDialog), 'You have changes on this page that are not saved. Leave it and lose them?');
