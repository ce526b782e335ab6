/**
 * `loadwright rulesets`: every shipped ruleset with its verification status,
 * how many of its combinations a public source confirms, what is from memory,
 * and its fingerprint. With --verification: per combination, the sources.
 */
import { shippedRulesets, type ShippedRuleset } from "../../core/index.js";
import { chooseFormat, isMachineFormat } from "../output/format.js";
import { CAUTIONS, preambleLines, statusWord } from "../output/preamble.js";
import { rowWriter } from "../output/rowWriter.js";
import type { Io } from "./common.js";
import { confirmedText, fromMemoryEntries, listingJson } from "./rulesetSummary.js";
import { verificationReport } from "./verificationReport.js";

export interface RulesetsOptions {
  format?: string;
  verification?: boolean;
}

export async function rulesetsCommand(options: RulesetsOptions, io: Io): Promise<void> {
  const format = chooseFormat(options.format, io.stdoutIsTerminal);
  const shipped = shippedRulesets();
  if (options.verification) {
    await verificationReport(shipped, format, io);
    return;
  }
  const cautionTarget = isMachineFormat(format) ? io.err : io.out;
  for (const line of preambleLines(null, null, format)) cautionTarget.line(line);
  await io.err.flush();
  if (format === "json") {
    io.out.line(JSON.stringify({ rulesets: shipped.map(listingJson), cautions: CAUTIONS }, null, 2));
    await io.out.flush();
    return;
  }
  if (shipped.length === 0) {
    (format === "csv" ? io.err : io.out).line(`${format === "csv" ? "loadwright: " : ""}No rulesets are shipped in this version; give a ruleset file with --ruleset FILE.`);
  }
  const columns = ["id", "version", "status", "standard", "title", "approval", "fingerprint", "combinations"];
  // CSV carries what is from memory in a column; the people's formats list it below the table.
  const writer = rowWriter(format, io.out, (format === "csv" ? [...columns, "from memory"] : columns).map((title) => ({ title })));
  for (const s of shipped) {
    const { file } = s.ruleset;
    const cells = [file.id, file.version, statusWord(s.status), `${file.standard.name} ${file.standard.edition}`, file.title, s.status.approval, s.status.shortFingerprint, confirmedText(s)];
    await writer.row(format === "csv" ? [...cells, fromMemoryEntries(s).map((e) => e.covers).join(" | ")] : cells);
  }
  await writer.end();
  if (format !== "csv") writeFromMemory(shipped, format, io);
  await io.out.flush();
}

function writeFromMemory(shipped: ShippedRuleset[], format: "table" | "md", io: Io): void {
  const open = shipped.filter((s) => fromMemoryEntries(s).length > 0);
  if (open.length === 0) return;
  io.out.line("");
  io.out.line(format === "md" ? "**From memory** (verify against the standard before use; per combination: `loadwright rulesets --verification`):" : "From memory (verify against the standard before use; per combination: loadwright rulesets --verification):");
  if (format === "md") io.out.line("");
  for (const s of open) {
    for (const entry of fromMemoryEntries(s)) {
      io.out.line(format === "md" ? `- \`${s.id}\`: ${entry.covers}` : `- ${s.id}: ${entry.covers}`);
    }
  }
}
