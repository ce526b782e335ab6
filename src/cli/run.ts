/**
 * Runs the command line and turns every failure into one located line on
 * standard error and a non-zero exit status — never a stack trace.
 */
import { CommanderError } from "commander";
import { CliError, EXIT } from "./cliError.js";
import { standardIo, type Io } from "./commands/common.js";
import { buildProgram } from "./program.js";

export async function run(argv: string[], io: Io = standardIo()): Promise<number> {
  const program = buildProgram(io);
  let status: number = EXIT.ok;
  try {
    await program.parseAsync(argv, { from: "user" });
  } catch (e) {
    status = failure(e, io);
  }
  await io.out.flush();
  await io.err.flush();
  return status;
}

function failure(e: unknown, io: Io): number {
  if (e instanceof CliError) {
    io.err.line(`loadwright: error: ${e.message}`);
    for (const line of e.more) io.err.line(`loadwright: error: ${line}`);
    return e.exitCode;
  }
  if (e instanceof CommanderError) {
    // Commander has printed its own one-line message; help and version are successes.
    if (e.code === "commander.helpDisplayed" || e.code === "commander.version" || e.code === "commander.help") return EXIT.ok;
    return EXIT.usage;
  }
  const message = e instanceof Error ? e.message : String(e);
  io.err.line(`loadwright: internal error: ${message.split("\n")[0]} (this is a defect in Loadwright; please report it with the command you ran)`);
  return EXIT.internal;
}
