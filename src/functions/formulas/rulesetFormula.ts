/**
 * LW.RULESET: the identity of the ruleset in use, for stamping a calculation —
 * id, title, standard and edition, version, fingerprint, where it comes from,
 * whether its factors were checked (and how many combinations a source
 * confirms, what is from memory) and whether a firm approved this content.
 */
import { cautionLine, coverageText, formatNumber, sourceText, statusText, type Parameter } from "../../core/index.js";
import { given, type Formula, type OutputCell } from "../formula.js";
import { outputTable } from "../outputTable.js";
import { originOf } from "../stamp.js";

export const RULESET: Formula = {
  name: "LW.RULESET",
  parameters: [{ name: "ruleset", kind: "ruleset" }],
  evaluate(args) {
    const r = given(args.ruleset, "ruleset");
    const f = r.ruleset.file;
    const s = r.status;
    const words = statusText(s, f.approval);
    const rows: OutputCell[][] = [
      ["verification", words.sentence],
      ["approval", words.approval.cell],
      ["id", r.source === "cells" ? "(typed in cells)" : f.id],
      ["title", f.title],
      ["standard", `${f.standard.name} ${f.standard.edition}${f.standard.clauses ? `, ${f.standard.clauses}` : ""}`],
      ["basis", f.basis ?? ""],
      ["version", f.version],
      ["fingerprint", s.fingerprint],
      ["source", sourceText(originOf(r), "cell")],
      ["combinations", r.ruleset.combinations.length],
      ["combinations confirmed", coverageText(s.combinations)],
      ["parameters", r.ruleset.parameters.map(parameterText).join("; ") || "none"],
      ["from memory", s.fromMemory.join("; ") || "none"],
      ["caution", cautionLine()],
    ];
    return outputTable(r, ["field", "value"], rows);
  },
};

function parameterText(p: Parameter): string {
  if (p.kind === "choice") return `${p.name} (choice, default ${p.default})`;
  return p.default === undefined ? `${p.name} (no default: must be given)` : `${p.name} (default ${formatNumber(p.default)})`;
}
