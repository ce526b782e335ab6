/**
 * An error the user can act on. Its message is one line that already names
 * where the problem is (file, line and column, ruleset entry, option); the
 * command line prints it without a stack trace and exits non-zero.
 */
import { countText } from "../core/index.js";

export class CliError extends Error {
  constructor(
    message: string,
    /** Further problems found at the same time, one line each. */
    readonly more: string[] = [],
    readonly exitCode: number = EXIT.badInput,
  ) {
    super(message);
  }
}

/** Exit statuses, documented in docs/command-line.md ("Errors and exit status"). */
export const EXIT = {
  ok: 0,
  /** A file, ruleset, parameter or criterion is wrong. */
  badInput: 1,
  /** The command line itself is wrong: unknown command or option, missing argument. */
  usage: 2,
  /** `audit --library`: a formula uses a ruleset that is not the library's current approved version. */
  notApproved: 3,
  /** A defect in Loadwright: please report it. */
  internal: 70,
} as const;

/** Problems beyond this many are counted, not listed. */
export const MAX_LISTED_PROBLEMS = 10;

/** One CliError from several located lines. */
export function cliErrorOf(lines: string[]): CliError {
  const listed = lines.slice(0, MAX_LISTED_PROBLEMS);
  const rest = lines.length - listed.length;
  const more = listed.slice(1);
  if (rest > 0) more.push(`… and ${countText(rest)} more problem${rest === 1 ? "" : "s"}`);
  return new CliError(listed[0] ?? "unknown problem", more);
}
