import { ClipboardModule } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatTooltipModule } from '@angular/material/tooltip';
import { keyExample } from './curl-example';
import type { ApiKey } from './keys-api';

/** What the copy-once dialog shows: the key's record, its secret, and the origin scripts call. */
export interface KeySecret {
  readonly key: ApiKey;
  readonly secret: string;
  /** This server's origin (`location.origin` of the console), for the example call. */
  readonly origin: string;
}

/**
 * Shows a new key's secret exactly once, with a copy button and a ready-to-run example call. It cannot be
 * dismissed by a click outside or Escape: only "I have stored it" closes it, and the secret goes with it.
 */
@Component({
  selector: 'pwc-key-secret-dialog',
  imports: [MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatIconModule, MatTooltipModule, ClipboardModule],
  templateUrl: './key-secret-dialog.html',
  styleUrl: './key-secret-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KeySecretDialog {
  private readonly ref = inject<MatDialogRef<KeySecretDialog, void>>(MatDialogRef);
  protected readonly data = inject<KeySecret>(MAT_DIALOG_DATA);
  protected readonly example = keyExample(this.data.origin, this.data.secret, this.data.key.scopes);
  /** What was copied last ("key", "command"), to confirm it next to the button; null before any copy. */
  protected readonly copied = signal<'key' | 'command' | 'failed' | null>(null);

  constructor() {
    // whoever opens it: the secret must not vanish by a stray click or key press
    this.ref.disableClose = true;
  }

  /** Notes the result of a copy for the confirmation line. */
  protected noteCopy(what: 'key' | 'command', done: boolean): void {
    this.copied.set(done ? what : 'failed');
  }

  /** Closes the dialog; the secret is not kept anywhere in the console. */
  stored(): void {
    this.ref.close();
  }
}
