import { Directive, effect, ElementRef, inject, input } from '@angular/core';
import { axisBottom, axisLeft } from 'd3-axis';
import type { ScaleLinear } from 'd3-scale';
import { select } from 'd3-selection';
import { formatFigure } from './guides';

/**
 * A tick axis drawn by d3-axis into an svg `<g>` (bottom: real part, left: imaginary part). d3 owns the
 * nodes inside this group only; they are styled by the plot's stylesheet (Shadow DOM reaches them).
 */
@Directive({ selector: 'g[pwlAxis]' })
export class PlotAxis {
  /** Which edge the axis sits on. */
  readonly orient = input.required<'bottom' | 'left'>({ alias: 'pwlAxis' });
  readonly scale = input.required<ScaleLinear<number, number>>();
  /** Roughly how many ticks. */
  readonly ticks = input(6);

  private readonly group = inject<ElementRef<SVGGElement>>(ElementRef).nativeElement;

  constructor() {
    effect(() => {
      const scale = this.scale();
      const make = this.orient() === 'bottom' ? axisBottom : axisLeft;
      const axis = make(scale)
        .ticks(this.ticks())
        .tickSizeOuter(0)
        .tickSize(4)
        .tickFormat((v) => formatFigure(Number(v)));
      select(this.group).call(axis).attr('font-family', null).attr('font-size', null);
    });
  }
}
