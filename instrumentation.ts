// Next.js calls register() once when a server process starts (not during `next build`). The
// Node.js side starts this process's background services: the sheet-queue workers, so queued
// jobs resume after a restart without waiting for a request. NEXT_RUNTIME is set by Next itself
// and read here (not in server/env.ts) because the bundler must see it literally to leave the
// Node-only import out of the edge bundle.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const [{ getDb }, { startSheetWorkers }] = await Promise.all([
    import("./db/index"),
    import("./features/exports/sheet-job"),
  ]);
  startSheetWorkers(getDb());
}
