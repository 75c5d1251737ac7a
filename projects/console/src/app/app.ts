import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatIconRegistry } from '@angular/material/icon';
import { RouterOutlet } from '@angular/router';

/** The root: the router decides between the sign-in pages and the signed-in shell. */
@Component({
  selector: 'pwc-root',
  imports: [RouterOutlet],
  template: '<router-outlet />',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {
  constructor() {
    // icons come from the `material-icons` npm package's font (no CDN)
    inject(MatIconRegistry).setDefaultFontSetClass('material-icons');
  }
}
