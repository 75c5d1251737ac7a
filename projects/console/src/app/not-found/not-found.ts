import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { PageHeader } from '../layout/page-header';

/** A console address that names no screen. */
@Component({
  selector: 'pwc-not-found',
  imports: [PageHeader, MatButtonModule, RouterLink],
  template: `
    <pwc-page-header heading="Nothing here" subtitle="This address names no screen of the console. It may be mistyped, or the link may be old." />
    <a mat-flat-button routerLink="/models">Go to the models</a>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFound {}
