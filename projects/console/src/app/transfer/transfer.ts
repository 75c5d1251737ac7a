import { ChangeDetectionStrategy, Component } from '@angular/core';

// PLACEHOLDER (skeleton only): replaced by the real screen before anything lands.
@Component({ selector: 'pwc-placeholder-Transfer', template: '<p>Transfer</p>', changeDetection: ChangeDetectionStrategy.OnPush })
export class Transfer {}
