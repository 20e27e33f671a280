import { HttpErrorResponse } from '@angular/common/http';
import type { ApiError } from '@tallyfit/contracts';

/** The API's own message for a failed call, or a plain description when there is none. */
export function apiErrorMessage(error: unknown): string {
  if (error instanceof HttpErrorResponse) {
    const body = error.error as Partial<ApiError> | null;
    if (body?.error?.message) return body.error.message;
    if (error.status === 0) return 'The server could not be reached. Check your connection and try again.';
    return `The server answered ${error.status} ${error.statusText}.`;
  }
  return error instanceof Error ? error.message : 'Something went wrong.';
}
