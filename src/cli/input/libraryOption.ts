/**
 * `--library FILE`: a firm library (loadwright-library/1), loaded whole before
 * anything in it is used; each problem is located by line and column as well
 * as by JSON path, ruleset and combination, as a ruleset file's are.
 */
import { loadFirmLibrary, type FirmLibrary } from "../../core/index.js";
import { cliErrorOf } from "../cliError.js";
import { readText } from "./fileAccess.js";
import { describeRulesetProblem } from "./rulesetOption.js";

export interface ChosenLibrary {
  library: FirmLibrary;
  file: string;
}

export function libraryFromFile(file: string): ChosenLibrary {
  const text = readText(file, "library file");
  const loaded = loadFirmLibrary(text);
  if (!loaded.ok) throw cliErrorOf(loaded.problems.map((p) => describeRulesetProblem(file, text, p)));
  return { library: loaded.value, file };
}
