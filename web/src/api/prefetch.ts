// Reads started by the router while a view's code is still loading, so that the view's first
// request is already under way (or answered) when it mounts. Opening a design waited for its
// chunk to load and run before asking for the project and the design: two round trips in
// series with the code instead of beside it. The view takes a read once; a read not taken
// within a few seconds (a navigation that went elsewhere) is dropped, never served stale.
import { projectsApi } from './projects';
import { designsApi } from './designs';

/** How long a started read waits for its view. */
const FRESH_MS = 5000;

const started = new Map<string, { at: number; promise: Promise<unknown> }>();

/** Starts `load` under `key` unless a fresh read of it is already under way. */
export function prefetch(key: string, load: () => Promise<unknown>, now = Date.now()): void {
  const held = started.get(key);
  if (held && now - held.at < FRESH_MS) return;
  const promise = load();
  // Not taken, a failed read must not surface as an unhandled rejection; taken, the view
  // handles it as it would its own request's failure.
  promise.catch(() => undefined);
  started.set(key, { at: now, promise });
}

/** The read started under `key`, once, if it is fresh; else undefined (the view asks itself). */
export function takePrefetched<T>(key: string, now = Date.now()): Promise<T> | undefined {
  const held = started.get(key);
  started.delete(key);
  return held && now - held.at < FRESH_MS ? (held.promise as Promise<T>) : undefined;
}

/** The project and its design, for the design workspace (router: beforeEnter). */
export function prefetchDesign(projectId: string): void {
  prefetch(`project:${projectId}`, () => projectsApi.get(projectId));
  prefetch(`design:${projectId}`, () => designsApi.get(projectId));
}
