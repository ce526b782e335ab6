/**
 * The params argument: a range of [name, value] rows, or text "SDS=1.2; rho=1.3"
 * in one cell (or one such text per cell of a single column). Records where each
 * parameter was written, so that a value out of range later names its cell.
 */
import { cellText, isBlank, parameterPairs, parseParameterText, problem, type Cell, type ParameterInput, type Problem, type Result } from "../core/index.js";
import { asMatrix, blankZeroRows, isEmptyArgument } from "./excelCells.js";
import type { GivenParameters } from "./formula.js";

export const NO_PARAMETERS: GivenParameters = { input: {}, where: new Map() };

export function readParamsArgument(raw: unknown): Result<GivenParameters> {
  const m = asMatrix(raw);
  if (m === null || isEmptyArgument(m)) return { ok: true, value: NO_PARAMETERS };
  const width = m.reduce((w, r) => Math.max(w, r.length), 0);
  return width >= 2 ? pairs(blankZeroRows(m)) : texts(m);
}

function pairs(rows: Cell[][]): Result<GivenParameters> {
  const read = parameterPairs(rows);
  if (!read.ok) return read;
  const where = new Map<string, { row: number; column: number }>();
  rows.forEach((row, r) => {
    const name = cellText(row[0]);
    if (name in read.value && !where.has(name)) where.set(name, { row: r, column: 1 });
  });
  return { ok: true, value: { input: read.value, where } };
}

function texts(rows: Cell[][]): Result<GivenParameters> {
  const input: ParameterInput = {};
  const where = new Map<string, { row: number; column: number; position?: number }>();
  const problems: Problem[] = [];
  rows.forEach((row, r) => {
    const cell = row[0];
    if (isBlank(cell) || cell === 0) return;
    if (typeof cell !== "string") {
      problems.push(
        problem(
          "parameter-syntax",
          `${typeof cell === "boolean" ? String(cell).toUpperCase() : cell} is not name=value; give parameters as text "SDS=1.2; rho=1.3" or as a two-column range of names and values`,
          { row: r, column: 0 },
        ),
      );
      return;
    }
    const read = parseParameterText(cell);
    if (!read.ok) {
      problems.push(...read.problems.map((p) => ({ ...p, place: { ...p.place, row: r, column: 0 } })));
      return;
    }
    for (const [name, value] of Object.entries(read.value)) {
      if (name in input) {
        problems.push(problem("parameter-syntax", `${name} is given twice`, { row: r, column: 0, header: name, position: positionOf(cell, name) }));
        continue;
      }
      input[name] = value;
      where.set(name, { row: r, column: 0, position: positionOf(cell, name) });
    }
  });
  return problems.length > 0 ? { ok: false, problems } : { ok: true, value: { input, where } };
}

/** 1-based character position of "name =" in a parameter text. */
function positionOf(text: string, name: string): number {
  const escaped = name.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
  const m = new RegExp(`(^|[;\\n])\\s*(${escaped})\\s*=`, "u").exec(text);
  return m ? m.index + m[0].indexOf(m[2]) + 1 : 1;
}
