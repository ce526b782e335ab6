/**
 * What the store's hook did after a write (inside Excel: recalculated the
 * workbook), said after the sentence that reports the write; and after a write
 * that failed, whether anything stored changed — the store's own words say
 * which whole content is held now, and the pane must not say otherwise.
 */
import type { WriteResult } from "../workbook/rulesetStore.js";

export function withAfterWrite(text: string, result: WriteResult<unknown>): string {
  return result.afterWrite ? `${text} ${result.afterWrite}` : text;
}

/** "; nothing stored changed" after a failed write that left what was stored; nothing where the new content is held unsaved. */
export function unchangedAfterFailure(result: WriteResult<unknown>, words = "; nothing stored changed"): string {
  return result.held === "new-unsaved" ? "" : words;
}
