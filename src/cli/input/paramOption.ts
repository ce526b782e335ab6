/** `--param K=V` (repeatable; one option may also hold "K=V; K2=V2"). */
import { parseParameterText, type ParameterInput } from "../../core/index.js";
import { cliErrorOf } from "../cliError.js";

export function parameterInput(options: string[]): ParameterInput {
  const out: ParameterInput = {};
  const lines: string[] = [];
  for (const text of options) {
    const parsed = parseParameterText(text);
    if (!parsed.ok) {
      for (const p of parsed.problems) lines.push(`--param "${text}"${p.place.position !== undefined ? `, character ${p.place.position}` : ""}: ${p.message}`);
      continue;
    }
    for (const [name, value] of Object.entries(parsed.value)) {
      if (name in out) lines.push(`--param "${text}": ${name} is given twice`);
      else out[name] = value;
    }
  }
  if (lines.length > 0) throw cliErrorOf(lines);
  return out;
}
