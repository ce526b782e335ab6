// Lint: the recommended TypeScript rules, no string evaluation anywhere, and the
// layer map held by import rules (docs/design.md, "Layers"):
//   src/core       the engine: imports nothing of the project's adapters, no Office, DOM or Node
//   src/workbook   the rulesets a workbook can name (store, library): imports the core only
//   src/functions  the formulas, src/taskpane the pane, src/cli the command line: each imports
//                  the core (and, in the add-in, the workbook module), never another adapter
//   src/sheet      sheets as cells (the reviewer's copy, the starter block, the sheet host): imports the core only
//   src/report     the checker's calculation report as HTML: imports the core only, no Node
//   src/addin      the add-in: only its entry, main.ts, wires the parts together
// Type-aware rules (recommendedTypeChecked, exhaustive switches) run on every source file.
import tseslint from "typescript-eslint";

const ADAPTERS = {
  functions: "**/functions/**",
  taskpane: "**/taskpane/**",
  cli: "**/cli/**",
  addin: "**/addin/**",
  workbook: "**/workbook/**",
  sheet: "**/sheet/**",
  report: "**/report/**",
};

/** A no-restricted-imports rule refusing the named folders, with why. */
function refuse(folders, message, extra = []) {
  return ["error", { patterns: [{ group: folders.map((f) => ADAPTERS[f]), message }, ...extra] }];
}

/** The code linted with type information: all of src. */
export const TYPED = ["src/**/*.ts"];

export default tseslint.config(
  { ignores: ["dist/**", "build/**", "node_modules/**", "coverage/**"] },
  ...tseslint.configs.recommended,
  {
    rules: {
      "no-eval": "error",
      "no-new-func": "error",
      "no-implied-eval": "error",
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
  {
    files: ["src/core/**/*.ts"],
    rules: {
      "no-restricted-imports": refuse(["functions", "taskpane", "cli", "addin", "workbook", "sheet", "report"], "src/core knows no adapter.", [
        { group: ["node:*", "fs", "path", "os", "child_process", "stream"], message: "src/core is pure: no Node APIs." },
        { group: ["office-*", "@microsoft/*"], message: "src/core knows no Office." },
      ]),
      "no-restricted-globals": ["error", "window", "document", "Office", "Excel", "CustomFunctions", "OfficeRuntime", "process"],
    },
  },
  {
    files: ["src/workbook/**/*.ts"],
    rules: { "no-restricted-imports": refuse(["functions", "taskpane", "cli", "addin", "sheet"], "src/workbook is shared by the adapters: it imports the core only.") },
  },
  {
    files: ["src/sheet/**/*.ts"],
    rules: { "no-restricted-imports": refuse(["functions", "taskpane", "cli", "addin", "workbook"], "src/sheet is shared by the pane, the command line and the add-in: it imports the core only.") },
  },
  {
    files: ["src/report/**/*.ts"],
    rules: {
      "no-restricted-imports": refuse(["functions", "taskpane", "cli", "addin", "workbook", "sheet"], "src/report is host-neutral: it imports the core only.", [
        { group: ["node:*", "fs", "path", "os", "child_process", "stream"], message: "src/report writes text only: no Node APIs." },
      ]),
    },
  },
  {
    files: ["src/functions/**/*.ts"],
    rules: { "no-restricted-imports": refuse(["taskpane", "cli", "addin", "sheet"], "src/functions imports the core and src/workbook, never another adapter.") },
  },
  {
    files: ["src/taskpane/**/*.ts"],
    rules: { "no-restricted-imports": refuse(["functions", "cli", "addin"], "src/taskpane imports the core, src/workbook and src/sheet, never another adapter.") },
  },
  {
    files: ["src/cli/**/*.ts"],
    rules: { "no-restricted-imports": refuse(["functions", "taskpane", "addin", "workbook"], "src/cli imports the core only.") },
  },
  {
    files: ["src/addin/**/*.ts"],
    ignores: ["src/addin/main.ts"],
    rules: { "no-restricted-imports": refuse(["functions", "taskpane", "cli"], "Only the add-in's entry (src/addin/main.ts) wires the adapters together.") },
  },
  {
    files: TYPED,
    // The ruleset reader's own files (JSON syntax, schema problems, loading) are brought in with the rest.
    extends: [tseslint.configs.recommendedTypeChecked],
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname } },
    rules: {
      "@typescript-eslint/switch-exhaustiveness-check": ["error", { considerDefaultExhaustiveForUnions: true }],
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
);
