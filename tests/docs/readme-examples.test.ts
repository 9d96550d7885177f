// Every code block of README.md is extracted and run: TypeScript blocks as modules
// (imports of "emquant" pointed at src/), command lines through the CLI, with the
// outputs the README shows compared to what the code gives.
import { mkdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { fileURLToPath, pathToFileURL } from "node:url";
import ts from "typescript";
import { afterAll, describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/run.js";

const root = fileURLToPath(new URL("../..", import.meta.url));
const readme = readFileSync(`${root}README.md`, "utf8");
// Inside the repository (so the test build's aliases apply); .scratch* is git-ignored.
const scratch = `${root}.scratch-readme/`;

interface Block {
  readonly lang: string;
  readonly code: string;
  readonly line: number;
}

function blocks(): Block[] {
  const out: Block[] = [];
  const re = /^```(\w*)\n([\s\S]*?)^```/gm;
  for (const m of readme.matchAll(re)) out.push({ lang: m[1]!, code: m[2]!, line: readme.slice(0, m.index).split("\n").length });
  return out;
}

// Shell lines that install or set up, not examples: they need the network or minutes of work.
const SET_UP = new Set(["npm ci && npm run demo   # a small design worked through the library, with warnings and cautions", "npm ci && npm test       # reference tables, properties, CLI and HTTP handler", "npm install emquant",
  // The browser page's commands: .ci/run runs test:browser, which builds the page first.
  "npm run build:web      # the static site, in out/web (serve it with any static file server)",
  "npm run test:browser   # end to end in headless Chromium"]);

/** Split a command line as a POSIX shell does for these lines (words, "double quotes"). */
function shellWords(line: string): string[] {
  return [...line.matchAll(/(?:[^\s"]+|"[^"]*")+/g)].map((m) => m[0].replace(/"/g, ""));
}

/**
 * A shown value, as the README writes it after an expression statement:
 * "≈ 105.7" (a number, to the digits shown), "Error: text" (it throws that),
 * a JavaScript literal ({ ... }, [ ... ], "text", a number) compared as data,
 * or text, compared with the first line of the value's text.
 */
function check(where: string, run: () => unknown, shown: string): void {
  if (shown.startsWith("Error: ")) {
    expect(run, where).toThrow(shown.slice("Error: ".length));
    return;
  }
  const value = run();
  const approx = /^≈\s*(-?[\d.]+(?:e-?\d+)?)/.exec(shown);
  if (approx) {
    const digits = approx[1]!;
    const expected = Number(digits);
    // Half a unit in the last digit shown.
    const mantissa = digits.split("e")[0]!;
    const decimals = mantissa.includes(".") ? mantissa.split(".")[1]!.length : 0;
    const half = 0.5 * 10 ** (-decimals) * 10 ** Number(digits.split("e")[1] ?? 0);
    expect(Math.abs((value as number) - expected), `${where}: ${String(value)} shown as ${shown}`).toBeLessThanOrEqual(half * (1 + 1e-12));
    return;
  }
  if (/^[[{"]/.test(shown) || /^-?\d+(\.\d+)?(e-?\d+)?$/.test(shown)) {
    const data = new Function(`return (${shown});`)() as unknown;
    if (typeof data === "object" && data !== null) expect(value, where).toMatchObject(data);
    else expect(value, where).toEqual(data);
    return;
  }
  expect(String(value).split("\n")[0], where).toBe(shown);
}

/**
 * The block as a module: `from "emquant"` points at src/index.ts, and each
 * one-line expression statement with a trailing comment becomes a check of
 * its value against the comment.
 */
function instrument(code: string, index: number): string {
  const lines = code.split("\n").map((l, i) => {
    const m = /^(\s*)(?!const |let |import |\/\/)(.+?);\s*\/\/\s*(.+)$/.exec(l);
    if (!m) return l;
    return `${m[1]}(globalThis as any).__readmeCheck(${JSON.stringify(`README block ${index}, line ${i + 1}`)}, () => (${m[2]}), ${JSON.stringify(m[3]!.trim())});`;
  });
  return lines
    .join("\n")
    .replaceAll('from "emquant"', `from ${JSON.stringify(`${root}src/index.js`)}`)
    .replaceAll('from "emquant/http"', `from ${JSON.stringify(`${root}src/http/index.js`)}`);
}

(globalThis as Record<string, unknown>).__readmeCheck = check;
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

const all = blocks();

describe("every README example runs as written", () => {
  it("has only TypeScript, shell, command-line and JSON blocks, and sets up only with the listed commands", () => {
    for (const b of all) expect(["ts", "sh", "", "json"], `block at line ${b.line}`).toContain(b.lang);
    // JSON blocks are design files: they parse (tests/designs/surfaces.test.ts evaluates the one in the README).
    for (const b of all.filter((x) => x.lang === "json")) expect(() => JSON.parse(b.code), `JSON block at line ${b.line}`).not.toThrow();
    const sh = all.filter((b) => b.lang === "sh").flatMap((b) => b.code.trim().split("\n"));
    for (const line of sh) expect(SET_UP.has(line), `a shell line that is not a set-up step must be run by this test: ${line}`).toBe(true);
  });

  const typed = all.filter((b) => b.lang === "ts");
  for (const [i, b] of typed.entries()) {
    if (b.code.includes("@ts-expect-error")) continue; // checked by the compiler below
    it(`runs the TypeScript block at README line ${b.line} and gives the values it shows`, async () => {
      mkdirSync(scratch, { recursive: true });
      const file = `${scratch}block-${i}.ts`;
      writeFileSync(file, instrument(b.code, i));
      await import(pathToFileURL(file).href);
    });
  }

  it("shows dimension mistakes that the compiler reports with the message it prints", () => {
    const fails = typed.filter((b) => b.code.includes("@ts-expect-error"));
    expect(fails.length).toBeGreaterThan(0);
    mkdirSync(scratch, { recursive: true });
    const source = (code: string) => code.replaceAll('from "emquant"', `from ${JSON.stringify(`${root}src/index.js`)}`);
    const cases = fails.map((b, i) => {
      // Without the directive, the line must fail with the message the README quotes.
      const bad = `${scratch}type-${i}.ts`;
      writeFileSync(bad, source(b.code.replace(/^.*@ts-expect-error.*\n/m, "")));
      // With the directive, the block compiles: the mistake is the only error.
      const ok = `${scratch}type-ok-${i}.ts`;
      writeFileSync(ok, source(b.code));
      return { b, bad, ok };
    });
    // One program for every file, so the library's types are checked once, not once per file
    // (it halved this test's time). Diagnostics are still asked file by file.
    const program = ts.createProgram(cases.flatMap((c) => [c.bad, c.ok]), { strict: true, noEmit: true, target: ts.ScriptTarget.ES2022, module: ts.ModuleKind.NodeNext, moduleResolution: ts.ModuleResolutionKind.NodeNext, types: [] });
    const messages = (file: string) => program.getSemanticDiagnostics(program.getSourceFile(file)).map((d) => ts.flattenDiagnosticMessageText(d.messageText, "\n"));
    for (const { b, bad, ok } of cases) {
      const quoted = /~+ (.+)$/m.exec(b.code)?.[1];
      expect(quoted, "the block quotes the compiler's message under ~~~").toBeDefined();
      expect(messages(bad).join("\n"), `block at README line ${b.line}`).toContain(quoted!);
      expect(messages(ok), `block at README line ${b.line}, with the directive`).toEqual([]);
    }
  }, 240_000);

  const cliBlocks = all.filter((b) => b.lang === "");
  it("runs every command line of the CLI section and prints the output lines shown under it", () => {
    const lines = cliBlocks.flatMap((b) => b.code.split("\n"));
    const commands: { argv: string[]; shown: string[] }[] = [];
    for (const l of lines) {
      if (l.startsWith("$ ")) {
        const words = shellWords(l.slice(2));
        expect(words.slice(0, 2), l).toEqual(["npx", "emquant"]);
        commands.push({ argv: words.slice(2), shown: [] });
      } else if (l.trim() !== "") {
        expect(commands.length, `output line before any command: ${l}`).toBeGreaterThan(0);
        commands.at(-1)!.shown.push(l);
      }
    }
    expect(commands.length).toBeGreaterThan(3);
    for (const c of commands) {
      let text = "";
      const status = runCli(c.argv, { out: (t) => (text += `${t}\n`), err: (t) => (text += `${t}\n`) });
      expect(status, `emquant ${c.argv.join(" ")}\n${text}`).toBe(0);
      // The shown lines appear in this order; "..." in a shown line stands for any text.
      const printed = text.split("\n");
      let at = 0;
      for (const s of c.shown) {
        const pattern = new RegExp(`^${s.split("...").map((p) => p.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")).join(".*")}$`);
        const found = printed.findIndex((p, k) => k >= at && pattern.test(p));
        expect(found, `emquant ${c.argv.join(" ")}: shown line not printed:\n${s}\nprinted:\n${text}`).toBeGreaterThanOrEqual(0);
        at = found + 1;
      }
    }
  });
});
