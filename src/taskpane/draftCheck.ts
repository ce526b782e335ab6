/**
 * Validation of a draft as the user types: the engine's loadRuleset on the
 * draft's JSON text, plus what only the editor can see (a field written twice
 * in the text, an approval block edited by hand). Every problem keeps its JSON
 * path, so the form can show it beside its field, and its spot in the text.
 */
import { describePlace, describeProblem, formatPath, loadRuleset, problem, rulesetStatus, type Problem, type Ruleset, type RulesetStatus } from "../core/index.js";
import { isObject, parseJson } from "./dataPath.js";
import { duplicateKeys, locatePath, syntaxErrorSpot, type TextSpot } from "./jsonLocate.js";

export interface EditorProblem {
  path: (string | number)[];
  /** The path as written (`combinations[2].expression`); "" for the ruleset as a whole. */
  field: string;
  /** Everything but the path: `combination "2", character 14: unknown name …` (for beside the field). */
  local: string;
  /** Place and message in one line (for the list of all problems). */
  full: string;
  /** 1-based character inside an expression, where the problem is in one. */
  position: number | null;
  /** Where it is in the JSON text, if it can be found there. */
  spot: TextSpot | null;
}

export interface DraftCheck {
  /** The parsed JSON, or undefined when the text is not JSON. */
  data: unknown;
  ruleset: Ruleset | null;
  status: RulesetStatus | null;
  problems: EditorProblem[];
}

export type ApprovalBlock = { approvedBy: string | null; date: string | null; fingerprint: string | null; note?: string };

export const EMPTY_APPROVAL: ApprovalBlock = { approvedBy: null, date: null, fingerprint: null };

export function checkDraft(text: string, baseApproval: ApprovalBlock): DraftCheck {
  // Text that is not JSON: loadRuleset says where the syntax is broken.
  const parsed = parseJson(text);
  const data = parsed.ok ? parsed.value : undefined;
  const loaded = loadRuleset(text);
  const problems: EditorProblem[] = [];
  if (data === undefined) {
    const spot = syntaxErrorSpot(text);
    for (const p of loaded.ok ? [] : loaded.problems) problems.push(editorProblem(p, text, spot));
    return { data, ruleset: null, status: null, problems };
  }
  for (const d of duplicateKeys(text)) {
    problems.push(
      editorProblem(
        problem("ruleset-duplicate", `the field "${d.key}" is written twice in this object; a JSON reader keeps only the last one, so remove one of them`, { path: d.path }),
        text,
        d.spot,
      ),
    );
  }
  const approval = isObject(data) ? data.approval : undefined;
  if (approval !== undefined && !sameApproval(approval, baseApproval) && !sameApproval(approval, EMPTY_APPROVAL)) {
    problems.push(
      editorProblem(
        problem(
          "ruleset-field",
          "the approval block is written only by Approve (from the name, the date and this content's fingerprint); set it back as it was, or clear it (all three null)",
          { path: ["approval"] },
        ),
        text,
      ),
    );
  }
  if (!loaded.ok) for (const p of loaded.problems) problems.push(editorProblem(p, text));
  const ruleset = loaded.ok && problems.length === 0 ? loaded.value : null;
  return { data, ruleset, status: ruleset ? rulesetStatus(ruleset) : null, problems };
}

function editorProblem(p: Problem, text: string, spot?: TextSpot | null): EditorProblem {
  const path = p.place.path ?? [];
  const { path: _path, ...rest } = p.place;
  const where = describePlace(rest);
  return {
    path,
    field: formatPath(path),
    local: where === "" ? p.message : `${where}: ${p.message}`,
    full: describeProblem(p),
    position: p.place.position ?? null,
    spot: spot !== undefined ? spot : locatePath(text, path, p.place.position),
  };
}

function sameApproval(value: unknown, block: ApprovalBlock): boolean {
  if (value === null || typeof value !== "object") return false;
  const v = value as Record<string, unknown>;
  const keys = new Set([...Object.keys(v), ...Object.keys(block)]);
  for (const k of keys) if ((v[k] ?? null) !== ((block as Record<string, unknown>)[k] ?? null)) return false;
  return true;
}
