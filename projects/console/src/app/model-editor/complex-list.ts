import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { type FormArray, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { FieldMessagePipe } from '../forms/field-message';
import { conjugateOf, unpairedRows } from './conjugates';
import { complexRow, type ComplexRow } from './editor-form';
import { complexText } from './plant-body';

/**
 * An editable list of poles or zeros as complex numbers (real and imaginary part). A complex value of a
 * real plant needs its conjugate: a row without one says so and offers to add it.
 */
@Component({
  selector: 'pwc-complex-list',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, FieldMessagePipe],
  template: `
    <fieldset [attr.aria-describedby]="listId + '-error'">
      <legend>{{ title() }}</legend>
      @for (row of array().controls; track row; let i = $index) {
        <div class="row" [formGroup]="row">
          <span class="index" aria-hidden="true">{{ i + 1 }}</span>
          <mat-form-field class="part" subscriptSizing="dynamic">
            <mat-label>Real part</mat-label>
            <input matInput type="number" step="any" formControlName="re" [attr.aria-label]="noun() + ' ' + (i + 1) + ', real part'" />
            <mat-error>{{ row.controls.re | fieldMessage }}</mat-error>
          </mat-form-field>
          <mat-form-field class="part" subscriptSizing="dynamic">
            <mat-label>Imaginary part</mat-label>
            <input matInput type="number" step="any" formControlName="im" [attr.aria-label]="noun() + ' ' + (i + 1) + ', imaginary part'" />
            <span matTextSuffix>j</span>
          </mat-form-field>
          <button mat-icon-button type="button" (click)="remove(i)" [attr.aria-label]="'Remove ' + noun().toLowerCase() + ' ' + (i + 1)">
            <mat-icon>delete</mat-icon>
          </button>
          @if (row.errors) {
            <p class="problem row-problem" role="alert">{{ row | fieldMessage }}</p>
          }
          @if (unpaired().includes(i)) {
            <p class="pair-offer">
              {{ valueText(i) }} needs its conjugate {{ conjugateText(i) }} (complex {{ noun().toLowerCase() }}s of a real plant come in pairs).
              <button mat-stroked-button type="button" (click)="addConjugate(i)">Add {{ conjugateText(i) }}</button>
            </p>
          }
        </div>
      } @empty {
        <p class="none">{{ emptyText() }}</p>
      }
      <button mat-button type="button" class="add" (click)="add()"><mat-icon>add</mat-icon> Add a {{ noun().toLowerCase() }}</button>
      <p class="problem" [id]="listId + '-error'" role="alert">{{ array().errors ? (array() | fieldMessage) : '' }}</p>
    </fieldset>
  `,
  styleUrl: './complex-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ComplexList {
  private static next = 1;
  /** The rows (poles or zeros) of the form. */
  readonly array = input.required<FormArray<ComplexRow>>();
  /** "Pole" or "Zero". */
  readonly noun = input.required<string>();
  /** Heading of the list. */
  readonly title = input.required<string>();
  /** What an empty list means. */
  readonly emptyText = input('None.');
  /** Changes whenever the form changes (this OnPush view then re-reads the controls). */
  readonly tick = input(0);

  protected readonly listId = `pwc-complex-list-${ComplexList.next++}`;
  protected readonly unpaired = computed(() => {
    this.tick();
    return unpairedRows(this.array().getRawValue());
  });

  /** Adds an empty row. */
  protected add(): void {
    this.array().push(complexRow());
    this.array().markAsDirty();
  }

  /** Removes a row. */
  protected remove(index: number): void {
    this.array().removeAt(index);
    this.array().markAsDirty();
  }

  /** Adds the conjugate of a row's value right after it. */
  protected addConjugate(index: number): void {
    this.array().insert(index + 1, complexRow(conjugateOf(this.array().at(index).getRawValue())));
    this.array().markAsDirty();
  }

  protected valueText(index: number): string {
    return complexText(this.array().at(index).getRawValue());
  }

  protected conjugateText(index: number): string {
    return complexText(conjugateOf(this.array().at(index).getRawValue()));
  }
}
