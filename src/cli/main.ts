/** Entry point of the compiled command line (bin/loadwright.js imports it). */
import { run } from "./run.js";

process.exitCode = await run(process.argv.slice(2));
