import { HttpContext, HttpContextToken } from '@angular/common/http';

/**
 * Marks a request whose failure the calling page shows itself (an inline error state), so the
 * error notifier stays quiet for it. Everything else that fails is reported by the notifier.
 */
export const PAGE_HANDLES_ERRORS = new HttpContextToken<boolean>(() => false);

export function pageHandlesErrors(): HttpContext {
  return new HttpContext().set(PAGE_HANDLES_ERRORS, true);
}
