import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, Observable } from 'rxjs';

import { AnalysisDetail, AnalysisRequest, AnalysisSummary, BasisMethod } from './analysis-wire';

const API = '/api/v1';

/** Analyses of data groups over HTTP: run, override the method, read. */
@Injectable({ providedIn: 'root' })
export class AnalysesApi {
  private readonly http = inject(HttpClient);

  run(request: AnalysisRequest): Observable<AnalysisDetail> {
    return this.http.post<AnalysisDetail>(`${API}/analyses`, request);
  }

  /** A new analysis on the same input with the method chosen by the engineer. */
  override(id: number, method: BasisMethod, reason: string): Observable<AnalysisDetail> {
    return this.http.post<AnalysisDetail>(`${API}/analyses/${id}/override`, { method, reason });
  }

  analysis(id: number): Observable<AnalysisDetail> {
    return this.http.get<AnalysisDetail>(`${API}/analyses/${id}`);
  }

  recent(filter: { material?: number; property?: string; limit?: number } = {}): Observable<readonly AnalysisSummary[]> {
    let params = new HttpParams().set('limit', filter.limit ?? 20);
    if (filter.material) params = params.set('material', filter.material);
    if (filter.property) params = params.set('property', filter.property);
    return this.http.get<{ items: AnalysisSummary[] }>(`${API}/analyses`, { params }).pipe(map((reply) => reply.items));
  }
}
