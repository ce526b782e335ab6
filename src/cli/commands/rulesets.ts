/** `loadwright rulesets`: every shipped ruleset with its verification status and fingerprint. */
import { shippedRulesets } from "../../core/index.js";
import { chooseFormat, isMachineFormat } from "../output/format.js";
import { CAUTIONS, preambleLines, rulesetJson, statusWord } from "../output/preamble.js";
import { rowWriter } from "../output/rowWriter.js";
import type { Io } from "./common.js";

export async function rulesetsCommand(options: { format?: string }, io: Io): Promise<void> {
  const format = chooseFormat(options.format, io.stdoutIsTerminal);
  const shipped = shippedRulesets().map((s) => ({ ruleset: s.ruleset, status: s.status, source: "shipped" }));
  const cautionTarget = isMachineFormat(format) ? io.err : io.out;
  const cautionLines = preambleLines(null, null, format);
  for (const line of cautionLines) cautionTarget.line(line);
  await io.err.flush();
  if (format === "json") {
    io.out.line(JSON.stringify({ rulesets: shipped.map(rulesetJson), cautions: CAUTIONS }, null, 2));
    await io.out.flush();
    return;
  }
  if (shipped.length === 0) {
    (format === "csv" ? io.err : io.out).line(`${format === "csv" ? "loadwright: " : ""}No rulesets are shipped in this version; give a ruleset file with --ruleset FILE.`);
  }
  const writer = rowWriter(format, io.out, [
    { title: "id" },
    { title: "version" },
    { title: "status" },
    { title: "standard" },
    { title: "title" },
    { title: "approval" },
    { title: "fingerprint" },
  ]);
  for (const s of shipped) {
    const { file } = s.ruleset;
    await writer.row([file.id, file.version, statusWord(s.status), `${file.standard.name} ${file.standard.edition}`, file.title, s.status.approval, s.status.shortFingerprint]);
  }
  await writer.end();
  await io.err.flush();
}
