/**
 * `loadwright rulesets --verification`: per shipped ruleset and per combination,
 * the public sources that confirm it and what is left open from memory, with
 * every source's locator. In Markdown it is docs/verification.md, word for word.
 */
import { verificationOf, type NumberedSource, type ShippedRuleset } from "../../core/index.js";
import { isMachineFormat, type Format } from "../output/format.js";
import { CAUTIONS, preambleLines, statusWord } from "../output/preamble.js";
import { rowWriter } from "../output/rowWriter.js";
import type { Io } from "./common.js";
import { confirmedText, listingJson } from "./rulesetSummary.js";

const TITLE = "Verification of the shipped rulesets";

/** How a checker uses the report; the opening of docs/verification.md. */
const INTRO = [
  "For every shipped ruleset and every combination in it, this page names the public sources that",
  "confirm its factors and says what rests on memory. It is the output of",
  "`loadwright rulesets --verification --format md`, so it always matches the rulesets it describes.",
  "",
  "How a checker uses it:",
  "",
  "1. Find the ruleset and the combination your calculation uses: the combination id opens every row",
  "   label (`2: 1.2D + 1.6L`), and `loadwright combos --ruleset ID` lists the factors to compare.",
  "2. For each source marked confirmed, open its address, find the clause it names and compare the",
  "   printed combination with the ruleset's expression. The source says which edition it prints:",
  "   a text of another edition confirms that edition only.",
  "3. Whatever is listed as left open from memory has no public source: read it in the standard",
  "   itself before relying on it, and record that check when the firm approves the ruleset.",
  "",
  "A combination counts as confirmed only when a source confirms it and no part of it is from",
  "memory; a ruleset is **checked** only when nothing in it is from memory.",
];

export async function verificationReport(shipped: ShippedRuleset[], format: Format, io: Io): Promise<void> {
  if (format === "json") {
    for (const line of preambleLines(null, null, format)) io.err.line(line);
    await io.err.flush();
    io.out.line(JSON.stringify({ rulesets: shipped.map(verificationJson), cautions: CAUTIONS }, null, 2));
    await io.out.flush();
    return;
  }
  if (format === "md") {
    io.out.line(`# ${TITLE}`);
    io.out.line("");
    for (const line of INTRO) io.out.line(line);
    io.out.line("");
  }
  const cautionTarget = isMachineFormat(format) ? io.err : io.out;
  for (const line of preambleLines(null, null, format)) cautionTarget.line(line);
  await io.err.flush();
  if (format === "csv") await csvReport(shipped, io);
  else for (const s of shipped) await rulesetSection(s, format, io);
  await io.out.flush();
}

/** [1], [3]: sources by their place in the ruleset's provenance list. */
function refs(sources: NumberedSource[]): string {
  return sources.map((s) => `[${s.index + 1}]`).join(", ");
}

function headline(s: ShippedRuleset, md: boolean): string {
  const word = md ? `**${statusWord(s.status)}**` : statusWord(s.status);
  return `${word}: ${confirmedText(s)} by a public source; fingerprint ${s.status.shortFingerprint}${md ? "." : ""}`;
}

async function rulesetSection(s: ShippedRuleset, format: "table" | "md", io: Io): Promise<void> {
  const { file } = s.ruleset;
  const v = verificationOf(s.ruleset);
  const md = format === "md";
  io.out.line(md ? `## \`${file.id}\`: ${file.title}` : `${file.id}: ${file.title}`);
  io.out.line("");
  io.out.line(headline(s, md));
  io.out.line("");
  const writer = rowWriter(format, io.out, [{ title: "combination" }, { title: "clause" }, { title: "confirmed by" }, { title: "left open from memory" }]);
  for (const c of v.combinations) await writer.row([c.id, c.clause, refs(c.confirmedBy) || "none", refs(c.openBy) || "—"]);
  await writer.end();
  io.out.line("");
  io.out.line("Sources:");
  if (md) io.out.line("");
  for (const { index, entry } of [...v.sources, ...v.fromMemory].sort((a, b) => a.index - b.index)) {
    const named = entry.combinations && entry.combinations.length > 0 ? ` Combinations: ${entry.combinations.join(", ")}.` : "";
    if (entry.status === "confirmed") {
      const where = entry.locator ?? "no locator given";
      // The schema keeps spaces, quotes and angle brackets out of an address, so it stands as a Markdown autolink.
      const follow = [entry.address ? `Address: ${md ? `<${entry.address}>` : entry.address}.` : "", entry.document ? `Document: ${md ? mdText(entry.document) : entry.document}.` : ""].filter(Boolean).join(" ");
      io.out.line(md ? `- [${index + 1}] **${mdText(entry.source)}** (confirmed): ${mdText(where)}.${follow ? ` ${follow}` : ""} Vouches for: ${mdText(entry.covers)}.${named}` : `  [${index + 1}] confirmed: ${entry.source} — ${where}`);
      if (!md && follow) io.out.line(`      ${follow}`);
      if (!md) io.out.line(`      vouches for: ${entry.covers}.${named}`);
    } else {
      const note = entry.note ? ` (${entry.note})` : "";
      io.out.line(md ? `- [${index + 1}] **${mdText(entry.source)}** (from memory): leaves open ${mdText(entry.covers)}.${named}${mdText(note)}` : `  [${index + 1}] FROM MEMORY: ${entry.source}${note}`);
      if (!md) io.out.line(`      leaves open: ${entry.covers}.${named}`);
    }
  }
  io.out.line("");
}

/** Markdown text outside tables: only the characters that would start markup inside a line. */
function mdText(text: string): string {
  return text.replace(/\\/g, "\\\\").replace(/([*_`[\]<>])/g, "\\$1");
}

async function csvReport(shipped: ShippedRuleset[], io: Io): Promise<void> {
  const writer = rowWriter("csv", io.out, ["ruleset", "status", "combination", "clause", "confirmed", "confirmed by", "left open from memory"].map((title) => ({ title })));
  for (const s of shipped) {
    for (const c of verificationOf(s.ruleset).combinations) {
      await writer.row([
        s.id,
        statusWord(s.status),
        c.id,
        c.clause,
        c.confirmed ? "yes" : "no",
        c.confirmedBy.map((x) => `${x.entry.source} — ${x.entry.locator ?? "no locator given"}`).join(" | "),
        c.openBy.map((x) => x.entry.covers).join(" | "),
      ]);
    }
  }
  await writer.end();
}

function verificationJson(s: ShippedRuleset) {
  const v = verificationOf(s.ruleset);
  return {
    ...listingJson(s),
    provenance: s.ruleset.file.provenance.map((p, i) => ({
      ref: i + 1,
      status: p.status,
      source: p.source,
      ...(p.locator ? { locator: p.locator } : {}),
      ...(p.address ? { address: p.address } : {}),
      ...(p.document ? { document: p.document } : {}),
      covers: p.covers,
      combinations: p.combinations ?? [],
      ...(p.note ? { note: p.note } : {}),
    })),
    verification: v.combinations.map((c) => ({
      combination: c.id,
      clause: c.clause,
      confirmed: c.confirmed,
      confirmedBy: c.confirmedBy.map((x) => x.index + 1),
      openBy: c.openBy.map((x) => x.index + 1),
    })),
  };
}

