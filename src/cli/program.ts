/** The `loadwright` command line: commands, options and their help, with examples. */
import { Command, Option } from "commander";
import { combosCommand } from "./commands/combos.js";
import type { Io } from "./commands/common.js";
import { envelopeCommand } from "./commands/envelope.js";
import { explainCommand } from "./commands/explain.js";
import { factoredCommand } from "./commands/factored.js";
import { governingCommand } from "./commands/governing.js";
import { rulesetsCommand } from "./commands/rulesets.js";
import { CAUTIONS } from "./output/preamble.js";
import { VERSION } from "./version.js";

const collect = (value: string, previous: string[]) => [...previous, value];

const ROW_LIMIT_HELP = "most concrete rows to list one by one (factored, combos, criteria that are not linear)";

const CAUTION_HELP = `\nCautions:\n${CAUTIONS.map((c) => `  - ${c}`).join("\n")}\n`;

const CASE_FILE_HELP = `
Case files:
  CSV with a header row, or JSON (an array of rows, header row first; files ending .json).
  Cases as columns (an analysis export: result id, then one column per case such as D, L, W:N)
  or as rows (a reactions table: case headers down the first column, components across).
  The layout is detected where only one reading fits; say --layout rows|columns otherwise.
  A cases-as-columns CSV is streamed row by row (envelope, governing, explain).`;

function rulesetOptions(command: Command): Command {
  return command
    .requiredOption("-r, --ruleset <id|file>", "a shipped ruleset's id (see `loadwright rulesets`) or a ruleset file")
    .option("-p, --param <name=value>", 'a ruleset parameter, e.g. --param SDS=1.0 (repeat it, or "SDS=1.0; rho=1.3")', collect, [])
    .addOption(new Option("-f, --format <format>", "output format: table, csv, json or md (default: table on a terminal, csv otherwise)"));
}

function caseOptions(command: Command): Command {
  return command
    .option("--layout <layout>", "where the cases are: rows, columns or auto", "auto")
    .option("--id-columns <n>", "cases as columns: how many leading columns name a result row", "1")
    .option("--delimiter <char>", 'CSV field separator: "," ";" or tab', ",")
    .option("--map <file>", "a case map CSV: [header, symbol] or [symbol, sum|each|orthogonal] rows");
}

export function buildProgram(io: Io): Command {
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
    .description("list the shipped rulesets with their verification status and fingerprint")
    .addOption(new Option("-f, --format <format>", "output format: table, csv, json or md"))
    .addHelpText("after", `\nExamples:\n  loadwright rulesets\n  loadwright rulesets --format json\n${CAUTION_HELP}`)
    .action((options: { format?: string }) => rulesetsCommand(options, io));

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
    .action((file: string, options) => factoredCommand(file, options, io));

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
    .action((file: string, options) => envelopeCommand(file, options, io));

  caseOptions(
    rulesetOptions(
      program
        .command("governing")
        .description("the rows chosen by criteria, with the concurrent value of every component")
        .argument("<file>", "case file (CSV or JSON)")
        .option("-c, --criterion <criterion>", 'e.g. "max V", "min N", "max |M|", "max N/2000 + M/350", "max [C1 top]" (repeat it)', collect, [])
        .option("--row-limit <n>", ROW_LIMIT_HELP, "200000"),
    ),
  )
    .addHelpText(
      "after",
      `\nExamples:\n  loadwright governing reactions.csv --ruleset my-rules.json\n  loadwright governing reactions.csv -r my-rules.json --criterion "min P" --criterion "max |V|"\n  loadwright governing export.csv -r my-rules.json --criterion "max [C1 top]" --format json\n\nWithout --criterion, a cases-as-rows table takes "max X" and "min X" for every component.\nA cases-as-columns file needs --criterion naming its result rows.\n${CASE_FILE_HELP}\n${CAUTION_HELP}`,
    )
    .action((file: string, options) => governingCommand(file, options, io));

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
    .action((file: string, options) => explainCommand(file, options, io));

  return program;
}
