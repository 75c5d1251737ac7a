import { ChangeDetectionStrategy, Component } from '@angular/core';

// PLACEHOLDER (skeleton only): replaced by the real screen before anything lands.
@Component({ selector: 'pwc-placeholder-Invitation', template: '<p>Invitation</p>', changeDetection: ChangeDetectionStrategy.OnPush })
export class Invitation {}
