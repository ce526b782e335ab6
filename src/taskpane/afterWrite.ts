/**
 * What the store's hook did after a write (inside Excel: recalculated the
 * workbook), said after the sentence that reports the write.
 */
import type { WriteResult } from "../workbook/rulesetStore.js";

export function withAfterWrite(text: string, result: WriteResult<unknown>): string {
  return result.afterWrite ? `${text} ${result.afterWrite}` : text;
}
