/** The one-cell arguments of LW.EXPLAIN: which row (label or number) and which component. */
import { cellText, isBlank, problem, type ProblemKind, type Result } from "../core/index.js";
import { asScalar } from "./excelCells.js";

const refuse = (kind: ProblemKind, message: string): Result<never> => ({ ok: false, problems: [problem(kind, message)] });

const oneCell = (kind: ProblemKind, what: string, cells: number): Result<never> => refuse(kind, `${what} is one cell; this argument has ${cells}`);

/** A row label as LW.FACTORED or LW.ENVELOPE shows it, or its 1-based number in LW.FACTORED's listing. */
export function readRowArgument(raw: unknown): Result<string | number> {
  const read = asScalar(raw);
  if ("cells" in read) return oneCell("unknown-row", "the row", read.cells);
  const v = read.value;
  if (typeof v === "number") return { ok: true, value: v };
  if (typeof v === "boolean" || isBlank(v)) {
    return refuse("unknown-row", `the row is ${isBlank(v) ? "empty" : String(v).toUpperCase()}; give a row label as LW.FACTORED or LW.ENVELOPE shows it, or its number in LW.FACTORED's listing`);
  }
  const text = cellText(v);
  return { ok: true, value: /^\d+$/.test(text) ? Number(text) : text };
}

/** A component of the case table: a column header (cases as rows) or a result row's id (cases as columns). */
export function readComponentArgument(raw: unknown): Result<string> {
  const read = asScalar(raw);
  if ("cells" in read) return oneCell("unknown-component", "the component", read.cells);
  const v = read.value;
  if (typeof v === "boolean" || isBlank(v)) {
    return refuse("unknown-component", `the component is ${isBlank(v) ? "empty" : String(v).toUpperCase()}; give a component header of the case table (or a result row's id)`);
  }
  return { ok: true, value: cellText(v) };
}
