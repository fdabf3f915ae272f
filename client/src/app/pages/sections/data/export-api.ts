import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, Observable } from 'rxjs';

import {
  ExportPreview,
  ExportRequest,
  ExportSummary,
  PlateCheckInput,
  RecordedExport,
  StripCheckInput,
} from './export-wire';

/** A recorded export as a file: its text and the name the server gave it. */
export interface ExportFile {
  readonly id: number | null;
  readonly fileName: string;
  readonly contentType: string;
  readonly text: string;
}

/** Section exports over HTTP: preview (not recorded), record, history. */
@Injectable({ providedIn: 'root' })
export class ExportApi {
  private readonly http = inject(HttpClient);

  preview(request: ExportRequest, checks: { strip: StripCheckInput; plate: PlateCheckInput }): Observable<ExportPreview> {
    return this.http.post<ExportPreview>('/api/v1/exports/preview', { ...request, checks });
  }

  /** Records the export and returns the file as the server wrote it (for download). */
  recordFile(request: ExportRequest): Observable<ExportFile> {
    return this.http.post('/api/v1/exports', request, { observe: 'response', responseType: 'text' }).pipe(
      map((response) => ({
        id: Number(response.headers.get('X-Export-Id')) || null,
        fileName: fileNameOf(response.headers.get('Content-Disposition')) ?? 'section.txt',
        contentType: response.headers.get('Content-Type') ?? 'text/plain',
        text: response.body ?? '',
      })),
    );
  }

  /** Records the export and returns its details with the text (for copy). */
  recordJson(request: ExportRequest): Observable<RecordedExport> {
    return this.http.post<RecordedExport>('/api/v1/exports', request, { params: { reply: 'json' } });
  }

  history(layupRevisionId: number): Observable<readonly ExportSummary[]> {
    return this.http
      .get<{ items: ExportSummary[] }>('/api/v1/exports', { params: { layupRevisionId } })
      .pipe(map((reply) => reply.items));
  }
}

/** The file name of `attachment; filename="a.inp"; filename*=UTF-8''a.inp` (RFC 6266), the UTF-8 form first. */
export function fileNameOf(disposition: string | null): string | null {
  if (!disposition) return null;
  const extended = /filename\*=UTF-8''([^;]+)/i.exec(disposition);
  if (extended) {
    try {
      return decodeURIComponent(extended[1]);
    } catch {
      // fall through to the plain form
    }
  }
  const plain = /filename="([^"]+)"/i.exec(disposition);
  return plain ? plain[1] : null;
}
