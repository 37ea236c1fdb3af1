import { openedPath } from '@/src/boot/earlyStart';

/** The screens not in the deferred chunk (deferred.tsx), and sign-in: opening these needs none of it. */
export const NOT_DEFERRED_PATHS: readonly string[] = ['/', '/sign-in', '/network'];
const NOT_DEFERRED = new Set(NOT_DEFERRED_PATHS);

/** True when a page opened at `pathname` shows a screen from the deferred chunk (or may: an unknown address). */
export function opensDeferredScreen(pathname: string): boolean {
  return !NOT_DEFERRED.has(openedPath(pathname));
}
