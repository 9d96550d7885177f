import { spawn } from "node:child_process";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { inject } from "vitest";

const root = fileURLToPath(new URL("../..", import.meta.url));

/**
 * The command that starts the CLI as a process: node on this run's bundle of
 * src/cli/main.ts, with its job thread's bundle beside it as in the built
 * program (tests/global-setup.ts). The same source as `npm run cli`, without
 * tsx compiling the library again in the process and in its job thread
 * (about 5 s of CPU per process here, against 0.3 s).
 */
export function cliCommand(): [string, string] {
  return [process.execPath, join(inject("testBuild"), "cli.js")];
}

/** Run the CLI as a process (cliCommand) in the repository's folder. */
export function spawnCli(...args: string[]): Promise<{ status: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    const [node, cli] = cliCommand();
    const child = spawn(node, [cli, ...args], { cwd: root });
    let stdout = "";
    let stderr = "";
    child.stdout.setEncoding("utf8").on("data", (t: string) => (stdout += t));
    child.stderr.setEncoding("utf8").on("data", (t: string) => (stderr += t));
    child.on("error", reject);
    child.on("close", (status) => resolve({ status, stdout, stderr }));
  });
}
