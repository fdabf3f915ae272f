import { HttpClient, HttpEvent, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, Observable } from 'rxjs';

import { Specimen, SpecimenPage, SpecimenQuery, SpecimenStatus, Upload, UploadResult } from './coupon-wire';

const API = '/api/v1';

/** The unit choices of an upload (POST /uploads form fields). */
export interface UploadUnitChoice {
  readonly stressUnit: 'MPa' | 'ksi';
  readonly lengthUnit: 'mm' | 'in';
  readonly forceUnit: 'N' | 'lbf';
}

/** Uploads and the coupon table over HTTP. */
@Injectable({ providedIn: 'root' })
export class CouponsApi {
  private readonly http = inject(HttpClient);

  /** Where the template downloads from (SI or US column names and example). */
  templateUrl(system: 'SI' | 'US'): string {
    return `${API}/uploads/template.csv?units=${system}`;
  }

  storedFileUrl(uploadId: number): string {
    return `${API}/uploads/${uploadId}/file`;
  }

  /**
   * Sends the file with its column mapping and units. The events carry the
   * upload progress; the last one is the server's reply (or an error).
   */
  upload(file: File, columns: Readonly<Record<string, string>>, units: UploadUnitChoice): Observable<HttpEvent<UploadResult>> {
    const form = new FormData();
    form.append('file', file, file.name);
    form.append('columns', JSON.stringify(columns));
    form.append('stressUnit', units.stressUnit);
    form.append('lengthUnit', units.lengthUnit);
    form.append('forceUnit', units.forceUnit);
    return this.http.post<UploadResult>(`${API}/uploads`, form, { reportProgress: true, observe: 'events' });
  }

  uploads(limit = 20): Observable<readonly Upload[]> {
    return this.http.get<{ items: Upload[] }>(`${API}/uploads`, { params: { limit } }).pipe(map((reply) => reply.items));
  }

  uploadRecord(id: number): Observable<Upload> {
    return this.http.get<Upload>(`${API}/uploads/${id}`);
  }

  specimens(query: SpecimenQuery): Observable<SpecimenPage> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(query)) {
      if (value !== null && value !== undefined && value !== '') params = params.set(key, String(value));
    }
    return this.http.get<SpecimenPage>(`${API}/specimens`, { params });
  }

  /** Exclude (to 'excluded') or restore (to 'valid') one coupon; the reason is audited. */
  changeStatus(id: number, to: SpecimenStatus, reason: string): Observable<Specimen> {
    const verb = to === 'excluded' ? 'exclude' : 'restore';
    return this.http.post<Specimen>(`${API}/specimens/${id}/${verb}`, { reason });
  }
}
