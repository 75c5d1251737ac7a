import { COMMA, ENTER } from '@angular/cdk/keycodes';
import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { type FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule, type MatAutocompleteSelectedEvent } from '@angular/material/autocomplete';
import { type MatChipInputEvent, MatChipsModule } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { FieldMessagePipe } from '../forms/field-message';
import { LIMITS, TAG_PATTERN } from './editor-form';

/**
 * What a typed tag becomes: trimmed, lowercased, spaces and underscores turned into hyphens (the API
 * lowercases too), or the reason it cannot be a tag.
 * Example: tagOf(' Dead time ') = { tag: 'dead-time', message: null }.
 */
export function tagOf(text: string): { tag: string; message: null } | { tag: null; message: string } {
  const tag = text.trim().toLowerCase().replace(/[\s_]+/g, '-');
  if (tag === '') return { tag: null, message: 'Type a tag first.' };
  if (tag.length > LIMITS.tagLength) return { tag: null, message: `"${tag}" has ${tag.length} characters; a tag has at most ${LIMITS.tagLength}.` };
  if (!TAG_PATTERN.test(tag)) return { tag: null, message: `"${tag}" is not a tag: use lowercase words of a–z and 0–9 joined by single hyphens, e.g. dead-time.` };
  return { tag, message: null };
}

/** The tag list of a model: chips, typed with Enter or comma, existing tags offered as you type. */
@Component({
  selector: 'pwc-tag-field',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatChipsModule, MatIconModule, MatAutocompleteModule, FieldMessagePipe],
  template: `
    <mat-form-field class="field">
      <mat-label>Tags</mat-label>
      <mat-chip-grid #grid [formControl]="control()" aria-label="Tags">
        @for (tag of control().value; track tag) {
          <mat-chip-row [value]="tag" (removed)="remove(tag)">
            {{ tag }}
            <button matChipRemove [attr.aria-label]="'Remove tag ' + tag"><mat-icon>cancel</mat-icon></button>
          </mat-chip-row>
        }
        <input
          #entry
          placeholder="Add a tag"
          [matChipInputFor]="grid"
          [matChipInputSeparatorKeyCodes]="separators"
          [matAutocomplete]="auto"
          (matChipInputTokenEnd)="add($event)"
          (input)="typed(entry.value)"
        />
      </mat-chip-grid>
      <mat-autocomplete #auto="matAutocomplete" (optionSelected)="pick($event, entry)">
        @for (suggestion of matching(); track suggestion) {
          <mat-option [value]="suggestion">{{ suggestion }}</mat-option>
        }
      </mat-autocomplete>
      <mat-hint>Lowercase words joined by hyphens (a–z, 0–9), e.g. dead-time. Enter or comma adds a tag.</mat-hint>
      <mat-error>{{ control() | fieldMessage }}</mat-error>
    </mat-form-field>
  `,
  styles: `
    .field {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TagField {
  /** The tag list control of the form. */
  readonly control = input.required<FormControl<string[]>>();
  /** Tags already in use elsewhere, offered as you type. */
  readonly suggestions = input<readonly string[]>([]);
  /** Changes whenever the form changes, so that this OnPush view shows the control's current errors. */
  readonly tick = input(0);

  protected readonly separators = [ENTER, COMMA] as const;
  protected readonly draft = signal('');
  protected readonly matching = computed(() => {
    this.tick();
    const typed = this.draft().trim().toLowerCase();
    const taken = new Set(this.control().value);
    return this.suggestions()
      .filter((s) => !taken.has(s) && (typed === '' || s.includes(typed)))
      .slice(0, 8);
  });

  /** Adds the typed tag (normalised); a text that cannot be a tag stays in the input with the reason at the field. */
  protected add(event: MatChipInputEvent): void {
    const text = event.value;
    if (text.trim() === '') return;
    const read = tagOf(text);
    if (read.tag === null) {
      this.control().setErrors({ ...(this.control().errors ?? {}), draft: { message: read.message } });
      this.control().markAsTouched();
      return;
    }
    this.append(read.tag);
    event.chipInput.clear();
    this.draft.set('');
  }

  /** Follows the text being typed (for the suggestions) and drops the complaint about the previous attempt. */
  protected typed(text: string): void {
    this.draft.set(text);
    const errors = this.control().errors;
    if (errors && 'draft' in errors) {
      const { draft: _dropped, ...rest } = errors;
      this.control().setErrors(Object.keys(rest).length > 0 ? rest : null);
    }
  }

  /** Adds a suggested tag picked from the list. */
  protected pick(event: MatAutocompleteSelectedEvent, entry: HTMLInputElement): void {
    this.append(String(event.option.value));
    entry.value = '';
    this.draft.set('');
  }

  /** Removes a tag. */
  protected remove(tag: string): void {
    const control = this.control();
    control.setValue(control.value.filter((t) => t !== tag));
    control.markAsDirty();
  }

  private append(tag: string): void {
    const control = this.control();
    if (!control.value.includes(tag)) control.setValue([...control.value, tag]);
    else control.updateValueAndValidity();
    control.markAsDirty();
  }
}
