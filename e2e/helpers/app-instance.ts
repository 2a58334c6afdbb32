import { spawn, type ChildProcess } from "node:child_process";
import { closeSync, openSync } from "node:fs";

// Extra `next start` instances (or web launchers) of the build that npm test just made, for specs
// that need the app with settings of their own (workers, limits, another database). Each runs in its own process
// group, so stopping it stops npx and the server under it.

/** Polls `path` until it answers 2xx; fails when the process stops or after two minutes. */
export async function waitReady(origin: string, child: ChildProcess, path = "/api/health"): Promise<void> {
  for (let i = 0; i < 240; i++) {
    if (child.exitCode !== null) throw new Error(`instance ${origin} stopped during start`);
    const ok = await fetch(`${origin}${path}`).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) return;
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
  throw new Error(`instance ${origin} did not become ready`);
}

/** Starts `next start` on origin's port with `env`, its output appended to `logFile`. */
export function startInstance(origin: string, env: NodeJS.ProcessEnv, logFile: string): ChildProcess {
  return startCommand(["next", "start", "-H", "127.0.0.1", "-p", new URL(origin).port], env, logFile);
}

/** Starts the web launcher (scripts/serve.ts, WEB_WORKERS from `env`) on origin's port. */
export function startWebLauncher(origin: string, env: NodeJS.ProcessEnv, logFile: string): ChildProcess {
  const serve = ["tsx", "--conditions=react-server", "scripts/serve.ts"];
  return startCommand([...serve, "-H", "127.0.0.1", "-p", new URL(origin).port], env, logFile);
}

function startCommand(args: string[], env: NodeJS.ProcessEnv, logFile: string): ChildProcess {
  const out = openSync(logFile, "w");
  const child = spawn("npx", args, {
    env,
    stdio: ["ignore", out, out],
    detached: true,
  });
  closeSync(out);
  return child;
}

/** SIGTERM to each instance's process group, then waits until each has exited (at most 15 s). */
export async function stopInstances(children: ChildProcess[]): Promise<void> {
  for (const child of children) {
    if (child.pid && child.exitCode === null) {
      try {
        process.kill(-child.pid, "SIGTERM");
      } catch {
        // already gone
      }
    }
  }
  const exited = (child: ChildProcess) =>
    child.exitCode !== null || child.signalCode !== null
      ? Promise.resolve()
      : new Promise<void>((resolve) => child.once("exit", () => resolve()));
  await Promise.race([
    Promise.all(children.map(exited)),
    new Promise((resolve) => setTimeout(resolve, 15_000).unref()),
  ]);
}
