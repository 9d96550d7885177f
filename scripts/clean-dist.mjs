// Empties dist/ before a build, so no file from an older layout is packed.
import { rmSync } from "node:fs";

rmSync(new URL("../dist", import.meta.url), { recursive: true, force: true });
