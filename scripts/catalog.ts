// Rewrites the catalog section of README.md from the registry.
import { readFileSync, writeFileSync } from "node:fs";
import { catalogMarkdown, END, START } from "./catalog-markdown.js";

const path = new URL("../README.md", import.meta.url);
const readme = readFileSync(path, "utf8");
const a = readme.indexOf(START);
const b = readme.indexOf(END);
if (a < 0 || b < a) throw new Error("README.md lacks the catalog markers");
writeFileSync(path, readme.slice(0, a) + catalogMarkdown() + readme.slice(b + END.length));
console.log("README.md catalog updated");
