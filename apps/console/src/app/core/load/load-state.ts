import { catchError, map, type Observable, of, startWith } from 'rxjs';
import { apiErrorMessage } from '../api/api-error-message';

/** What a page knows about data it is fetching: still coming, here, or failed with a message. */
export type LoadState<T> =
  | { status: 'loading' }
  | { status: 'loaded'; value: T }
  | { status: 'failed'; message: string };

/** Turns a fetch into its load states, starting with `loading`; a failure becomes the API's message. */
export function toLoadState<T>(source: Observable<T>): Observable<LoadState<T>> {
  return source.pipe(
    map((value): LoadState<T> => ({ status: 'loaded', value })),
    catchError((error: unknown) => of<LoadState<T>>({ status: 'failed', message: apiErrorMessage(error) })),
    startWith<LoadState<T>>({ status: 'loading' }),
  );
}

export const LOADING: LoadState<never> = { status: 'loading' };

export function loadedValue<T>(state: LoadState<T>): T | null {
  return state.status === 'loaded' ? state.value : null;
}

export function failureMessage(state: LoadState<unknown>): string | null {
  return state.status === 'failed' ? state.message : null;
}
