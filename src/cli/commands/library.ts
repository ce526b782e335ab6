/**
 * `loadwright library FILE`: checks a firm library the way `audit --library`
 * loads it, and lists what it holds — each ruleset's versions, who approved
 * them and when, which is current — so that a firm can check the file before
 * it publishes it.
 */
import { rulesetStatus } from "../../core/index.js";
import { libraryFromFile } from "../input/libraryOption.js";
import { chooseFormat, isMachineFormat } from "../output/format.js";
import { CAUTIONS, statusWord } from "../output/preamble.js";
import { rowWriter } from "../output/rowWriter.js";
import type { Io } from "./common.js";

export async function libraryCommand(file: string, options: { format?: string }, io: Io): Promise<void> {
  const format = chooseFormat(options.format, io.stdoutIsTerminal);
  const { library } = libraryFromFile(file);
  const rows = library.entries.map((e) => ({ entry: e, status: rulesetStatus(e.ruleset) }));
  const current = rows.filter((r) => r.entry.current).length;
  const lines = [
    `Library: ${file}, "${library.title}", ${library.owner}, dated ${library.date}: loads; ${current} current ruleset${current === 1 ? "" : "s"}${rows.length > current ? ` and ${rows.length - current} superseded` : ""}`,
    ...library.notes.map((n) => `Note: ${n}`),
  ];
  const unverified = rows.filter((r) => r.entry.current && r.status.verification === "unverified").map((r) => r.entry.ruleset.file.id);
  if (unverified.length > 0) {
    lines.unshift(
      `*** UNVERIFIED RULESETS IN THIS LIBRARY: ${unverified.join(", ")}: approved, but their factors are from memory and have not been checked against the standard ***`,
      ...rows.filter((r) => r.entry.current && r.status.verification === "unverified").map((r) => `Unverified: ${r.entry.ruleset.file.id} ${r.entry.ruleset.file.version}, from memory: ${r.status.fromMemory.join("; ")}`),
    );
  }
  const cautions = CAUTIONS.map((c) => `Caution: ${c}`);
  const target = isMachineFormat(format) ? io.err : io.out;
  if (format === "md") for (const l of [...lines, ...cautions]) target.line(`> ${l}  `);
  else for (const l of [...lines, ...cautions]) target.line(isMachineFormat(format) ? `loadwright: ${l}` : l);
  if (!isMachineFormat(format)) target.line("");
  await io.err.flush();

  if (format === "json") {
    io.out.line(
      JSON.stringify(
        {
          library: { file, title: library.title, owner: library.owner, date: library.date, notes: library.notes },
          rulesets: rows.map(({ entry, status }) => ({
            id: entry.ruleset.file.id,
            version: entry.ruleset.file.version,
            title: entry.ruleset.file.title,
            fingerprint: entry.fingerprint,
            status: status.verification,
            approvedBy: entry.approvedBy,
            date: entry.date,
            current: entry.current,
          })),
          cautions: CAUTIONS,
        },
        null,
        2,
      ),
    );
    await io.out.flush();
    return;
  }
  const writer = rowWriter(format, io.out, [{ title: "id" }, { title: "version" }, { title: "standing in library" }, { title: "approved by" }, { title: "date" }, { title: "verification" }, { title: "fingerprint" }]);
  for (const { entry, status } of rows) {
    await writer.row([entry.ruleset.file.id, entry.ruleset.file.version, entry.current ? "current" : "superseded", entry.approvedBy, entry.date, statusWord(status), isMachineFormat(format) ? entry.fingerprint : status.shortFingerprint]);
  }
  await writer.end();
}
