import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, Observable } from 'rxjs';

import {
  CodeDraft,
  Comparison,
  LayupDetail,
  LayupDraft,
  LayupPreview,
  LayupRevision,
  LayupSettings,
  LayupSummary,
} from './layup-wire';

/** Layups, their revisions, previews and comparisons over HTTP (issue-7 routes). */
@Injectable({ providedIn: 'root' })
export class LayupApi {
  private readonly http = inject(HttpClient);

  list(query = ''): Observable<readonly LayupSummary[]> {
    const params = query.trim() ? { q: query.trim() } : undefined;
    return this.http
      .get<{ items: LayupSummary[] }>('/api/v1/layups', { params })
      .pipe(map((reply) => reply.items));
  }

  detail(layupId: number): Observable<LayupDetail> {
    return this.http.get<LayupDetail>(`/api/v1/layups/${layupId}`);
  }

  revision(revisionId: number): Observable<LayupRevision> {
    return this.http.get<LayupRevision>(`/api/v1/layup-revisions/${revisionId}`);
  }

  preview(draft: LayupDraft | CodeDraft): Observable<LayupPreview> {
    return this.http.post<LayupPreview>('/api/v1/layups/preview', draft);
  }

  create(draft: LayupDraft & { name: string }): Observable<LayupRevision> {
    return this.http.post<LayupRevision>('/api/v1/layups', draft);
  }

  revise(layupId: number, draft: LayupDraft, basedOnRevision: number): Observable<LayupRevision> {
    return this.http.post<LayupRevision>(`/api/v1/layups/${layupId}/revisions`, { ...draft, basedOnRevision });
  }

  duplicate(layupId: number, name: string, revisionId?: number): Observable<LayupRevision> {
    return this.http.post<LayupRevision>(`/api/v1/layups/${layupId}/duplicate`, { name, revisionId });
  }

  compare(a: number, b: number, settings: LayupSettings = {}): Observable<Comparison> {
    return this.http.post<Comparison>('/api/v1/layups/compare', { a, b, ...settings });
  }
}
