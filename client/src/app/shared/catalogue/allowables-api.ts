import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, Observable } from 'rxjs';

import {
  Allowable,
  AllowableDetail,
  AllowableFilter,
  AllowableImpact,
  AllowableProposal,
  Decision,
  ReviewItem,
} from './allowable-wire';

const API = '/api/v1';

function filterParams(filter: AllowableFilter): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(filter)) {
    if (value === null || value === undefined || value === '') continue;
    const text = Array.isArray(value) ? value.join(',') : String(value);
    if (text !== '') params = params.set(key, text);
  }
  return params;
}

/** Allowables and their review over HTTP. */
@Injectable({ providedIn: 'root' })
export class AllowablesApi {
  private readonly http = inject(HttpClient);

  list(filter: AllowableFilter): Observable<{ items: readonly Allowable[]; caution: string }> {
    return this.http.get<{ items: Allowable[]; caution: string }>(`${API}/allowables`, { params: filterParams(filter) });
  }

  /** The download address of the approved values matching the filter (status is always approved). */
  approvedCsvUrl(filter: AllowableFilter): string {
    const query = filterParams({ ...filter, status: undefined }).toString();
    return `${API}/allowables/approved.csv${query ? `?${query}` : ''}`;
  }

  allowable(id: number): Observable<AllowableDetail> {
    return this.http.get<AllowableDetail>(`${API}/allowables/${id}`);
  }

  impact(id: number): Observable<AllowableImpact> {
    return this.http.get<AllowableImpact>(`${API}/allowables/${id}/impact`);
  }

  propose(proposal: AllowableProposal): Observable<AllowableDetail> {
    return this.http.post<AllowableDetail>(`${API}/allowables`, proposal);
  }

  submitDraft(id: number): Observable<AllowableDetail> {
    return this.http.post<AllowableDetail>(`${API}/allowables/${id}/propose`, {});
  }

  withdrawDraft(id: number): Observable<void> {
    return this.http.delete<void>(`${API}/allowables/${id}`);
  }

  reviewQueue(): Observable<readonly ReviewItem[]> {
    return this.http.get<{ items: ReviewItem[] }>(`${API}/reviews`).pipe(map((reply) => reply.items));
  }

  /** The reviewer's signed decision: the meaning is the API's own text, sent back unchanged. */
  decide(id: number, decision: Decision, comment: string, signatureMeaning: string): Observable<AllowableDetail> {
    return this.http.post<AllowableDetail>(`${API}/allowables/${id}/${decision}`, { comment, signatureMeaning });
  }
}
