import { type CatalogEntry, inputShapeText, outputText } from "../tools/catalog.js";
import { formatQuantity } from "../units/display.js";

/**
 * What `help(formula)` shows in a notebook: title, equation, inputs in calling
 * order (dimension, SI unit, default or required, example), output and
 * sources. Built from the registry entry, so every formula has it.
 */
export class FormulaHelp {
  constructor(readonly entry: CatalogEntry) {}

  toString(): string {
    const e = this.entry;
    const lines = [`${e.title} (${e.id})`, `  ${e.equation}`, "", e.description, "", "Inputs, in calling order:"];
    for (const i of e.inputs) {
      const what = i.kind === "choice" ? `one of ${i.choices!.join(", ")}` : `${i.dimension}${i.unit ? ` [${i.unit}]` : ""}${inputShapeText(i)}`;
      const given = i.default !== undefined ? `default ${typeof i.default === "number" ? formatQuantity(i.default, i.unit ?? "") : i.default}` : "required";
      lines.push(`  ${i.name}: ${i.description} (${what}; ${given})`);
    }
    lines.push("", `Output: ${e.output.description} (${outputText(e.output)})`);
    if (e.relations.length) lines.push(`Relations: ${e.relations.join("; ")}`);
    lines.push("Source:", ...e.sources.map((s) => `  ${s.authors}${s.year ? ` (${s.year})` : ""}, ${s.title}${s.locator ? `, ${s.locator}` : ""}`));
    return lines.join("\n");
  }

  /** mathjs's format() and the notebook's printing call this. */
  format(): string {
    return this.toString();
  }
}

/** mathjs's documentation of one of its own functions (the `doc` of its Help object). */
export interface MathjsDoc {
  readonly name?: string;
  readonly description?: string;
  readonly syntax?: readonly string[];
  readonly examples?: readonly string[];
  readonly seealso?: readonly string[];
}

/**
 * help() of a mathjs built-in in the notebook. mathjs's own Help text runs the
 * examples through `evaluate` and `config`, which this instance disables, so
 * the examples are listed without their results.
 */
export class BuiltinHelp {
  constructor(readonly doc: MathjsDoc) {}

  toString(): string {
    const d = this.doc;
    const lines = [`Name: ${d.name ?? ""}`, "", d.description ?? ""];
    if (d.syntax?.length) lines.push("", "Syntax:", ...d.syntax.map((x) => `    ${x}`));
    if (d.examples?.length) lines.push("", "Examples:", ...d.examples.map((x) => `    ${x}`));
    if (d.seealso?.length) lines.push("", `See also: ${d.seealso.join(", ")}`);
    return lines.join("\n");
  }

  format(): string {
    return this.toString();
  }
}
