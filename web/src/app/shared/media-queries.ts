import { BreakpointObserver } from '@angular/cdk/layout';
import { ApplicationRef, computed, DestroyRef, inject, signal, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { map } from 'rxjs';

/** Below this the workspace's side navigation gives its width to the page and opens from a menu button. */
export const narrowScreen = '(max-width: 839.98px)';
/** A phone held upright (Material's own toolbar breakpoint): tables too wide to read become lists of cards. */
export const phoneScreen = '(max-width: 599px)';

/** Whether a media query matches, as a signal; call in an injection context. */
export function screenMatches(query: string): Signal<boolean> {
  const observer = inject(BreakpointObserver);
  return toSignal(observer.observe(query).pipe(map((state) => state.matches)), { initialValue: observer.isMatched(query) });
}

/**
 * Whether the page is being printed (or shown as print media), so long lists can render every row
 * instead of the window a virtual scroll keeps. The browser lays out the printed page straight after
 * `beforeprint`, so the change is drawn at once rather than on the next scheduled check.
 */
export function printing(): Signal<boolean> {
  const media = screenMatches('print');
  const printRequested = signal(false);
  const app = inject(ApplicationRef);
  const before = () => {
    printRequested.set(true);
    app.tick();
  };
  const after = () => printRequested.set(false);
  window.addEventListener('beforeprint', before);
  window.addEventListener('afterprint', after);
  inject(DestroyRef).onDestroy(() => {
    window.removeEventListener('beforeprint', before);
    window.removeEventListener('afterprint', after);
  });
  return computed(() => media() || printRequested());
}
