/** The command line's version: the package's. */
import { createRequire } from "node:module";

const require = createRequire(import.meta.url);

function packageVersion(): string {
  for (const path of ["../../package.json", "../../../../package.json"]) {
    try {
      return (require(path) as { version: string }).version;
    } catch {
      // next candidate: the source tree, or the compiled tree under build/cli
    }
  }
  return "unknown";
}

export const VERSION = packageVersion();
