import { DestroyRef, inject, Injectable } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import {
  catchError,
  debounceTime,
  map,
  merge,
  Observable,
  of,
  scan,
  share,
  startWith,
  Subject,
  switchMap,
} from 'rxjs';

import { ApiFailure, apiFailureOf } from '../../../shared/laminate/api-problem';
import { LayupApi } from '../data/layup-api';
import { CodeDraft, LayupDraft, LayupPreview } from '../data/layup-wire';

/** Keystrokes closer together than this make one request. */
export const PREVIEW_DEBOUNCE_MS = 250;

/** A draft to compute: from the ply table, or from a typed laminate code. */
export interface PreviewRequest {
  readonly origin: 'table' | 'code';
  readonly draft: LayupDraft | CodeDraft;
}

export type PreviewEvent =
  | { readonly kind: 'waiting'; readonly request: PreviewRequest }
  | { readonly kind: 'loading'; readonly request: PreviewRequest }
  | { readonly kind: 'ready'; readonly request: PreviewRequest; readonly preview: LayupPreview }
  | { readonly kind: 'error'; readonly request: PreviewRequest; readonly failure: ApiFailure };

export interface PreviewState {
  readonly status: 'idle' | 'waiting' | 'loading' | 'ready' | 'error';
  /** The last preview that came back, kept while a newer one loads or fails. */
  readonly preview: LayupPreview | null;
  readonly failure: ApiFailure | null;
  /** Counts the previews received: the page's hook for "results updated". */
  readonly received: number;
}

const IDLE: PreviewState = { status: 'idle', preview: null, failure: null, received: 0 };

function nextState(state: PreviewState, event: PreviewEvent): PreviewState {
  switch (event.kind) {
    case 'waiting':
    case 'loading':
      return { ...state, status: event.kind };
    case 'ready':
      return { status: 'ready', preview: event.preview, failure: null, received: state.received + 1 };
    case 'error':
      return { ...state, status: 'error', failure: event.failure };
  }
}

/**
 * The composer's live results: each edit is a request; requests are debounced,
 * and switchMap drops the answer of a request a newer one has replaced, so only
 * the latest edit's result is ever shown. Failures keep the last good result.
 */
@Injectable()
export class LivePreview {
  private readonly api = inject(LayupApi);
  private readonly requests = new Subject<PreviewRequest>();

  readonly events$: Observable<PreviewEvent> = merge(
    this.requests.pipe(map((request): PreviewEvent => ({ kind: 'waiting', request }))),
    this.requests.pipe(
      debounceTime(PREVIEW_DEBOUNCE_MS),
      switchMap((request) =>
        this.api.preview(request.draft).pipe(
          map((preview): PreviewEvent => ({ kind: 'ready', request, preview })),
          catchError((error: unknown) => of<PreviewEvent>({ kind: 'error', request, failure: apiFailureOf(error) })),
          startWith<PreviewEvent>({ kind: 'loading', request }),
        ),
      ),
    ),
  ).pipe(share());

  readonly state = toSignal(this.events$.pipe(scan(nextState, IDLE)), { initialValue: IDLE });

  constructor() {
    inject(DestroyRef).onDestroy(() => this.requests.complete());
  }

  request(request: PreviewRequest): void {
    this.requests.next(request);
  }
}
