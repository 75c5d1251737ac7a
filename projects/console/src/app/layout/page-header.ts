import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/**
 * The heading of a screen: title, an optional line under it, and the screen's main actions on the right
 * (projected). Every screen starts with one, so titles and actions sit in the same place everywhere.
 */
@Component({
  selector: 'pwc-page-header',
  template: `
    <header>
      <div class="titles">
        <h1>{{ heading() }}</h1>
        @if (subtitle()) {
          <p>{{ subtitle() }}</p>
        }
        <ng-content select="[pwcHeaderDetail]" />
      </div>
      <div class="actions"><ng-content /></div>
    </header>
  `,
  styles: `
    header {
      display: flex;
      flex-wrap: wrap;
      align-items: flex-end;
      justify-content: space-between;
      gap: 12px 24px;
      margin-bottom: 20px;
    }
    h1 {
      margin: 0;
      font: var(--mat-sys-headline-small);
    }
    p {
      margin: 4px 0 0;
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-medium);
      max-width: 80ch;
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PageHeader {
  /** The screen's title. */
  readonly heading = input.required<string>();
  /** One line under the title. */
  readonly subtitle = input<string>();
}
