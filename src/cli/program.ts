/**
 * The `loadwright` command line: commands, options and their help, with
 * examples. Options are typed from their declarations (commander's extra
 * typings), so a handler receives exactly what its command declares.
 */
import { Command, Option, type OptionValues } from "@commander-js/extra-typings";
import { auditCommand } from "./commands/audit.js";
import { combosCommand } from "./commands/combos.js";
import type { Io } from "./commands/common.js";
import { envelopeCommand } from "./commands/envelope.js";
import { explainCommand } from "./commands/explain.js";
import { factoredCommand } from "./commands/factored.js";
import { governingCommand } from "./commands/governing.js";
import { libraryCommand } from "./commands/library.js";
import { rulesetsCommand } from "./commands/rulesets.js";
import { sheetCommand } from "./commands/sheet.js";
import { REPORT_DEFAULTS, reportCommand } from "./commands/report.js";
import { CAUTIONS } from "./output/preamble.js";
import { VERSION } from "./version.js";

const collect = (value: string, previous: string[]) => [...previous, value];

const ROW_LIMIT_HELP = "most concrete rows to list one by one (factored, combos, criteria that are not linear)";

const CAUTION_HELP = `\nCautions:\n${CAUTIONS.map((c) => `  - ${c}`).join("\n")}\n`;

const CASE_FILE_HELP = `
Case files:
  CSV with a header row, JSON (an array of rows, header row first; files ending .json), or an
  .xlsx workbook (--sheet NAME, default the first; --range A1:Q2000, default the used range).
  Cases as columns (an analysis export: result id, then one column per case such as D, L, W:N)
  or as rows (a reactions table: case headers down the first column, components across).
  The layout is detected where only one reading fits; say --layout rows|columns otherwise.
  A cases-as-columns CSV or worksheet is streamed row by row (envelope, governing, explain).`;

const AUDIT_HELP = `
Examples:
  loadwright audit calc.xlsx
  loadwright audit calc.xlsx --library firm-library.json
  loadwright audit calc.xlsx --library firm-library.json --format json > audit.json

Exit status: 0 listed (with --library: every formula uses the library's current approved
version); 1 the workbook or library cannot be read, or a stored ruleset does not load;
3 with --library, a formula uses a ruleset that is not the library's current approved version.
${CAUTION_HELP}`;

function rulesetOptions<Args extends unknown[], Opts extends OptionValues>(command: Command<Args, Opts>) {
  return command
    .requiredOption("-r, --ruleset <id|file>", "a shipped ruleset's id (see `loadwright rulesets`) or a ruleset file")
    .option("-p, --param <name=value>", 'a ruleset parameter, e.g. --param SDS=1.0 (repeat it, or "SDS=1.0; rho=1.3")', collect, [] as string[])
    .addOption(new Option("-f, --format <format>", "output format: table, csv, json or md (default: table on a terminal, csv otherwise)"));
}

function caseOptions<Args extends unknown[], Opts extends OptionValues>(command: Command<Args, Opts>) {
  return command
    .option("--layout <layout>", "where the cases are: rows, columns or auto", "auto")
    .option("--id-columns <n>", "cases as columns: how many leading columns name a result row", "1")
    .option("--delimiter <char>", 'CSV field separator: "," ";" or tab', ",")
    .option("--map <file>", "a case map CSV: [header, symbol] or [symbol, sum|each|orthogonal] rows")
    .option("--sheet <name>", "an .xlsx case file: the worksheet to read (default: the first)")
    .option("--range <A1:Q2000>", "an .xlsx case file: the cells to read (default: the worksheet's used range)");
}

export function buildProgram(io: Io) {
  // Set before the commands are added: each command copies these settings from its parent.
  const program = new Command("loadwright")
    .exitOverride()
    .configureOutput({
      writeOut: (text) => io.out.line(text.replace(/\n$/, "")),
      writeErr: (text) => io.err.line(text.replace(/\n$/, "")),
      outputError: (text, write) => write(`loadwright: ${text}`),
    })
    .description("Load combinations, envelopes and governing rows for structural engineers, on CSV or JSON files.")
    .version(VERSION)
    .showHelpAfterError("(add --help for usage)")
    .addHelpText("after", CAUTION_HELP);

  program
    .command("rulesets")
    .description("list the shipped rulesets with their verification status, confirmed combinations and fingerprint")
    .addOption(new Option("-f, --format <format>", "output format: table, csv, json or md"))
    .option("--verification", "per ruleset and per combination: the public sources that confirm it and what is from memory")
    .addHelpText(
      "after",
      `\nExamples:\n  loadwright rulesets\n  loadwright rulesets --format json\n  loadwright rulesets --verification\n  loadwright rulesets --verification --format md > docs/verification.md\n${CAUTION_HELP}`,
    )
    .action((options) => rulesetsCommand(options, io));

  caseOptions(
    rulesetOptions(
      program
        .command("combos")
        .description("list the concrete combination rows with their clause and factors")
        .option("--cases <file>", "give factors on the cases of this case file instead of on load symbols")
        .option("--row-limit <n>", ROW_LIMIT_HELP, "200000"),
    ),
  )
    .addHelpText(
      "after",
      `\nExamples:\n  loadwright combos --ruleset my-rules.json\n  loadwright combos --ruleset my-rules.json --param SDS=1.0 --cases reactions.csv --format csv\n${CAUTION_HELP}`,
    )
    .action((options) => combosCommand(options, io));

  caseOptions(
    rulesetOptions(
      program
        .command("factored")
        .description("every concrete row with the value of every component")
        .argument("<file>", "case file (CSV or JSON)")
        .option("--row-limit <n>", ROW_LIMIT_HELP, "200000"),
    ),
  )
    .addHelpText("after", `\nExamples:\n  loadwright factored reactions.csv --ruleset my-rules.json\n  loadwright factored reactions.csv -r my-rules.json --format json > factored.json\n${CASE_FILE_HELP}\n${CAUTION_HELP}`)
    .action((file, options) => factoredCommand(file, options, io));

  caseOptions(
    rulesetOptions(
      program
        .command("envelope")
        .description("per result, the largest and smallest value over every concrete row, with the row that gives each")
        .argument("<file>", "case file (CSV or JSON)")
        .option("--threads <n>", "1, 2 or auto: with auto, a streamed CSV file of 64 MB or more is read on one core and evaluated on another where a core is free (csv output)", "auto"),
    ),
  )
    .addHelpText(
      "after",
      `\nExamples:\n  loadwright envelope export.csv --ruleset my-rules.json\n  loadwright envelope export.csv -r my-rules.json --id-columns 3 --format csv > envelope.csv\n${CASE_FILE_HELP}\n${CAUTION_HELP}`,
    )
    .action((file, options) => envelopeCommand(file, options, io));

  caseOptions(
    rulesetOptions(
      program
        .command("governing")
        .description("the rows chosen by criteria, with the concurrent value of every component")
        .argument("<file>", "case file (CSV or JSON)")
        .option("-c, --criterion <criterion>", 'e.g. "max V", "min N", "max |M|", "max N/2000 + M/350", "max [C1 top]" (repeat it)', collect, [] as string[])
        .option("--row-limit <n>", ROW_LIMIT_HELP, "200000"),
    ),
  )
    .addHelpText(
      "after",
      `\nExamples:\n  loadwright governing reactions.csv --ruleset my-rules.json\n  loadwright governing reactions.csv -r my-rules.json --criterion "min P" --criterion "max |V|"\n  loadwright governing export.csv -r my-rules.json --criterion "max [C1 top]" --format json\n\nWithout --criterion, a cases-as-rows table takes "max X" and "min X" for every component.\nA cases-as-columns file needs --criterion naming its result rows.\n${CASE_FILE_HELP}\n${CAUTION_HELP}`,
    )
    .action((file, options) => governingCommand(file, options, io));

  caseOptions(
    rulesetOptions(
      program
        .command("explain")
        .description("one value's derivation: factors, where each comes from, products and sum")
        .argument("<file>", "case file (CSV or JSON)")
        .requiredOption("--row <label|number>", "the row's label as the other outputs print it, or its number in the factored listing")
        .requiredOption("--component <name>", "the component (cases as rows) or result row id (cases as columns)"),
    ),
  )
    .addHelpText(
      "after",
      `\nExamples:\n  loadwright explain reactions.csv -r my-rules.json --row "2: 1.2D + 1.6L" --component P\n  loadwright explain reactions.csv -r my-rules.json --row 7 --component V\n${CASE_FILE_HELP}\n${CAUTION_HELP}`,
    )
    .action((file, options) => explainCommand(file, options, io));

  caseOptions(
    rulesetOptions(
      program
        .command("sheet")
        .description("write the reviewer's copy: a worksheet of plain formulas any spreadsheet program recomputes without Loadwright")
        .argument("<file>", "case file (CSV or JSON)")
        .requiredOption("-o, --out <book.xlsx>", "the workbook to write")
        .option("-c, --criterion <criterion>", "a governing criterion, as for `governing` (repeat it)", collect, [] as string[])
        .option("--row-limit <n>", ROW_LIMIT_HELP, "200000"),
    ),
  )
    .addHelpText("after", `\nExamples:\n  loadwright sheet reactions.csv -r asce7-16-strength --param SDS=1.0 --out review.xlsx\n  loadwright sheet reactions.csv -r my-rules.json --criterion "max |M|" --out review.xlsx\n${CASE_FILE_HELP}\n${CAUTION_HELP}`)
    .action((file, options) => sheetCommand(file, options, io));

  caseOptions(
    program
      .command("report")
      .description("write the checker's calculation report: one self-contained HTML file (and, with --pdf, a PDF printed by Chromium)")
      .argument("<file>", "case file (CSV, JSON or .xlsx)")
      .requiredOption("-r, --ruleset <id|file>", "a shipped ruleset's id (see `loadwright rulesets`) or a ruleset file")
      .option("-p, --param <name=value>", 'a ruleset parameter, e.g. --param SDS=1.0 (repeat it, or "SDS=1.0; rho=1.3")', collect, [] as string[])
      .requiredOption("-o, --out <calc.html>", "the HTML file to write")
      .option("-c, --criterion <criterion>", "a governing criterion, as for `governing` (repeat it); a reactions table without one takes the max and min of every component", collect, [] as string[])
      .option("--title <text>", "the report's title (default: the case file's name)")
      .option("--by <name>", "who prepared it, for the title block")
      .option("--date <date>", "its date, for the title block")
      .option("--pdf [file.pdf]", "also print it to PDF with headless Chromium (default: the --out name with .pdf)")
      .option("--paper <size>", "the PDF's paper: a4 or letter", REPORT_DEFAULTS.paper)
      .option("--chromium <path>", "the Chromium to print with (default: LOADWRIGHT_CHROMIUM, else /usr/bin/chromium and the usual places)")
      .option("--digits <n>", "significant digits of computed values", REPORT_DEFAULTS.digits)
      .option("--row-limit <n>", "most concrete rows listed and plotted one by one; beyond it they are summarised, saying so", REPORT_DEFAULTS.rowLimit)
      .option("--result-limit <n>", "most results (components or result rows) a report holds; a larger table is refused", REPORT_DEFAULTS.resultLimit),
  )
    .addHelpText(
      "after",
      `\nExamples:\n  loadwright report reactions.csv -r asce7-16-strength --param SDS=1.0 --title "Grid A bases" --by "A. Engineer" --date 2026-03-02 --out calc.html\n  loadwright report export.xlsx --sheet Results --id-columns 2 -r my-rules.json --criterion "max |[C1 M]|" --out calc.html --pdf\n${CASE_FILE_HELP}\n${CAUTION_HELP}`,
    )
    .action((file, options) => reportCommand(file, options, io));

  program
    .command("audit")
    .description("which rulesets a saved workbook's formulas use and which it stores; with --library, whether each is the firm's approved version")
    .argument("<workbook>", "a saved .xlsx workbook")
    .option("-l, --library <file>", "the firm library (loadwright-library/1) to check against")
    .addOption(new Option("-f, --format <format>", "output format: table, csv, json or md (default: table on a terminal, csv otherwise)"))
    .addHelpText("after", AUDIT_HELP)
    .action((workbook, options) => auditCommand(workbook, options, io));

  program
    .command("library")
    .description("check a firm library (loadwright-library/1) as audit loads it, and list its approved rulesets")
    .argument("<file>", "the firm library file")
    .addOption(new Option("-f, --format <format>", "output format: table, csv, json or md"))
    .addHelpText("after", `\nExamples:\n  loadwright library firm-library.json\n  loadwright library firm-library.json --format json\n${CAUTION_HELP}`)
    .action((file, options) => libraryCommand(file, options, io));

  return program;
}
