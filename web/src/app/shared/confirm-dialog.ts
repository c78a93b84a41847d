import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule } from '@angular/material/dialog';
import { map, type Observable } from 'rxjs';

export interface ConfirmDialogData {
  title: string;
  message: string;
  /** The confirming button's words: say what it does ("Archive"), never just "OK". */
  confirm: string;
  /** The other button's words; "Cancel" unless said. */
  cancel?: string;
}

/** Opens the question; answers true only when the person confirms (Esc and a click outside answer false). */
export function askToConfirm(dialogs: MatDialog, data: ConfirmDialogData): Observable<boolean> {
  return dialogs
    .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data, width: '480px', maxWidth: '96vw', role: 'alertdialog' })
    .afterClosed()
    .pipe(map((answer) => answer === true));
}

/** The question before throwing away edits not yet saved. */
export function askToDiscard(dialogs: MatDialog, message: string): Observable<boolean> {
  return askToConfirm(dialogs, { title: 'Discard your changes?', message, confirm: 'Discard changes', cancel: 'Keep editing' });
}

/** Asks before an action; closes with true when the person confirms. */
@Component({
  selector: 'al-confirm-dialog',
  imports: [MatButtonModule, MatDialogModule],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <mat-dialog-content>
      <p>{{ data.message }}</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">{{ data.cancel ?? 'Cancel' }}</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true" cdkFocusInitial>{{ data.confirm }}</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConfirmDialog {
  protected readonly data = inject<ConfirmDialogData>(MAT_DIALOG_DATA);
}
