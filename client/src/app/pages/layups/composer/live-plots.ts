import { inject, Injectable, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { catchError, combineLatest, debounceTime, map, Observable, of, scan, startWith, switchMap } from 'rxjs';

import { ApiFailure, apiFailureOf } from '../../../shared/laminate/api-problem';
import { LaminateApi } from '../../../shared/laminate/laminate-api';
import {
  CriterionName,
  EnvelopeAxes,
  FailureEnvelope,
  LaminatePlyInput,
  PolarStiffness,
} from '../../../shared/laminate/laminate-wire';

export interface EnvelopeSettings {
  readonly criterion: CriterionName | null;
  readonly axes: EnvelopeAxes;
  /** K; residual stress held fixed along every load direction */
  readonly deltaT: number;
}

export interface PlotState<T> {
  readonly loading: boolean;
  readonly data: T | null;
  readonly failure: ApiFailure | null;
}

const EMPTY = { loading: false, data: null, failure: null };

/** One plot request as a stream of states; the previous plot stays drawn while the next one loads. */
function plotRequest<T>(request: Observable<T>): Observable<PlotState<T>> {
  return request.pipe(
    map((data): PlotState<T> => ({ loading: false, data, failure: null })),
    catchError((error: unknown) => of<PlotState<T>>({ loading: false, data: null, failure: apiFailureOf(error) })),
    startWith<PlotState<T>>({ loading: true, data: null, failure: null }),
  );
}

function keepWhileLoading<T>(previous: PlotState<T>, next: PlotState<T>): PlotState<T> {
  return next.loading ? { ...previous, loading: true } : next;
}

/**
 * The polar stiffness and the failure envelope of the laminate last computed:
 * two more engine requests, each cancelled when a newer laminate arrives.
 */
@Injectable()
export class LivePlots {
  private readonly api = inject(LaminateApi);

  /** The engine input of the last preview (its `laminate.plies`). */
  readonly laminate = signal<LaminatePlyInput[] | null>(null);
  readonly envelopeSettings = signal<EnvelopeSettings>({ criterion: null, axes: 'Nx-Ny', deltaT: 0 });

  readonly polar = toSignal(
    toObservable(this.laminate).pipe(
      switchMap((plies) =>
        plies
          ? plotRequest(this.api.polar({ plies }))
          : of<PlotState<PolarStiffness>>(EMPTY),
      ),
      scan(keepWhileLoading<PolarStiffness>, EMPTY as PlotState<PolarStiffness>),
    ),
    { initialValue: EMPTY as PlotState<PolarStiffness> },
  );

  readonly envelope = toSignal(
    combineLatest([toObservable(this.laminate), toObservable(this.envelopeSettings)]).pipe(
      debounceTime(50),
      switchMap(([plies, settings]) =>
        plies && settings.criterion
          ? plotRequest(this.api.envelope({ plies }, settings.criterion, settings.axes, settings.deltaT))
          : of<PlotState<FailureEnvelope>>(EMPTY),
      ),
      scan(keepWhileLoading<FailureEnvelope>, EMPTY as PlotState<FailureEnvelope>),
    ),
    { initialValue: EMPTY as PlotState<FailureEnvelope> },
  );
}
