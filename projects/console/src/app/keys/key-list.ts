import { ChangeDetectionStrategy, Component } from '@angular/core';

// PLACEHOLDER (skeleton only): replaced by the real screen before anything lands.
@Component({ selector: 'pwc-placeholder-KeyList', template: '<p>KeyList</p>', changeDetection: ChangeDetectionStrategy.OnPush })
export class KeyList {}
