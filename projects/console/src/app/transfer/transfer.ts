import { afterNextRender, ChangeDetectionStrategy, Component, computed, DestroyRef, effect, type ElementRef, inject, Injector, signal, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { catchError, firstValueFrom, of, type Subscription } from 'rxjs';
import type { Schemas } from '../api/api-types';
import { PageHeader } from '../layout/page-header';
import { ModelsApi } from '../models/models-api';
import { toProblem } from '../problem/api-problem';
import { Notices } from '../problem/notices';
import { Session } from '../session/session';
import { CSV_COLUMNS, csvTemplate } from './csv-template';
import { fileSize, IMPORT_ACCEPT, importFileProblem, MAX_IMPORT_BYTES } from './import-file';
import { fileNameFrom, saveBlob } from './save-file';
import { UPLOAD_START, uploadStep, type UploadState } from './upload-progress';

/** One row of the import's result table. */
type ResultRow = Schemas['ImportRowResult'];

/** Which rows the result table shows. */
type RowFilter = 'all' | 'created' | 'rejected';

/** The upload of one file and where it stands. */
interface Upload {
  readonly file: { readonly name: string; readonly size: number };
  readonly state: UploadState;
}

/**
 * "Import and export": upload a bundle or CSV (checked on the page, then row by row by the API) with its
 * progress and a per-row result table; download every model, or one tag's, as a bundle.
 */
@Component({
  selector: 'pwc-transfer',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    PageHeader,
    MatButtonModule,
    MatButtonToggleModule,
    MatCardModule,
    MatExpansionModule,
    MatFormFieldModule,
    MatIconModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTableModule,
  ],
  templateUrl: './transfer.html',
  styleUrl: './transfer.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Transfer {
  private readonly models = inject(ModelsApi);
  private readonly notices = inject(Notices);
  protected readonly session = inject(Session);

  protected readonly accept = IMPORT_ACCEPT;
  protected readonly maxSize = fileSize(MAX_IMPORT_BYTES);
  protected readonly columns = CSV_COLUMNS;
  protected readonly tableColumns = ['row', 'name', 'status', 'detail'];

  /** Whether the person may import (importing creates models). */
  protected readonly canImport = computed(() => this.session.me() !== null && this.session.can('models:write'));
  protected readonly dragging = signal(false);
  protected readonly fileProblem = signal<string | null>(null);
  protected readonly upload = signal<Upload | null>(null);
  protected readonly result = computed(() => this.upload()?.state.result ?? null);
  protected readonly rowFilter = signal<RowFilter>('all');
  protected readonly rows = new MatTableDataSource<ResultRow>([]);
  private readonly paginator = viewChild(MatPaginator);
  private readonly resultSection = viewChild<ElementRef<HTMLElement>>('results');
  private readonly injector = inject(Injector);
  private sending: Subscription | null = null;

  /** Tags to filter the export by (none when the list cannot be read). */
  protected readonly tags = toSignal(this.models.tags().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly exportTag = new FormControl<string>('', { nonNullable: true });
  protected readonly exporting = signal(false);
  protected readonly lastExport = signal<{ name: string; count: number | null } | null>(null);

  constructor() {
    effect(() => {
      const result = this.result();
      const filter = this.rowFilter();
      const all = result?.results ?? [];
      this.rows.data = filter === 'all' ? all : all.filter((r) => r.status === filter);
    });
    effect(() => {
      this.rows.paginator = this.paginator() ?? null;
    });
    inject(DestroyRef).onDestroy(() => this.sending?.unsubscribe());
  }

  /** The files a drop or the file button delivered: the first one is imported. */
  take(files: FileList | null | undefined): void {
    const file = files?.item(0);
    if (!file || !this.canImport()) return;
    if (files && files.length > 1) {
      this.fileProblem.set('Drop one file at a time.');
      return;
    }
    const problem = importFileProblem(file);
    this.fileProblem.set(problem);
    if (problem) return;
    this.send(file);
  }

  protected dragOver(event: DragEvent): void {
    if (!this.canImport()) return;
    event.preventDefault();
    if (event.dataTransfer) event.dataTransfer.dropEffect = 'copy';
    this.dragging.set(true);
  }

  protected drop(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    this.take(event.dataTransfer?.files);
  }

  protected chosen(input: HTMLInputElement): void {
    this.take(input.files);
    // the same file chosen again is a new import
    input.value = '';
  }

  /** Saves the CSV template, made here in the browser. */
  downloadTemplate(): void {
    saveBlob(new Blob([csvTemplate()], { type: 'text/csv;charset=utf-8' }), 'polewright-models-template.csv');
  }

  /** Downloads the export bundle (all models, or one tag's) and saves it under the server's file name. */
  async downloadExport(): Promise<void> {
    if (this.exporting()) return;
    this.exporting.set(true);
    try {
      const response = await firstValueFrom(this.models.exportBundle(this.exportTag.value || undefined));
      const blob = response.body ?? new Blob([], { type: 'application/json' });
      const name = fileNameFrom(response.headers.get('Content-Disposition'), 'polewright-models.json');
      saveBlob(blob, name);
      this.lastExport.set({ name, count: await modelCount(blob) });
    } catch {
      // the interceptor showed the problem
    } finally {
      this.exporting.set(false);
    }
  }

  private send(file: File): void {
    this.sending?.unsubscribe();
    this.rowFilter.set('all');
    this.upload.set({ file: { name: file.name, size: file.size }, state: UPLOAD_START });
    this.sending = this.models.importFile(file).subscribe({
      next: (event) => this.upload.update((u) => (u ? { ...u, state: uploadStep(u.state, event) } : u)),
      error: (error: unknown) => {
        const problem = toProblem(error);
        const field = problem.errors.find((e) => e.pointer === '/file');
        this.upload.set(null);
        this.fileProblem.set(field ? `${file.name} ${field.detail}` : problem.detail || problem.title);
      },
      complete: () => {
        const result = this.upload()?.state.result;
        if (!result) return;
        this.notices.done(`${result.created} created, ${result.rejected} rejected`);
        // the table sits below the cards: bring it into view once drawn
        afterNextRender(() => this.resultSection()?.nativeElement.scrollIntoView?.({ behavior: 'smooth', block: 'start' }), { injector: this.injector });
      },
    });
  }
}

/** How many models an export bundle holds (null when it cannot be read). */
async function modelCount(blob: Blob): Promise<number | null> {
  try {
    const bundle = JSON.parse(await blob.text()) as { models?: unknown };
    return Array.isArray(bundle.models) ? bundle.models.length : null;
  } catch {
    return null;
  }
}
