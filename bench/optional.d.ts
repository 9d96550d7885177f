/** Benchmark modules that other contributors add (resolved at build time by scripts/bench.mjs). */
declare module "bench-optional" {
  const modules: readonly { readonly name: string; readonly module: { run(): Promise<{ name: string; value: string; note: string }[]> } }[];
  export default modules;
}
