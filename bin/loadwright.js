#!/usr/bin/env node
// The package's `loadwright` command. It runs the compiled command line in
// build/cli, which `npm ci` / `npm install` build through the "prepare" script
// (or `npm run build:cli` by hand).
import { existsSync } from "node:fs";

const entry = new URL("../build/cli/src/cli/main.js", import.meta.url);
if (!existsSync(entry)) {
  process.stderr.write("loadwright: error: the command line is not built; run `npm run build:cli` (npm ci and npm install do it)\n");
  process.exit(70);
}
await import(entry.href);
