/**
 * The sheet the pane works on, handed over once by the add-in's entry before
 * the pane starts: Excel's workbook inside Excel, the invented demo table in
 * a plain browser. Only the Sheet view reads it; without one it says so.
 */
import type { SheetHost } from "../sheet/sheetHost.js";

let connected: SheetHost | null = null;

export function connectSheet(host: SheetHost): void {
  connected = host;
}

export function connectedSheet(): SheetHost | null {
  return connected;
}
