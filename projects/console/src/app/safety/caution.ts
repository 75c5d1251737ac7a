import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { CAUTION } from '@polewright/locus-core';


/** A visible safety note beside suggested gains and stability verdicts. */
@Component({
  selector: 'pwc-caution',
  imports: [MatIconModule],
  template: `<mat-icon aria-hidden="true">warning_amber</mat-icon><p><strong>Caution.</strong> {{ text }}</p>`,
  host: { role: 'note', '[class.compact]': 'compact()' },
  styles: `
    :host {
      display: flex;
      gap: 10px;
      align-items: flex-start;
      padding: 10px 14px;
      border-radius: 10px;
      background: #fff4dc;
      color: #5a3b00;
      border: 1px solid #f1d08b;
      font: var(--mat-sys-body-medium);
    }
    :host(.compact) {
      font: var(--mat-sys-body-small);
      padding: 6px 10px;
    }
    mat-icon {
      flex: none;
      color: #a86b00;
    }
    p {
      margin: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Caution {
  /** Smaller type, for side panels. */
  readonly compact = input(false);
  /** The engine's own words, as the elements and the API give them. */
  protected readonly text = CAUTION;
}
