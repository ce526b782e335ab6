/**
 * Excel accepts about 5 MB from one custom function call; a larger result sticks
 * at #BUSY! or fails without a word. The size is estimated before the result is
 * built, and a result that would be too large is refused with its size and what
 * to use instead.
 */
import { problem, type Problem } from "../core/index.js";

export const MAX_PAYLOAD_BYTES = 5_000_000;

/** A number as JSON text, at most ("-1234.5678901234567,"). */
const NUMBER_BYTES = 24;

export interface PayloadShape {
  rows: number;
  /** Cells of numbers per row. */
  numberColumns: number;
  /** Bytes of text per row (labels, clauses), estimated. */
  textBytesPerRow: number;
}

export function payloadBytes(shape: PayloadShape): number {
  return shape.rows * (shape.numberColumns * NUMBER_BYTES + shape.textBytesPerRow + 4);
}

export function payloadProblem(formula: string, shape: PayloadShape): Problem | null {
  const bytes = payloadBytes(shape);
  if (bytes <= MAX_PAYLOAD_BYTES) return null;
  const mb = (bytes / 1_000_000).toFixed(1);
  const columns = shape.numberColumns + (shape.textBytesPerRow > 0 ? 1 : 0);
  return problem(
    "too-many-rows",
    `${formula} would return about ${mb} MB (${shape.rows.toLocaleString("en-US")} rows × ${columns.toLocaleString("en-US")} columns), ` +
      `more than the about 5 MB Excel accepts from one formula; ${smallerWay(formula)}`,
  );
}

/** What to do instead, naming only formulas other than the one refused. */
function smallerWay(formula: string): string {
  const others = ["LW.ENVELOPE", "LW.GOVERNING"].filter((f) => f !== formula);
  const extremes = others.length > 0 ? `use ${others.join(" or ")}, which ${others.length === 1 ? "finds" : "find"} the extremes exactly without listing every row, or ` : "";
  return `${extremes}give a smaller case table (fewer result rows), or use the Loadwright command line, which streams whole exports`;
}
