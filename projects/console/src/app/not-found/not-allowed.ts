import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { PageHeader } from '../layout/page-header';
import { Session } from '../session/session';

/** A screen the signed-in person's role does not allow. */
@Component({
  selector: 'pwc-not-allowed',
  imports: [PageHeader, MatButtonModule, RouterLink],
  template: `
    <pwc-page-header heading="Not for your role" [subtitle]="message()" />
    <a mat-flat-button routerLink="/models">Go to the models</a>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotAllowed {
  private readonly session = inject(Session);
  /** The permission the screen needs (query parameter). */
  readonly need = input<string>();

  protected message(): string {
    const role = this.session.role() ?? 'signed-out';
    const need = this.need();
    return need
      ? `That screen needs the "${need}" permission, which the ${role} role does not have. An administrator can change your role under People.`
      : `Your role (${role}) does not allow that screen.`;
  }
}
