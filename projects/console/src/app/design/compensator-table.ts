import { ChangeDetectionStrategy, Component, computed, effect, input, output, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { type AbstractControl, FormArray, FormControl, FormGroup, ReactiveFormsModule, type ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { FieldMessagePipe } from '../forms/field-message';
import { showProblemOnForm } from '../forms/form-problems';
import type { FieldProblem } from '../problem/api-problem';
import { type LoopCompensator, rootsOf, rootText, rowOfRoot, rowsOf, sameCompensator, type RootRow } from './compensator-rows';

/** The controls of one table row: a real root, or a conjugate pair re ± j·im. */
export type RootGroup = FormGroup<{ re: FormControl<number | null>; im: FormControl<number | null> }>;

/** One line of the table: which list it belongs to, its place there and its controls. */
interface TableLine {
  readonly kind: 'zero' | 'pole';
  readonly index: number;
  readonly group: RootGroup;
}

function finite(control: AbstractControl): ValidationErrors | null {
  const value = control.value as number | null;
  return value === null || Number.isFinite(value) ? null : { finite: { message: 'A finite number.' } };
}

function nonZero(control: AbstractControl): ValidationErrors | null {
  return control.value === 0 ? { zero: { message: 'Not 0: a zero gain opens the loop.' } } : null;
}

function rootGroup(row: RootRow | null): RootGroup {
  return new FormGroup({
    re: new FormControl<number | null>(row?.re ?? null, [Validators.required, finite]),
    im: new FormControl<number | null>(row?.im ?? 0, [Validators.required, finite, Validators.min(0)]),
  });
}

/**
 * The compensator as a table for precise entry: zeros and poles (a conjugate pair on one line, re ± j·im)
 * and the compensator's gain, in the loop's domain. Every valid change goes out as `compensatorChange`; the
 * host decides whether the loop can take it and says why not through `problem`. A new `compensator` (the
 * plot edited it, the host reverted) replaces the lines unless it is what the table already holds.
 */
@Component({
  selector: 'pwc-compensator-table',
  imports: [ReactiveFormsModule, MatTableModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, MatTooltipModule, FieldMessagePipe],
  templateUrl: './compensator-table.html',
  styleUrl: './compensator-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CompensatorTable {
  /** The compensator of the loop on screen (null: none). */
  readonly compensator = input<LoopCompensator | null>(null);
  /** Changes whenever the host wants the table rebuilt from `compensator` (load, revert), even if equal. */
  readonly version = input(0);
  /** `s` or `z`: the plane the values are in. */
  readonly domain = input<'s' | 'z'>('s');
  /** Shown, not editable (people without `models:write`). */
  readonly readonly = input(false);
  /** Why the host could not apply the table's compensator (e.g. an improper loop), else null. */
  readonly problem = input<string | null>(null);
  /** The compensator the table now describes (valid entries only). */
  readonly compensatorChange = output<LoopCompensator | null>();
  /** Whether every entry is valid (an invalid one is not applied, so the loop still shows the last valid). */
  readonly validity = output<boolean>();

  protected readonly form = new FormGroup({
    zeros: new FormArray<RootGroup>([]),
    poles: new FormArray<RootGroup>([]),
    gain: new FormControl<number | null>(1, [Validators.required, finite, nonZero]),
  });
  protected readonly columns = ['kind', 're', 'im', 'value', 'remove'];
  private readonly structure = signal(0);
  protected readonly lines = computed<TableLine[]>(() => {
    this.structure();
    const lines = (kind: 'zero' | 'pole', list: FormArray<RootGroup>): TableLine[] => list.controls.map((group, index) => ({ kind, index, group }));
    return [...lines('zero', this.form.controls.zeros), ...lines('pole', this.form.controls.poles)];
  });
  protected readonly planeText = computed(() => (this.domain() === 'z' ? 'z-plane values (inside the unit circle |z| < 1 is stable)' : 's-plane values in rad/s (left half-plane Re s < 0 is stable)'));
  protected readonly rootText = rootText;

  constructor() {
    let builtVersion = Number.NaN;
    effect(() => {
      const compensator = this.compensator();
      const version = this.version();
      untracked(() => {
        if (version !== builtVersion || !sameCompensator(compensator, this.current())) this.rebuild(compensator);
        builtVersion = version;
      });
    });
    effect(() => {
      const readonly = this.readonly();
      untracked(() => (readonly ? this.form.disable({ emitEvent: false }) : this.form.enable({ emitEvent: false })));
    });
    this.form.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => {
      if (this.form.valid) this.compensatorChange.emit(this.current());
    });
    this.form.statusChanges.pipe(takeUntilDestroyed()).subscribe(() => this.validity.emit(this.form.valid || this.form.disabled));
  }

  /** Adds an empty zero or pole line (its real part to be typed). */
  add(kind: 'zero' | 'pole'): void {
    const list = kind === 'zero' ? this.form.controls.zeros : this.form.controls.poles;
    list.push(rootGroup(null), { emitEvent: false });
    this.structure.update((n) => n + 1);
    this.form.updateValueAndValidity();
  }

  /** Removes a line (a pair goes as a whole). */
  remove(line: TableLine): void {
    (line.kind === 'zero' ? this.form.controls.zeros : this.form.controls.poles).removeAt(line.index, { emitEvent: false });
    this.structure.update((n) => n + 1);
    this.form.updateValueAndValidity();
  }

  /**
   * Puts the API's compensator errors on their lines (`/compensator/zeros/3` → the line of that root,
   * `/compensator/gain` → the gain field) and returns those no field takes.
   */
  showErrors(errors: readonly FieldProblem[]): FieldProblem[] {
    const current = this.current();
    return showProblemOnForm(this.form, { errors }, (pointer): AbstractControl | null => {
      const match = /^\/compensator\/(zeros|poles|gain)(?:\/(\d+))?/.exec(pointer);
      if (match?.[1] === 'gain') return this.form.controls.gain;
      if (!match || match[2] === undefined || !current) return null;
      const row = rowOfRoot(match[1] === 'zeros' ? current.zeros : current.poles, Number(match[2]));
      return (match[1] === 'zeros' ? this.form.controls.zeros : this.form.controls.poles).at(row)?.controls.re ?? null;
    });
  }

  protected rowText(line: TableLine): string {
    const { re, im } = line.group.getRawValue();
    return re === null || im === null ? '' : rootText({ re, im });
  }

  protected label(line: TableLine, part: string): string {
    return `${line.kind === 'zero' ? 'Zero' : 'Pole'} ${line.index + 1} ${part}`;
  }

  // what the table describes now (null when it lists nothing and the gain is 1)
  private current(): LoopCompensator | null {
    const value = this.form.getRawValue();
    const rows = (list: { re: number | null; im: number | null }[]): RootRow[] => list.map((r) => ({ re: r.re ?? Number.NaN, im: r.im ?? 0 }));
    const compensator = { zeros: rootsOf(rows(value.zeros)), poles: rootsOf(rows(value.poles)), gain: value.gain ?? 1 };
    return compensator.zeros.length === 0 && compensator.poles.length === 0 && compensator.gain === 1 ? null : compensator;
  }

  private rebuild(compensator: LoopCompensator | null): void {
    const { zeros, poles, gain } = this.form.controls;
    zeros.clear({ emitEvent: false });
    poles.clear({ emitEvent: false });
    for (const row of rowsOf(compensator?.zeros ?? [])) zeros.push(rootGroup(row), { emitEvent: false });
    for (const row of rowsOf(compensator?.poles ?? [])) poles.push(rootGroup(row), { emitEvent: false });
    gain.setValue(compensator?.gain ?? 1, { emitEvent: false });
    if (this.readonly()) this.form.disable({ emitEvent: false });
    this.form.updateValueAndValidity({ emitEvent: false });
    this.structure.update((n) => n + 1);
  }
}
