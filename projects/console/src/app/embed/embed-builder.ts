import { ClipboardModule } from '@angular/cdk/clipboard';
import { COMMA, ENTER, SPACE } from '@angular/cdk/keycodes';
import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, type OnInit, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { type AbstractControl, FormControl, NonNullableFormBuilder, ReactiveFormsModule, type ValidationErrors, Validators } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { type MatChipInputEvent, MatChipsModule } from '@angular/material/chips';
import type { ErrorStateMatcher } from '@angular/material/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatTooltipModule } from '@angular/material/tooltip';
import { catchError, debounceTime, distinctUntilChanged, firstValueFrom, map, of, startWith, switchMap } from 'rxjs';
import type { Model } from '../api/api-types';
import { FieldMessagePipe } from '../forms/field-message';
import { showProblemOnForm } from '../forms/form-problems';
import { PageHeader } from '../layout/page-header';
import { ModelsApi } from '../models/models-api';
import { toProblem } from '../problem/api-problem';
import { Notices } from '../problem/notices';
import { Caution } from '../safety/caution';
import { EmbedPreview, type PreviewGain } from './embed-preview';
import { embedSnippet, EMBED_ELEMENTS, type EmbedElement, loopKeyOf, PLOT_HEIGHT, previewDocument } from './embed-snippet';
import { EmbedTokensApi, type EmbedToken, TOKEN_LIFETIME } from './embed-tokens-api';
import { MAX_ORIGINS, originListValidator, originProblem } from './embed-origin';

/** Lifetimes offered with one click (minutes). */
const LIFETIME_PRESETS: readonly { minutes: number; label: string }[] = [
  { minutes: 5, label: '5 min' },
  { minutes: 60, label: '1 h' },
  { minutes: 480, label: '8 h' },
  { minutes: 1440, label: '24 h' },
];

/** Whether the model field holds a model picked from the list (not just typed text). */
export function modelPicked(control: AbstractControl<Model | string | null>): ValidationErrors | null {
  return typeof control.value === 'object' && control.value !== null ? null : { model: { message: 'Pick a model from the list (type part of its name).' } };
}

/** Whether the lifetime is a whole number of minutes. */
function wholeMinutes(control: AbstractControl<number | null>): ValidationErrors | null {
  const value = control.value;
  return value === null || Number.isInteger(Number(value)) ? null : { whole: { message: 'Whole minutes only.' } };
}

/** Whether "separate elements" has at least one element chosen. */
function partsChosen(group: AbstractControl): ValidationErrors | null {
  const parts = group.get('parts');
  if (!parts) return null;
  const needed = group.get('layout')?.value === 'parts' && (parts.value as EmbedElement[]).length === 0;
  if (needed && !parts.hasError('parts')) parts.setErrors({ parts: { message: 'Choose at least one element.' } });
  if (!needed && parts.hasError('parts')) parts.setErrors(null);
  return null;
}

/** What a minted token was made for, to write the snippet and to notice later changes of the form. */
interface Minted {
  readonly token: EmbedToken;
  readonly model: Model;
}

/**
 * "Embed": pick a model, the elements, theme and height, the page origins allowed to show them and the
 * token's lifetime; mint an embed token (`POST /embed-tokens`) and copy the HTML snippet, which runs
 * unchanged in a live preview of this console's origin.
 */
@Component({
  selector: 'pwc-embed-builder',
  imports: [
    ReactiveFormsModule,
    DatePipe,
    DecimalPipe,
    ClipboardModule,
    MatAutocompleteModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatCardModule,
    MatChipsModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    MatTooltipModule,
    FieldMessagePipe,
    PageHeader,
    Caution,
    EmbedPreview,
  ],
  templateUrl: './embed-builder.html',
  styleUrl: './embed-builder.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EmbedBuilder implements OnInit {
  private readonly models = inject(ModelsApi);
  private readonly tokens = inject(EmbedTokensApi);
  private readonly notices = inject(Notices);
  private readonly fb = inject(NonNullableFormBuilder);
  /** A model to start with (`/embed?modelId=…`, e.g. from a model's page). */
  readonly modelId = input<string>();

  /** This console's origin: the elements and the API are served from here. */
  protected readonly origin = globalThis.location?.origin ?? '';
  protected readonly elementChoices = EMBED_ELEMENTS.filter((e) => e.kind !== 'studio');
  protected readonly studio = EMBED_ELEMENTS[0];
  protected readonly presets = LIFETIME_PRESETS;
  protected readonly heightLimits = PLOT_HEIGHT;
  protected readonly maxOrigins = MAX_ORIGINS;
  protected readonly originSeparators = [ENTER, COMMA, SPACE];

  protected readonly form = this.fb.group(
    {
      model: new FormControl<Model | string | null>(null, modelPicked),
      layout: this.fb.control<'studio' | 'parts'>('studio'),
      parts: this.fb.control<EmbedElement[]>(['locus-plot', 'gain-control']),
      theme: this.fb.control<'light' | 'dark'>('light'),
      plotHeight: [PLOT_HEIGHT.default as number, [Validators.required, Validators.min(PLOT_HEIGHT.min), Validators.max(PLOT_HEIGHT.max)]],
      origins: this.fb.control<string[]>(this.origin ? [this.origin] : [], originListValidator),
      lifetimeMinutes: [60, [Validators.required, Validators.min(TOKEN_LIFETIME.minSeconds / 60), Validators.max(TOKEN_LIFETIME.maxSeconds / 60), wholeMinutes]],
    },
    { validators: partsChosen },
  );
  /** The origin being typed, before it becomes a chip. */
  protected readonly originText = this.fb.control('');
  /** The origin field shows the typed text's problem, or the list's once touched. */
  protected readonly originErrors: ErrorStateMatcher = {
    isErrorState: (control) => this.originText.invalid || Boolean(control?.invalid && (control.touched || this.submitted())),
  };

  /** Models matching what is typed in the model field (first ones by name when empty). */
  protected readonly modelOptions = toSignal(
    this.form.controls.model.valueChanges.pipe(
      startWith(this.form.controls.model.value),
      map((value) => (typeof value === 'string' ? value.trim() : value === null ? '' : null)),
      debounceTime(250),
      distinctUntilChanged(),
      // a picked model (null here) needs no search
      switchMap((q) => (q === null ? of<Model[] | null>(null) : this.search(q))),
    ),
    { initialValue: null },
  );
  private readonly lastOptions = signal<Model[]>([]);
  protected readonly options = computed(() => this.modelOptions() ?? this.lastOptions());

  protected readonly busy = signal(false);
  protected readonly submitted = signal(false);
  protected readonly minted = signal<Minted | null>(null);
  protected readonly refusal = signal<string | null>(null);
  protected readonly lastGain = signal<PreviewGain | null>(null);
  protected readonly previewMessage = signal<string | null>(null);
  private readonly now = signal(Date.now());

  /** The form's presentational choices, settled (the preview reloads only when typing pauses). */
  private readonly look = toSignal(this.form.valueChanges.pipe(startWith(this.form.getRawValue()), debounceTime(300), map(() => this.form.getRawValue())), { initialValue: this.form.getRawValue() });

  /** The elements the snippet holds. */
  protected readonly chosenElements = computed<EmbedElement[]>(() => {
    const look = this.look();
    return look.layout === 'studio' ? ['studio'] : look.parts;
  });

  /** The HTML to copy, for the minted token and the current choices. */
  protected readonly snippet = computed(() => {
    const minted = this.minted();
    const look = this.look();
    const elements = this.chosenElements();
    if (!minted || elements.length === 0) return null;
    const height = Number(look.plotHeight);
    return embedSnippet({
      origin: this.origin,
      modelId: minted.model.id,
      modelName: minted.model.name,
      token: minted.token.token,
      expiresAt: minted.token.expiresAt,
      elements,
      theme: look.theme,
      plotHeight: Number.isFinite(height) ? Math.min(PLOT_HEIGHT.max, Math.max(PLOT_HEIGHT.min, height)) : PLOT_HEIGHT.default,
      loop: loopKeyOf(minted.model.name),
    });
  });
  protected readonly preview = computed(() => {
    const snippet = this.snippet();
    return snippet === null ? null : previewDocument(snippet, this.look().theme);
  });
  /** Whether this console's origin is among the token's origins (else the preview shows the refusal). */
  protected readonly previewAllowed = computed(() => this.minted()?.token.origins.includes(this.origin) ?? false);
  protected readonly expired = computed(() => {
    const minted = this.minted();
    return minted !== null && Date.parse(minted.token.expiresAt) <= this.now();
  });
  /** Minutes left on the token (rounded up), for "expires in …". */
  protected readonly minutesLeft = computed(() => {
    const minted = this.minted();
    return minted ? Math.max(0, Math.ceil((Date.parse(minted.token.expiresAt) - this.now()) / 60000)) : 0;
  });
  /** Whether the model or the origins were changed after minting: the token still holds the old ones. */
  protected readonly stale = computed(() => {
    const minted = this.minted();
    const look = this.look();
    if (!minted) return false;
    const model = look.model;
    const sameModel = typeof model === 'object' && model !== null && model.id === minted.model.id;
    const sameOrigins = look.origins.length === minted.token.origins.length && look.origins.every((o) => minted.token.origins.includes(o));
    return !sameModel || !sameOrigins;
  });

  constructor() {
    const tick = setInterval(() => this.now.set(Date.now()), 15000);
    inject(DestroyRef).onDestroy(() => clearInterval(tick));
  }

  ngOnInit(): void {
    const id = this.modelId();
    if (id) {
      this.models.get(id).subscribe(({ model }) => {
        this.form.controls.model.setValue(model);
        this.lastOptions.set([model]);
      });
    }
  }

  /** How the model field shows a picked model. */
  protected readonly modelLabel = (value: Model | string | null): string => (typeof value === 'string' ? value : (value?.name ?? ''));

  /** Adds the typed origin as a chip, or says at the field why it cannot be one. */
  addOrigin(event?: MatChipInputEvent): boolean {
    const value = (event?.value ?? this.originText.value).trim();
    if (value === '') return true;
    const origins = this.form.controls.origins.value;
    const problem = originProblem(value) ?? (origins.includes(value) ? 'Already in the list.' : null) ?? (origins.length >= MAX_ORIGINS ? `At most ${MAX_ORIGINS} origins per token.` : null);
    if (problem) {
      this.originText.setErrors({ origin: { message: problem } });
      this.originText.markAsTouched();
      return false;
    }
    this.form.controls.origins.setValue([...origins, value]);
    this.form.controls.origins.markAsTouched();
    event?.chipInput.clear();
    this.originText.setValue('');
    return true;
  }

  /** Removes an origin chip. */
  removeOrigin(origin: string): void {
    this.form.controls.origins.setValue(this.form.controls.origins.value.filter((o) => o !== origin));
    this.form.controls.origins.markAsTouched();
  }

  /** Mints the token for the picked model and origins (`POST /embed-tokens`). */
  async mint(): Promise<void> {
    this.submitted.set(true);
    this.form.markAllAsTouched();
    if (!this.addOrigin() || this.form.invalid || this.busy()) return;
    const { model, origins, lifetimeMinutes } = this.form.getRawValue();
    if (typeof model !== 'object' || model === null) return;
    this.busy.set(true);
    this.refusal.set(null);
    try {
      const token = await firstValueFrom(this.tokens.mint({ modelIds: [model.id], origins, ttlSeconds: Number(lifetimeMinutes) * 60 }));
      this.now.set(Date.now());
      this.lastGain.set(null);
      this.previewMessage.set(null);
      this.minted.set({ token, model });
      this.notices.done('Embed token minted');
    } catch (error) {
      const problem = toProblem(error);
      if (problem.status === 404) {
        this.form.controls.model.setErrors({ server: problem.detail || 'This model no longer exists.' });
        return;
      }
      const unplaced = showProblemOnForm(this.form, problem, (pointer) => this.controlAt(pointer));
      if (!problem.hasFieldErrors || unplaced.length > 0) this.refusal.set(unplaced.map((u) => `${u.pointer}: ${u.detail}`).join(' ') || problem.detail || problem.title);
    } finally {
      this.busy.set(false);
    }
  }

  /** Confirms the copy (or says how to copy by hand). */
  protected copied(done: boolean): void {
    if (done) this.notices.done('Snippet copied');
    else this.notices.done('Could not copy: select the text and copy it with the keyboard');
  }

  protected showGain(gain: PreviewGain): void {
    this.lastGain.set(gain);
  }

  protected showLoadError(message: string): void {
    this.previewMessage.set(message);
  }

  /** The form control a pointer of the API's problem names. */
  private controlAt(pointer: string): AbstractControl | null {
    if (pointer.startsWith('/origins')) return this.form.controls.origins;
    if (pointer.startsWith('/modelIds')) return this.form.controls.model;
    if (pointer === '/ttlSeconds') return this.form.controls.lifetimeMinutes;
    return null;
  }

  private search(q: string) {
    return this.models.list({ q: q || undefined, sort: 'name', order: 'asc', pageSize: 8 }).pipe(
      map((page) => {
        this.lastOptions.set(page.items);
        return page.items;
      }),
      catchError(() => of<Model[]>([])),
    );
  }
}
