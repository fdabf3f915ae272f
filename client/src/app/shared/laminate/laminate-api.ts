import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import {
  CriterionName,
  EnvelopeAxes,
  FailureEnvelope,
  LaminateAnalysis,
  LaminateRequest,
  LaminateStack,
  PolarStiffness,
} from './laminate-wire';

/** The laminate engine over HTTP; every number in and out in internal units. */
@Injectable({ providedIn: 'root' })
export class LaminateApi {
  private readonly http = inject(HttpClient);

  analyse(request: LaminateRequest): Observable<LaminateAnalysis> {
    return this.http.post<LaminateAnalysis>('/api/v1/laminates/analyze', request);
  }

  envelope(
    stack: LaminateStack,
    criterion: CriterionName,
    axes: EnvelopeAxes,
    deltaT?: number,
  ): Observable<FailureEnvelope> {
    return this.http.post<FailureEnvelope>('/api/v1/laminates/envelope', {
      ...stack,
      criterion,
      axes,
      points: 144,
      ...(deltaT ? { deltaT } : {}),
    });
  }

  polar(stack: LaminateStack): Observable<PolarStiffness> {
    return this.http.post<PolarStiffness>('/api/v1/laminates/polar', { ...stack, stepDeg: 3 });
  }
}
