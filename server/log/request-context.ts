import "server-only";
import { AsyncLocalStorage } from "node:async_hooks";
import { randomUUID } from "node:crypto";

// Who and what the current request is about, for its log line: set by the route and action
// wrappers (server/log/with-logging.ts), completed by resolveViewerContext once the session is
// known. One store per process, kept on globalThis so every bundle chunk shares it.
export interface RequestContext {
  requestId: string;
  userId?: string;
  organizationId?: string;
}

declare global {
  var sealpitchRequests: AsyncLocalStorage<RequestContext> | undefined;
}
const storage = (globalThis.sealpitchRequests ??= new AsyncLocalStorage<RequestContext>());

export const REQUEST_ID_HEADER = "x-request-id";

/** A caller's (or proxy's) request id when it looks like one, else a new UUID. */
export function requestIdFrom(value: string | null | undefined): string {
  return value && /^[A-Za-z0-9._:-]{8,80}$/.test(value) ? value : randomUUID();
}

export function runWithRequest<T>(context: RequestContext, work: () => T): T {
  return storage.run(context, work);
}

export function currentRequest(): RequestContext | undefined {
  return storage.getStore();
}

/** Records the signed-in viewer on the current request's log context (no-op outside one). */
export function noteViewer(userId: string, organizationId: string): void {
  const store = storage.getStore();
  if (store) {
    store.userId = userId;
    store.organizationId = organizationId;
  }
}
