import { ChangeDetectionStrategy, Component, computed, inject, input, viewChild } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonToggleGroup, MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { Warning } from '@polewright/locus-core';
import { FieldMessagePipe } from '../forms/field-message';
import { parseCoefficients, polynomialText } from './coefficients';
import { ComplexList } from './complex-list';
import { confirmAction } from '../confirm/confirm-action-dialog';
import { fillPlant, type PlantGroup } from './editor-form';
import { convertPlant, isBlank } from './plant-conversion';
import { hasDeadTime, type PlantFields, type PlantFormKind, usesPade } from './plant-body';

/** Example plants shown in the hints: invented numbers, not taken from any reference. */
export const EXAMPLES = {
  s: '2.4*(s+3)/(s*(s+1.2)*(s^2+2.6*s+17))',
  z: '0.08*(z+0.7)/((z-1)*(z-0.62))',
} as const;

const FORM_NAMES: Record<PlantFormKind, string> = { expression: 'expression', coefficients: 'coefficients', factored: 'poles, zeros and gain' };

/**
 * The plant part of the model editor: the form switch (expression, coefficients, poles/zeros/gain, converted
 * into each other through the core), the fields of the chosen form, and the time base (domain, sampling
 * period, dead time with its Padé order, zero-order hold).
 */
@Component({
  selector: 'pwc-plant-section',
  imports: [ReactiveFormsModule, MatButtonToggleModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, FieldMessagePipe, ComplexList],
  templateUrl: './plant-section.html',
  styleUrl: './plant-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlantSection {
  private readonly dialog = inject(MatDialog);
  /** The plant group of the editor's form. */
  readonly group = input.required<PlantGroup>();
  /** Changes whenever the form changes (this OnPush view then re-reads the controls). */
  readonly tick = input(0);
  /** The engine's notes on the plant as typed (dead-time approximation, cancellations). */
  readonly warnings = input<readonly Warning[]>([]);

  private readonly switcher = viewChild<MatButtonToggleGroup>('switcher');
  protected readonly padeOrders = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
  /** The plant's fields as typed, re-read on every change. */
  protected readonly fields = computed(() => {
    this.tick();
    return this.group().getRawValue() as PlantFields;
  });
  protected readonly variable = computed(() => this.fields().domain);
  protected readonly example = computed(() => EXAMPLES[this.variable()]);
  protected readonly hasDeadTime = computed(() => hasDeadTime(this.fields()));
  protected readonly usesPade = computed(() => usesPade(this.fields()));
  protected readonly holds = computed(() => this.fields().domain === 's' && this.fields().discretize.enabled);
  protected readonly numeratorReads = computed(() => this.reads(this.fields().numerator));
  protected readonly denominatorReads = computed(() => this.reads(this.fields().denominator));

  /**
   * Switches the plant form. The current plant is converted when it can be read; otherwise the person is
   * asked before its content is dropped (the toggle goes back when they stay).
   */
  async switchForm(to: PlantFormKind): Promise<void> {
    const group = this.group();
    const fields = group.getRawValue() as PlantFields;
    if (fields.form === to) return;
    if (isBlank(fields)) {
      fillPlant(group, { ...fields, form: to });
      return;
    }
    const conversion = convertPlant(fields, to);
    if (conversion.fields) {
      fillPlant(group, conversion.fields);
      group.markAsDirty();
      return;
    }
    const leave = await confirmAction(this.dialog, {
      title: `Switch to ${FORM_NAMES[to]} without converting?`,
      lines: [`The ${FORM_NAMES[fields.form]} cannot be converted: ${conversion.message}. The fields for ${FORM_NAMES[to]} keep what they held before. What you typed as ${FORM_NAMES[fields.form]} stays here while you edit, but only the form you save with is kept.`],
      confirm: `Switch without converting`,
      cancel: `Stay with the ${FORM_NAMES[fields.form]}`,
    });
    if (leave) {
      fillPlant(group, { ...fields, form: to });
      group.markAsDirty();
    } else {
      const switcher = this.switcher();
      if (switcher) switcher.value = fields.form;
    }
  }

  private reads(text: string): string | null {
    const values = parseCoefficients(text).values;
    return values === null ? null : polynomialText(values, this.variable());
  }
}
