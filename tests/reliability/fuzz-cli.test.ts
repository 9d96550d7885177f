/**
 * Fuzz: the command line in process (runCli, as tests/cli does) with hostile
 * argv: every command, bad pairs, unknown and valueless options, hostile
 * counts and ranges. Exit 0 with clean output, or non-zero with a one-line
 * message and no stack trace; runCli never throws.
 */
import { describe, it } from "vitest";
import { driveSync, expectClean, newDrive } from "./fuzz-drive.js";
import { CASES } from "./fuzz-runners.js";

const cli = newDrive();

describe("fuzz: the command line", () => {
  it(`${CASES.cli} argument lists: clean output or a one-line error, never a throw or a stack trace`, () => {
    driveSync(cli, "cli", CASES.cli);
    expectClean(cli, CASES.cli);
  });
});

