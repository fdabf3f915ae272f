import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, Observable, shareReplay } from 'rxjs';

import { Batch, Condition, DataGroup, Material, MaterialDetail, NewMaterial, Panel, TestMethod, TestProperty } from './catalogue-wire';
import { PlyBasis, PlyMapping, PlyPropertySet, StatedMapping } from './ply-property-wire';

const API = '/api/v1';

/**
 * The catalogue over HTTP: material systems, batches, panels, the reference
 * lists (read once per visit; a reload picks up new ones) and ply property sets.
 */
@Injectable({ providedIn: 'root' })
export class MaterialsApi {
  private readonly http = inject(HttpClient);

  readonly testProperties$: Observable<readonly TestProperty[]> = this.cachedList<TestProperty>('test-properties');
  readonly testMethods$: Observable<readonly TestMethod[]> = this.cachedList<TestMethod>('test-methods');
  readonly conditions$: Observable<readonly Condition[]> = this.cachedList<Condition>('conditions');

  materials(): Observable<readonly Material[]> {
    return this.http.get<{ items: Material[] }>(`${API}/materials`).pipe(map((reply) => reply.items));
  }

  material(id: number): Observable<MaterialDetail> {
    return this.http.get<MaterialDetail>(`${API}/materials/${id}`);
  }

  createMaterial(material: NewMaterial): Observable<Material> {
    return this.http.post<Material>(`${API}/materials`, material);
  }

  createBatch(materialId: number, batch: { code: string; manufacturedOn?: string; notes?: string }): Observable<Batch> {
    return this.http.post<Batch>(`${API}/materials/${materialId}/batches`, batch);
  }

  createPanel(batchId: number, panel: { code: string; curedOn?: string; notes?: string }): Observable<Panel> {
    return this.http.post<Panel>(`${API}/batches/${batchId}/panels`, panel);
  }

  dataGroups(materialId: number): Observable<readonly DataGroup[]> {
    return this.http
      .get<{ items: DataGroup[] }>(`${API}/data-groups`, { params: { material: materialId } })
      .pipe(map((reply) => reply.items));
  }

  plyMapping(materialId: number): Observable<PlyMapping> {
    return this.http.get<PlyMapping>(`${API}/materials/${materialId}/ply-mapping`);
  }

  stateMapping(materialId: number, fields: readonly StatedMapping[]): Observable<PlyMapping> {
    return this.http.put<PlyMapping>(`${API}/materials/${materialId}/ply-mapping`, { fields });
  }

  /** Every condition with coupons (no condition given) at one basis. */
  plyPropertySets(materialId: number, basis: PlyBasis): Observable<readonly PlyPropertySet[]> {
    return this.http
      .get<{ sets: PlyPropertySet[] }>(`${API}/materials/${materialId}/ply-properties`, { params: { basis } })
      .pipe(map((reply) => reply.sets));
  }

  private cachedList<T>(path: string): Observable<readonly T[]> {
    return this.http.get<{ items: T[] }>(`${API}/${path}`).pipe(
      map((reply) => reply.items),
      shareReplay({ bufferSize: 1, refCount: false }),
    );
  }
}
