// Lint: the recommended TypeScript rules, no string evaluation anywhere, and a
// core that imports nothing from Office, the DOM, Node or the adapters.
import tseslint from "typescript-eslint";

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
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: ["**/functions/**", "**/taskpane/**", "**/cli/**"], message: "src/core knows no adapter." },
            { group: ["node:*", "fs", "path", "os", "child_process", "stream"], message: "src/core is pure: no Node APIs." },
            { group: ["office-*", "@microsoft/*"], message: "src/core knows no Office." },
          ],
        },
      ],
      "no-restricted-globals": ["error", "window", "document", "Office", "Excel", "CustomFunctions", "OfficeRuntime", "process"],
    },
  },
);
