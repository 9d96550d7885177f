/**
 * A private Redis server for the queue example's test and benchmark: Debian's
 * redis-server started on 127.0.0.1 at a free port, in a temporary directory,
 * with no persistence (no RDB snapshots, no append-only file), and stopped
 * afterwards. Never a system-wide service: the data of a run lives and dies
 * with the run. In production, point REDIS_URL at the Redis your hosts share.
 */
import { type ChildProcess, spawn, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";

/** Where Debian installs it (`apt-get install redis-server`); else the first on PATH. */
export function findRedisServer(): string | undefined {
  for (const candidate of ["/usr/bin/redis-server", "redis-server"]) {
    const r = spawnSync(candidate, ["--version"], { encoding: "utf8", timeout: 10_000 });
    if (r.status === 0 && /Redis server/.test(r.stdout)) return candidate;
  }
  return undefined;
}

export interface LocalRedis {
  readonly port: number;
  /** redis://127.0.0.1:<port> */
  readonly url: string;
  /** Stops the server (SIGTERM, then SIGKILL after 5 s) and removes its directory. */
  stop(): Promise<void>;
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const address = s.address();
      s.close(() => (typeof address === "object" && address ? resolve(address.port) : reject(new Error("no port"))));
    });
  });
}

/** Resolves when the child process has exited. */
export function exited(child: ChildProcess): Promise<void> {
  return child.exitCode !== null || child.signalCode !== null ? Promise.resolve() : new Promise((resolve) => child.once("exit", () => resolve()));
}

/**
 * Starts redis-server and resolves once it accepts connections (it prints
 * "Ready to accept connections"). Rejects with the server's own output if it
 * exits first or is not ready within `readyMs`. A port taken between our probe
 * and the server's bind is retried on another port, three times.
 */
export async function startLocalRedis(options: { readonly binary?: string; readonly readyMs?: number } = {}): Promise<LocalRedis> {
  const binary = options.binary ?? findRedisServer();
  if (binary === undefined) throw new Error("redis-server is not installed (Debian: apt-get install -y --no-install-recommends redis-server)");
  let last: unknown;
  for (let attempt = 0; attempt < 3; attempt++) {
    try {
      return await startOnce(binary, await freePort(), options.readyMs ?? 15_000);
    } catch (e) {
      last = e;
      if (!/Address already in use/i.test(String((e as Error).message))) break;
    }
  }
  throw last;
}

async function startOnce(binary: string, port: number, readyMs: number): Promise<LocalRedis> {
  const dir = mkdtempSync(join(tmpdir(), "emquant-redis-"));
  const child = spawn(
    binary,
    ["--port", String(port), "--bind", "127.0.0.1", "--dir", dir, "--save", "", "--appendonly", "no", "--daemonize", "no", "--loglevel", "notice"],
    { stdio: ["ignore", "pipe", "pipe"] },
  );
  // A test runner that dies must not leave the server behind.
  const kill = (): void => void child.kill("SIGKILL");
  process.once("exit", kill);
  const stop = async (): Promise<void> => {
    process.off("exit", kill);
    if (child.exitCode === null && child.signalCode === null) {
      child.kill("SIGTERM");
      const timer = setTimeout(() => child.kill("SIGKILL"), 5000);
      await exited(child);
      clearTimeout(timer);
    }
    rmSync(dir, { recursive: true, force: true });
  };
  try {
    await readyLine(child, "Ready to accept connections", "redis-server", readyMs);
  } catch (e) {
    await stop();
    throw e;
  }
  return { port, url: `redis://127.0.0.1:${port}`, stop };
}

/**
 * Resolves when `child` prints `line` (stdout or stderr); rejects with what it
 * printed if it exits first or stays silent for `ms`. Its output keeps being
 * read afterwards, so a full pipe never blocks it.
 */
export function readyLine(child: ChildProcess, line: string, what: string, ms: number): Promise<void> {
  return new Promise<void>((resolve, reject) => {
    let output = "";
    let ready = false;
    const timer = setTimeout(() => reject(new Error(`${what} was not ready within ${ms} ms:\n${output}`)), ms);
    const onData = (chunk: Buffer): void => {
      if (ready) return;
      output += chunk.toString();
      if (output.includes(line)) {
        ready = true;
        clearTimeout(timer);
        resolve();
      }
    };
    child.stdout!.on("data", onData);
    child.stderr!.on("data", onData);
    child.once("exit", (code) => {
      clearTimeout(timer);
      reject(new Error(`${what} exited with code ${String(code)}:\n${output}`));
    });
    child.once("error", (e) => {
      clearTimeout(timer);
      reject(e);
    });
  });
}
