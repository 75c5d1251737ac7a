import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, type MatDialogConfig, MatDialogModule } from '@angular/material/dialog';
import { firstValueFrom } from 'rxjs';

/** What a confirmation asks: a title naming the thing, what will happen, and the button that does it. */
export interface ConfirmRequest {
  readonly title: string;
  /** Paragraphs of consequences ("They are signed out at once."). */
  readonly lines: readonly string[];
  /** The confirming button's text ("Revoke key"): a verb, never "OK". */
  readonly confirm: string;
  /** The staying button's text ("Stay and keep editing"); "Cancel" when absent. */
  readonly cancel?: string;
  /** Whether the action destroys or locks out something (the button is drawn in the error colour). */
  readonly destructive?: boolean;
}

/**
 * The console's one confirmation dialog: asks before a consequential change or before dropping work; closes
 * with `true` when confirmed. The staying answer has the focus, so Enter never destroys or discards by accident.
 */
@Component({
  selector: 'pwc-confirm-action-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <mat-dialog-content>
      @for (line of data.lines; track $index) {
        <p>{{ line }}</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false" cdkFocusInitial>{{ data.cancel ?? 'Cancel' }}</button>
      <button mat-flat-button type="button" [class.destructive]="data.destructive" [mat-dialog-close]="true">{{ data.confirm }}</button>
    </mat-dialog-actions>
  `,
  styles: `
    p {
      margin: 0 0 10px;
      max-width: 60ch;
    }
    .destructive {
      --mat-button-filled-container-color: var(--mat-sys-error);
      --mat-button-filled-label-text-color: var(--mat-sys-on-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConfirmActionDialog {
  protected readonly data = inject<ConfirmRequest>(MAT_DIALOG_DATA);
}

/** Opens a confirmation and resolves whether the person confirmed (false on Cancel, Escape or a click outside). */
export async function confirmAction(dialog: MatDialog, request: ConfirmRequest, config: MatDialogConfig = {}): Promise<boolean> {
  const ref = dialog.open<ConfirmActionDialog, ConfirmRequest, boolean>(ConfirmActionDialog, { width: '480px', ...config, data: request, role: 'alertdialog' });
  return (await firstValueFrom(ref.afterClosed())) === true;
}
