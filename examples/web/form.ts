// A form generated from a formula's catalog entry (its input specs): one field
// per input, prefilled with the example (formatted with its unit) or left
// empty for the default; choices become selects.
import { formatQuantity, type CatalogEntry, type CatalogInput } from "emquant";

/** The text a field starts with: the example in readable units, or empty (default applies). */
export function exampleText(i: CatalogInput): string {
  const ex = i.example;
  if (ex === undefined) return "";
  if (typeof ex === "string") return ex;
  if (Array.isArray(ex)) return `[${ex.join(", ")}]${i.unit ? ` ${i.unit}` : ""}`;
  return formatQuantity(ex as number, i.unit ?? "");
}

function hint(i: CatalogInput): string {
  const parts: string[] = [];
  if (i.kind === "quantity") parts.push(`${i.dimension}${i.unit ? ` [${i.unit}]` : ""}${i.vector ? ", 3-vector: [x, y, z] unit" : ""}`);
  if (i.domain) parts.push(i.domain.rule);
  if (i.default !== undefined) parts.push(`default ${typeof i.default === "number" ? formatQuantity(i.default, i.unit ?? "") : i.default}`);
  else parts.push("required");
  return parts.join("; ");
}

/** Fill `form` with the fields of `entry`, plus a Compute button. */
export function buildForm(form: HTMLFormElement, entry: CatalogEntry): void {
  form.replaceChildren();
  for (const i of entry.inputs) {
    const box = document.createElement("div");
    box.className = "field";
    const id = `in-${i.name}`;
    const label = document.createElement("label");
    label.htmlFor = id;
    label.textContent = i.name;
    const desc = document.createElement("small");
    desc.textContent = `${i.description} (${hint(i)})`;
    let control: HTMLInputElement | HTMLSelectElement;
    if (i.kind === "choice") {
      const select = document.createElement("select");
      if (!i.required) select.append(new Option(`(default: ${String(i.default)})`, ""));
      for (const c of i.choices ?? []) select.append(new Option(c, c));
      select.value = typeof i.example === "string" ? i.example : "";
      control = select;
    } else {
      const input = document.createElement("input");
      input.value = exampleText(i);
      input.placeholder = i.default !== undefined ? `default ${typeof i.default === "number" ? formatQuantity(i.default, i.unit ?? "") : i.default}` : i.unit ? `e.g. 1 ${i.unit}` : "a number";
      input.autocomplete = "off";
      input.spellcheck = false;
      control = input;
    }
    control.id = id;
    control.name = i.name;
    box.append(label, control, desc);
    form.append(box);
  }
  const button = document.createElement("button");
  button.type = "submit";
  button.id = "compute";
  button.textContent = "Compute";
  form.append(button);
}

/** "[1000, 0, 0] V/m" -> ["1000 V/m", "0 V/m", "0 V/m"]; "1, 2, 3" -> ["1", "2", "3"]. */
export function vectorValue(text: string): string[] {
  const m = /^\s*\[([^\]]*)\]\s*(.*)$/.exec(text);
  const body = m ? m[1]! : text;
  const unit = m ? m[2]!.trim() : "";
  return body.split(",").map((s) => `${s.trim()}${unit ? ` ${unit}` : ""}`);
}

/** The inputs as typed: unit strings, choice words, 3-arrays; empty fields left out (defaults apply). */
export function formValues(form: HTMLFormElement, entry: CatalogEntry, skip?: string): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const i of entry.inputs) {
    if (i.name === skip) continue;
    const control = form.elements.namedItem(i.name) as HTMLInputElement | HTMLSelectElement | null;
    const text = control?.value.trim() ?? "";
    if (text === "") continue;
    out[i.name] = i.kind === "quantity" && i.vector ? vectorValue(text) : text;
  }
  return out;
}

/** Mark the field of the input an error names (and clear the others). */
export function markInvalid(form: HTMLFormElement, name: string | undefined): void {
  for (const c of Array.from(form.querySelectorAll("input, select"))) c.removeAttribute("aria-invalid");
  if (name === undefined) return;
  const control = form.elements.namedItem(name);
  if (control instanceof HTMLElement) control.setAttribute("aria-invalid", "true");
}
