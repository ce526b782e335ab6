/**
 * The calculation report as one self-contained HTML document: no script, no
 * external file, its style sheet inside, its charts inline SVG. A content
 * security policy forbids scripts and outside resources, so that nothing read
 * from a file could act even if it were not escaped (it is: see html.ts).
 *
 * Order, as a checker reads a package: the title block; the ruleset's stamp,
 * the parameters, what the case table leaves out and the cautions (page 1);
 * the case table as given; the combination rows with their clauses; the
 * envelope; the governing rows; each governing value's derivation; the plots.
 * Every number cell carries its value at full precision in `data-value`.
 */
import { coverageText } from "../core/index.js";
import { el, fragment, raw, type Child, type Html } from "./html.js";
import type { CalcReport, CombinationGroup, Derivation } from "./calcReport.js";
import { computedText, givenText } from "./reportNumbers.js";
import { reportStyle } from "./reportStyle.js";
import { rowChart } from "./rowChart.js";

/** More cases than this make the wide tables' type smaller. */
const WIDE_FROM_COLUMNS = 10;

export function renderReport(report: CalcReport): string {
  const { request, stamp } = report;
  const footer = `${request.title.slice(0, 60)} · ${stamp.words.word} ruleset ${stamp.id} ${stamp.version} · fingerprint ${stamp.shortFingerprint}`;
  const head = fragment(
    raw('<meta charset="utf-8">'),
    raw(`<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">`),
    raw('<meta name="viewport" content="width=device-width, initial-scale=1">'),
    el("meta", { name: "generator", content: `Loadwright ${request.version}` }),
    el("title", null, `${request.title} — calculation report`),
    el("style", null, raw(reportStyle(footer))),
  );
  const body = fragment(
    titleBlock(report),
    rulesetSection(report),
    parametersSection(report),
    omissionsSection(report),
    cautionsSection(report),
    caseTableSection(report),
    combinationsSection(report),
    envelopeSection(report),
    governingSection(report),
    derivationsSection(report),
    plotsSection(report),
  );
  return `<!DOCTYPE html>\n${el("html", { lang: "en" }, el("head", null, head), el("body", null, body)).html}\n`;
}

function num(value: number, text: string, extra: Record<string, string> = {}): Html {
  return el("td", { class: value === 0 ? "num zero" : "num", "data-value": String(value === 0 ? 0 : value), ...extra }, text);
}

function computed(report: CalcReport, value: number, extra: Record<string, string> = {}): Html {
  return num(value, computedText(value, report.request.digits), extra);
}

function titleBlock(report: CalcReport): Html {
  const r = report.request;
  return el(
    "header",
    { class: "title-block", id: "title" },
    el("h1", null, r.title),
    el(
      "dl",
      null,
      el("dt", null, "Prepared by"),
      el("dd", null, r.by ?? "(not given)"),
      el("dt", null, "Date"),
      el("dd", null, r.date ?? "(not given)"),
      el("dt", null, "Case file"),
      el("dd", { "data-field": "file" }, r.file),
      el("dt", null, "Computed by"),
      el("dd", null, `Loadwright ${r.version}`),
    ),
  );
}

function rulesetSection(report: CalcReport): Html {
  const s = report.stamp;
  const coverage = coverageText(s.coverage);
  return el(
    "section",
    { id: "ruleset" },
    el("h2", null, "Ruleset"),
    el("p", { class: s.words.alarm ? "status alarm" : "status", "data-field": "status" }, `${s.words.word} — ${s.words.advice}; ${s.words.approval.sentence}`),
    el(
      "dl",
      { class: "facts" },
      el("dt", null, "Ruleset"),
      el("dd", null, `${s.id} ${s.version} — ${s.title}`),
      el("dt", null, "Standard"),
      el("dd", null, s.standard),
      el("dt", null, "Source"),
      el("dd", null, s.source),
      el("dt", null, "Fingerprint"),
      el("dd", { class: "fingerprint", "data-field": "fingerprint" }, s.fingerprint),
      el("dt", null, "Verification"),
      el("dd", null, s.words.sentence),
      el("dt", null, "Coverage"),
      el("dd", { "data-field": "coverage" }, coverage),
      el("dt", null, "Approval"),
      el("dd", null, s.words.approval.sentence),
    ),
    s.fromMemoryLead
      ? fragment(el("p", null, el("strong", null, s.fromMemoryLead)), el("ul", { class: "memory" }, s.fromMemory.map((m) => el("li", null, m))))
      : el("p", null, "No source of this ruleset is marked as from memory."),
  );
}

function parametersSection(report: CalcReport): Html {
  if (report.parameters.length === 0) return el("section", { id: "parameters" }, el("h2", null, "Parameters"), el("p", null, "The ruleset has no parameters."));
  return el(
    "section",
    { id: "parameters" },
    el("h2", null, "Parameters in force"),
    dataTable(
      el("tr", null, el("th", null, "parameter"), el("th", { class: "num" }, "value"), el("th", null, "given or default"), el("th", null, "meaning")),
      report.parameters.map((p) =>
        el(
          "tr",
          { "data-parameter": p.name },
          el("td", null, p.name),
          typeof p.value === "number" ? num(p.value, givenText(p.value)) : el("td", { class: "num" }, p.value),
          el("td", null, p.given ? "given" : "default"),
          el("td", null, p.description),
        ),
      ),
    ),
  );
}

function omissionsSection(report: CalcReport): Html {
  const { skipped, notSupplied } = report.omissions;
  if (skipped.length === 0 && notSupplied.length === 0) return fragment();
  return el(
    "section",
    { id: "omissions" },
    el("h2", null, "What the case table leaves out"),
    el(
      "ul",
      { class: "notes" },
      skipped.map((s) => el("li", { "data-skipped": s.combination }, `Combination ${s.combination} (${s.clause}) forms no rows: ${s.reason}.`)),
      notSupplied.length > 0 ? el("li", null, `No case of ${notSupplied.join(", ")} in the case table: their terms contribute nothing.`) : null,
    ),
  );
}

function cautionsSection(report: CalcReport): Html {
  return el("section", { id: "cautions" }, el("h2", null, "Cautions"), el("ul", { class: "cautions" }, report.cautions.map((c) => el("li", null, c))));
}

function caseTableSection(report: CalcReport): Html {
  const { table } = report.request;
  const cases = table.cases.map((c) => c.header);
  const wide = (table.orientation === "columns" ? cases.length : table.components.length) > WIDE_FROM_COLUMNS;
  let headRow: Html;
  let bodyRows: Html[];
  if (table.orientation === "columns") {
    headRow = el("tr", null, el("th", null, "result"), cases.map((c) => el("th", { class: "num" }, c)));
    bodyRows = table.components.map((id, r) => el("tr", { "data-result": id }, el("td", null, id), Array.from(table.values[r], (v, k) => num(v, givenText(v), { "data-case": cases[k] }))));
  } else {
    headRow = el("tr", null, el("th", null, "case"), table.components.map((c) => el("th", { class: "num" }, c)));
    bodyRows = cases.map((c, k) => el("tr", { "data-case": c }, el("td", null, c), table.components.map((id, r) => num(table.values[r][k], givenText(table.values[r][k]), { "data-result": id }))));
  }
  return el(
    "section",
    { id: "case-table", class: "page" },
    el("h2", null, "Case table"),
    el("p", null, `As read from ${report.request.file}: ${table.orientation === "columns" ? "one row per result, one column per load case" : "one row per load case, one column per result"}, values as given.`),
    dataTable(headRow, bodyRows, wide),
  );
}

function combinationsSection(report: CalcReport): Html {
  const { plan } = report.request;
  const cases = plan.cases.map((c) => c.header);
  const wide = cases.length > WIDE_FROM_COLUMNS;
  const listed = report.listingSummary === null;
  const head = listed
    ? el("tr", null, el("th", null, "row"), el("th", null, "clause"), cases.map((c) => el("th", { class: "num" }, c)))
    : el("tr", null, el("th", null, "combination"), el("th", null, "clause"), el("th", null, "as written"), el("th", { class: "num" }, "rows"));
  const body = report.groups.map((g) => (listed ? groupRows(g, cases.length) : el("tr", { "data-combination": g.id }, el("td", null, g.id), el("td", null, g.clause), el("td", null, g.expression), num(g.rowCount, g.rowCount.toLocaleString("en-US")))));
  const skipped = report.omissions.skipped;
  return el(
    "section",
    { id: "combinations", class: "page" },
    el("h2", null, "Combinations"),
    el("p", null, `${plan.rowCount.toLocaleString("en-US")} concrete rows from ${report.groups.length} combinations: every alternative, direction, sign and term left out that the ruleset allows, each with the factor on every case (blank: the case does not act in the row).`),
    report.listingSummary ? el("p", { class: "summary", "data-field": "listing-summary" }, report.listingSummary) : null,
    dataTable(head, body, wide),
    skipped.length > 0
      ? fragment(
          el("h3", null, "Combinations that form no rows"),
          el("ul", { class: "notes" }, skipped.map((s) => el("li", { "data-skipped": s.combination }, `${s.combination} (${s.clause}): ${s.reason}`))),
        )
      : null,
  );
}

/** A table of one header row and its body rows; a wide one prints across the page (reportStyle.ts). */
function dataTable(head: Html, body: Child, wide = false): Html {
  return el("table", { class: wide ? "wide" : null }, el("thead", null, head), el("tbody", null, body));
}

function groupRows(g: CombinationGroup, caseCount: number): Child {
  return [
    el("tr", { class: "group", "data-combination": g.id }, el("th", { colspan: caseCount + 2 }, `Combination ${g.id} (${g.clause}): ${g.expression} — ${g.rowCount.toLocaleString("en-US")} row${g.rowCount === 1 ? "" : "s"}`)),
    (g.rows ?? []).map((r) =>
      el("tr", { "data-label": r.label }, el("td", { class: "label" }, r.label), el("td", null, r.clause), r.factors.map((f) => (f === 0 ? el("td", { class: "num", "data-value": "0" }) : num(f, givenText(f))))),
    ),
  ];
}

function envelopeSection(report: CalcReport): Html {
  return el(
    "section",
    { id: "envelope", class: "page" },
    el("h2", null, "Envelope"),
    el("p", null, `Per result, the largest and the smallest factored value over every concrete row, and the row giving each (${report.request.digits} significant digits).`),
    dataTable(
      el("tr", null, el("th", null, "result"), el("th", { class: "num" }, "max"), el("th", null, "row giving the max"), el("th", { class: "num" }, "min"), el("th", null, "row giving the min")),
      report.envelope.map((e) =>
        el(
          "tr",
          { "data-result": e.result },
          el("td", null, e.result),
          computed(report, e.max.value, { "data-field": "max" }),
          el("td", { class: "label", "data-field": "max-row" }, e.max.label),
          computed(report, e.min.value, { "data-field": "min" }),
          el("td", { class: "label", "data-field": "min-row" }, e.min.label),
        ),
      ),
    ),
  );
}

function governingSection(report: CalcReport): Html {
  const { components } = report.request.table;
  if (report.governing.length === 0) return el("section", { id: "governing", class: "page" }, el("h2", null, "Governing rows"), el("p", null, report.governingNote ?? ""));
  const legend = dataTable(
    el("tr", null, el("th", null, "row"), el("th", null, "criteria"), el("th", { class: "num" }, "criterion value"), el("th", null, "combination row")),
    report.governing.map((g, k) =>
      el(
        "tr",
        { "data-governing": k },
        el("td", null, `G${k + 1}`),
        el("td", null, g.criteria.join("; ")),
        el("td", { class: "num" }, g.criterionValues.map((v) => computedText(v, report.request.digits)).join("; ")),
        el("td", { class: "label" }, g.label),
      ),
    ),
  );
  // Concurrent values: the governing rows across, the results down (an export may have many results).
  const concurrent = dataTable(
    el("tr", null, el("th", null, "result"), report.governing.map((_, k) => el("th", { class: "num" }, `G${k + 1}`))),
    components.map((c, r) => el("tr", { "data-result": c }, el("td", null, c), report.governing.map((g, k) => computed(report, g.values[r], { "data-governing": String(k) })))),
    report.governing.length > WIDE_FROM_COLUMNS,
  );
  return el(
    "section",
    { id: "governing", class: "page" },
    el("h2", null, "Governing rows"),
    el("p", null, "The row each criterion chooses, and every result's concurrent value in that same row."),
    legend,
    el("h3", null, "Concurrent values"),
    concurrent,
  );
}

function derivationsSection(report: CalcReport): Html {
  if (report.derivations.length === 0) return fragment();
  return el(
    "section",
    { id: "derivations", class: "page" },
    el("h2", null, "Derivations"),
    el("p", null, "Each governing value written out: the factor on every case and where it comes from, the case value, the product, and their sum. Factors and case values are as given; products and sums are rounded for display only, and the sum is of the unrounded products."),
    report.derivations.map((d) => derivationBlock(report, d)),
  );
}

function derivationBlock(report: CalcReport, d: Derivation): Html {
  const x = d.explanation;
  const g = report.governing[d.governing];
  return el(
    "div",
    { class: "derivation", "data-governing": String(d.governing), "data-component": x.component, "data-total": String(x.total === 0 ? 0 : x.total) },
    el("h3", null, `G${d.governing + 1} · ${x.component} in row ${x.label}`),
    el("p", null, `Chosen by ${g.criteria.join("; ")}. Combination ${x.combination} (${x.clause}): ${x.expression}`),
    dataTable(
      el("tr", null, el("th", null, "case"), el("th", { class: "num" }, "factor"), el("th", null, "factor from"), el("th", { class: "num" }, "case value"), el("th", { class: "num" }, "factor × case value")),
      [
        x.lines.map((l) =>
          el(
            "tr",
            { "data-case": l.case },
            el("td", null, l.case),
            num(l.factor, givenText(l.factor), { "data-field": "factor" }),
            el("td", null, l.why),
            num(l.caseValue, givenText(l.caseValue), { "data-field": "case-value" }),
            computed(report, l.product, { "data-field": "product" }),
          ),
        ),
        el("tr", { class: "sum" }, el("td", { colspan: 4 }, x.lines.length === 0 ? `${x.component}: no case acts in this row` : `${x.component} = sum`), computed(report, x.total, { "data-field": "total" })),
      ],
    ),
    x.parameters.length > 0 ? el("p", null, `Parameters read: ${x.parameters.map((p) => `${p.name} = ${typeof p.value === "number" ? givenText(p.value) : p.value} (${p.given ? "given" : "default"})`).join(", ")}.`) : null,
  );
}

function plotsSection(report: CalcReport): Html {
  const { table } = report.request;
  if (!report.rows) return el("section", { id: "plots", class: "page" }, el("h2", null, "Plots"), el("p", { class: "summary", "data-field": "plots-summary" }, report.plotsNote ?? ""));
  const rows = report.rows;
  return el(
    "section",
    { id: "plots", class: "page" },
    el("h2", null, "Plots"),
    el("p", null, "For each result, its factored value in every concrete row, in the order of the combination list. The black bars are the rows giving the largest value (▼ above it) and the smallest (▲ below it), named under each chart."),
    table.components.map((c, r) => {
      const e = report.envelope[r];
      const chart = rowChart(
        rows.map((row) => ({ label: row.label, combination: row.combination, value: row.values[r] })),
        { title: c, digits: report.request.digits, maxLabel: e.max.label, minLabel: e.min.label },
      );
      return el(
        "figure",
        { "data-result": c },
        el("h3", null, c),
        chart,
        el(
          "figcaption",
          null,
          `▼ max ${computedText(e.max.value, report.request.digits)} in row ${e.max.label}; ▲ min ${computedText(e.min.value, report.request.digits)} in row ${e.min.label}; ${rows.length.toLocaleString("en-US")} rows.`,
        ),
      );
    }),
  );
}
