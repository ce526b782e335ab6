/**
 * The criteria argument of LW.GOVERNING: text cells such as "max V", "min N",
 * "max |M|", "max N/2000 + M/350", in any shape; blank cells are skipped.
 * Omitted or blank: null, meaning the max and min of every component.
 */
import { cellText, isBlank, parseCriterion, problem, type CaseTable, type Criterion, type Problem, type Result } from "../core/index.js";
import { asMatrix, isEmptyArgument } from "./excelCells.js";

export function readCriteriaArgument(raw: unknown, table: CaseTable): Result<Criterion[] | null> {
  const m = asMatrix(raw);
  if (m === null || isEmptyArgument(m)) return { ok: true, value: null };
  const criteria: Criterion[] = [];
  const problems: Problem[] = [];
  m.forEach((row, r) =>
    row.forEach((cell, c) => {
      if (isBlank(cell) || cell === 0) return;
      if (typeof cell !== "string") {
        problems.push(
          problem("criterion-syntax", `${typeof cell === "boolean" ? String(cell).toUpperCase() : cellText(cell)} is not a criterion; write text such as "max V" or "min N"`, { row: r, column: c }),
        );
        return;
      }
      const parsed = parseCriterion(cell, table.components);
      if (parsed.ok) criteria.push(parsed.value);
      else problems.push(...parsed.problems.map((p) => ({ ...p, place: { ...p.place, row: r, column: c } })));
    }),
  );
  if (problems.length > 0) return { ok: false, problems };
  return { ok: true, value: criteria.length > 0 ? criteria : null };
}
