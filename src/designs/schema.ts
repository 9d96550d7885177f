import { listFormulas } from "../core/registry.js";
import type { InputSpec } from "../core/spec.js";
import { DESIGN_LIMITS } from "./compile.js";
import { EXPRESSION_LIMITS } from "./expression.js";

// The JSON Schema (draft 2020-12) of a design file, generated from the
// registry so each step's bindings are checked against its formula's inputs.
// The schema checks shape; compileDesign checks names, cycles and dimensions.

const NAME = { type: "string", pattern: "^[A-Za-z][A-Za-z0-9]*$", maxLength: DESIGN_LIMITS.nameLength };
const TEXT = { type: "string", minLength: 1, maxLength: EXPRESSION_LIMITS.length };
const VALUE = { anyOf: [{ type: "number" }, TEXT] };

const TOLERANCE = {
  oneOf: [
    { type: "object", properties: { nominal: VALUE, plusMinus: VALUE }, required: ["nominal", "plusMinus"], additionalProperties: false },
    { type: "object", properties: { nominal: VALUE, percent: { type: "number", minimum: 0 } }, required: ["nominal", "percent"], additionalProperties: false },
    { type: "object", properties: { distribution: { const: "normal" }, mean: VALUE, sd: VALUE }, required: ["distribution", "mean", "sd"], additionalProperties: false },
    { type: "object", properties: { distribution: { const: "uniform" }, min: VALUE, max: VALUE }, required: ["distribution", "min", "max"], additionalProperties: false },
  ],
};

function binding(spec: InputSpec): Record<string, unknown> {
  if ("choices" in spec) return { type: "string", enum: [...spec.choices], description: spec.description };
  if (spec.vector) return { type: "array", items: VALUE, minItems: 3, maxItems: 3, description: spec.description };
  return { ...VALUE, description: `${spec.description} (${spec.dimension}): a number in SI, a unit string, a design name or an expression` };
}

/** JSON Schema of a design file (DesignSpec). */
export function designSchema(): Record<string, unknown> {
  const steps = listFormulas()
    // Formulas with component outputs or series inputs cannot be design steps (compileDesign refuses them).
    .filter((f) => !f.definition.output.components && !Object.values(f.definition.inputs as Readonly<Record<string, InputSpec>>).some((s) => !("choices" in s) && s.series))
    .map((f) => {
      const specs = f.definition.inputs as Readonly<Record<string, InputSpec>>;
      const properties: Record<string, unknown> = {};
      for (const [name, s] of Object.entries(specs)) properties[name] = binding(s);
      return {
        type: "object",
        properties: { formula: { const: f.id }, inputs: { type: "object", properties, additionalProperties: false } },
        required: ["formula"],
        additionalProperties: false,
      };
    });
  return {
    $schema: "https://json-schema.org/draft/2020-12/schema",
    $id: "emquant:design",
    title: "emquant design",
    type: "object",
    properties: {
      title: { type: "string", maxLength: 200 },
      inputs: { type: "object", propertyNames: NAME, maxProperties: DESIGN_LIMITS.inputs, additionalProperties: { anyOf: [VALUE, TOLERANCE] } },
      steps: { type: "object", propertyNames: NAME, maxProperties: DESIGN_LIMITS.steps, additionalProperties: { oneOf: steps } },
      derived: { type: "object", propertyNames: NAME, maxProperties: DESIGN_LIMITS.steps, additionalProperties: TEXT },
      checks: { type: "array", items: TEXT, maxItems: DESIGN_LIMITS.checks },
    },
    additionalProperties: false,
  };
}
