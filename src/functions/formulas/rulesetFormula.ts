/**
 * LW.RULESET: the identity of the ruleset in use, for stamping a calculation —
 * id, title, standard and edition, version, fingerprint, where it comes from,
 * whether its factors were checked and whether a firm approved this content.
 */
import { VERIFICATION_TEXT, formatNumber, type Parameter } from "../../core/index.js";
import { CAUTION_LINE } from "../../addin/cautions.js";
import { given, type Formula, type OutputCell } from "../formula.js";
import { outputTable } from "../outputTable.js";
import { approvalText, sourceText } from "../stamp.js";

export const RULESET: Formula = {
  name: "LW.RULESET",
  parameters: [{ name: "ruleset", kind: "ruleset" }],
  evaluate(args) {
    const r = given(args.ruleset, "ruleset");
    const f = r.ruleset.file;
    const s = r.status;
    const rows: OutputCell[][] = [
      ["verification", VERIFICATION_TEXT[s.verification]],
      ["approval", approvalText(r)],
      ["id", r.source === "cells" ? "(typed in cells)" : f.id],
      ["title", f.title],
      ["standard", `${f.standard.name} ${f.standard.edition}${f.standard.clauses ? `, ${f.standard.clauses}` : ""}`],
      ["basis", f.basis ?? ""],
      ["version", f.version],
      ["fingerprint", s.fingerprint],
      ["source", sourceText(r)],
      ["combinations", r.ruleset.combinations.length],
      ["parameters", r.ruleset.parameters.map(parameterText).join("; ") || "none"],
      ["from memory", s.fromMemory.join("; ") || "none"],
      ["caution", CAUTION_LINE],
    ];
    return outputTable(r, ["field", "value"], rows);
  },
};

function parameterText(p: Parameter): string {
  if (p.kind === "choice") return `${p.name} (choice, default ${p.default})`;
  return p.default === undefined ? `${p.name} (no default: must be given)` : `${p.name} (default ${formatNumber(p.default)})`;
}
