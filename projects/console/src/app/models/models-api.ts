import { HttpClient, type HttpContext, type HttpEvent, type HttpResponse } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import { API_V1, queryParams } from '../api/api-base';
import { UPLOAD_HTTP } from '../api/upload-http';
import type { Model, ModelInput, ModelPage, Revision, RevisionSummary, Schemas } from '../api/api-types';
import { handles } from '../problem/problem-context';

/** A model together with the ETag of its revision (for `If-Match` on the next save). */
export interface TaggedModel {
  readonly model: Model;
  readonly etag: string;
}

/** The list query of the model library (`GET /models`). */
export interface ModelQuery {
  readonly q?: string;
  readonly tag?: string;
  readonly sort?: 'name' | 'updatedAt' | 'createdAt';
  readonly order?: 'asc' | 'desc';
  readonly page?: number;
  readonly pageSize?: number;
  readonly includeDeleted?: boolean;
}

/** One tag and how many models carry it (`GET /models/tags`). */
export interface TagCount {
  readonly tag: string;
  readonly count: number;
}

/** The ETag the API sent, or the one its documented form gives (`"<id>-r<revision>"`). */
function etagOf(response: HttpResponse<Model>): TaggedModel {
  const model = response.body as Model;
  return { model, etag: response.headers.get('ETag') ?? `"${model.id}-r${model.revision}"` };
}

/**
 * The loop models of the REST API: list, read, create, save as the next revision (with `If-Match`),
 * delete and restore, revisions, import and export, and the compute routes the screens need.
 */
@Injectable({ providedIn: 'root' })
export class ModelsApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(API_V1);
  private readonly uploads = inject(UPLOAD_HTTP);

  /** One page of models (server-side search, tag filter, sort and paging). */
  list(query: ModelQuery): Observable<ModelPage> {
    return this.http.get<ModelPage>(`${this.api}/models`, { params: queryParams({ ...query, includeDeleted: query.includeDeleted || undefined }) });
  }

  /** Every tag in use, with its count. */
  tags(): Observable<TagCount[]> {
    return this.http.get<{ items: TagCount[] }>(`${this.api}/models/tags`).pipe(map((page) => page.items));
  }

  /** One model at its current revision, with its ETag. */
  get(id: string, options: { includeDeleted?: boolean; context?: HttpContext } = {}): Observable<TaggedModel> {
    return this.http
      .get<Model>(`${this.api}/models/${encodeURIComponent(id)}`, { observe: 'response', params: queryParams({ includeDeleted: options.includeDeleted || undefined }), context: options.context })
      .pipe(map(etagOf));
  }

  /** Creates a model (revision 1); field errors come back as a 400 the form shows. */
  create(input: ModelInput): Observable<TaggedModel> {
    return this.http.post<Model>(`${this.api}/models`, input, { observe: 'response', context: handles(400) }).pipe(map(etagOf));
  }

  /**
   * Saves new content as the next revision, on top of the revision whose ETag is given. A 412 means someone
   * saved in between: the caller shows the conflict itself (nothing was written).
   */
  update(id: string, input: ModelInput, etag: string): Observable<TaggedModel> {
    return this.http
      .put<Model>(`${this.api}/models/${encodeURIComponent(id)}`, input, { observe: 'response', headers: { 'If-Match': etag }, context: handles(400, 412) })
      .pipe(map(etagOf));
  }

  /** Soft-deletes a model (restore undoes it). */
  remove(id: string): Observable<void> {
    return this.http.delete<void>(`${this.api}/models/${encodeURIComponent(id)}`);
  }

  /** Undoes a soft delete. */
  restore(id: string): Observable<TaggedModel> {
    return this.http.post<Model>(`${this.api}/models/${encodeURIComponent(id)}/restore`, null, { observe: 'response' }).pipe(map(etagOf));
  }

  /** The model's revisions, newest first (without content). */
  revisions(id: string): Observable<RevisionSummary[]> {
    return this.http.get<{ items: RevisionSummary[] }>(`${this.api}/models/${encodeURIComponent(id)}/revisions`).pipe(map((page) => page.items));
  }

  /** One revision with its full content. */
  revision(id: string, revision: number): Observable<Revision> {
    return this.http.get<Revision>(`${this.api}/models/${encodeURIComponent(id)}/revisions/${revision}`);
  }

  /** The locus of the model's current revision (cached on the server by content). */
  locus(id: string): Observable<Schemas['LocusResult']> {
    return this.http.get<Schemas['LocusResult']>(`${this.api}/models/${encodeURIComponent(id)}/locus`);
  }

  /** Gain ranges that meet design targets, and damping-line gains (`POST /design`). */
  design(request: Schemas['DesignRequest']): Observable<Schemas['DesignResult']> {
    return this.http.post<Schemas['DesignResult']>(`${this.api}/design`, request, { context: handles(400) });
  }

  /** Closed-loop poles and step response at one gain (`POST /closed-loop`). */
  closedLoop(request: Schemas['ClosedLoopRequest']): Observable<Schemas['ClosedLoopResult']> {
    return this.http.post<Schemas['ClosedLoopResult']>(`${this.api}/closed-loop`, request, { context: handles(400) });
  }

  /** The export bundle of every model that is not deleted (optionally one tag), as a file to save. */
  exportBundle(tag?: string): Observable<HttpResponse<Blob>> {
    return this.http.get(`${this.api}/models/export`, { params: queryParams({ tag }), observe: 'response', responseType: 'blob' });
  }

  /**
   * Uploads a bundle (.json) or CSV (.csv) with upload progress events (through XMLHttpRequest: fetch reports
   * none); the last event holds the per-row results. An unreadable (400), too large (413) or unsupported
   * (415) file is shown by the screen.
   */
  importFile(file: File): Observable<HttpEvent<Schemas['ImportResult']>> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.uploads.post<Schemas['ImportResult']>(`${this.api}/models/import`, body, { observe: 'events', reportProgress: true, context: handles(400, 413, 415) });
  }
}
