/**
 * How a workbook keeps its rulesets: one add-in document setting under this
 * key, holding `{format, rulesets: [ruleset file, …]}` as JSON. The add-in
 * writes it and the workbook audit reads it from the saved file, so the key
 * and the format's name live here, known to both.
 */
export const STORE_KEY = "loadwright.rulesets";
export const STORE_FORMAT = "loadwright-store/1";
