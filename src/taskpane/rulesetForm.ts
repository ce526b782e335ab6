/**
 * The draft as a form: identity, combinations (a list to add to, remove from
 * and reorder), load symbols, parameters, notes and provenance. The approval is
 * shown, never edited: Approve writes it. Anything the form cannot show (a
 * field of the wrong type typed in the text view) is left in the draft as it
 * is and its problem is shown at the nearest field.
 */
import {
  caseModeSchema,
  DECIMAL_TEXT,
  DEFAULT_ORTHOGONAL_SHARE,
  formatPath,
  NAME_PATTERN,
  PARAMETER_TYPES,
  permanenceSchema,
  provenanceStatusSchema,
  SYMBOL_DEFAULTS,
  type CaseMode,
} from "../core/index.js";
import { isObject, parseJson, renameKey, shownText, type JsonObject } from "./dataPath.js";
import { button, el, type Child } from "./dom.js";
import { entryButton, fieldShell, numberField, optionOf, parsedField, selectField, textField, type FormContext, type Option } from "./formFields.js";

export function rulesetForm(fc: FormContext): HTMLElement {
  const { doc } = fc;
  return el(
    doc,
    "div",
    { id: "lw-form", class: "ruleset-form" },
    el(doc, "div", { class: "field-problem", "data-problem-for": "" }),
    identitySection(fc),
    combinationsSection(fc),
    symbolsSection(fc),
    parametersSection(fc),
    notesSection(fc),
    provenanceSection(fc),
    approvalSection(fc),
  );
}

/** A section the user can fold away; it opens by itself when a problem is placed in it. */
function section(fc: FormContext, key: string, title: string, path: string, ...children: (HTMLElement | null)[]): HTMLElement {
  const { doc } = fc;
  const details = el(
    doc,
    "details",
    { class: "form-section", "data-section": key, "data-path": path },
    el(doc, "summary", {}, title, el(doc, "span", { class: "section-problems" })),
    el(doc, "div", { class: "field-problem", "data-problem-for": path }),
    ...children,
  );
  details.open = fc.openSections.has(key);
  details.addEventListener("toggle", () => {
    if (details.open) fc.openSections.add(key);
    else fc.openSections.delete(key);
  });
  return details;
}

/**
 * One entry of a list section (a combination, a symbol, a parameter, a source):
 * its name and tools in a head line, a slot for problems with the entry as a
 * whole, then its fields.
 */
function entryItem(fc: FormContext, path: string, name: HTMLElement, tools: HTMLElement[], ...body: Child[]): HTMLElement {
  const { doc } = fc;
  return el(
    doc,
    "li",
    { class: "entry", "data-path": path },
    el(doc, "div", { class: "entry-head" }, name, el(doc, "span", { class: "entry-tools" }, ...tools)),
    el(doc, "div", { class: "field-problem", "data-problem-for": path }),
    ...body,
  );
}

function entryName(doc: Document, text: string, mono = false): HTMLElement {
  return el(doc, "span", { class: mono ? "entry-name mono" : "entry-name" }, text);
}

function entryFields(doc: Document, ...fields: HTMLElement[]): HTMLElement {
  return el(doc, "div", { class: "entry-fields" }, ...fields);
}

function identitySection(fc: FormContext): HTMLElement {
  return section(
    fc,
    "identity",
    "Identity",
    "standard",
    textField(fc, { label: "Id (what a formula names)", path: ["id"], mono: true, hint: "lower-case letters, digits, '.', '_' or '-'" }),
    textField(fc, { label: "Title", path: ["title"] }),
    textField(fc, { label: "Standard", path: ["standard", "name"] }),
    textField(fc, { label: "Edition", path: ["standard", "edition"] }),
    textField(fc, { label: "Clauses", path: ["standard", "clauses"], optional: true }),
    textField(fc, { label: "Design basis", path: ["basis"], optional: true, hint: "e.g. strength design (LRFD)" }),
    textField(fc, { label: "Version", path: ["version"], mono: true }),
  );
}

function notAList(doc: Document, what: string): HTMLElement {
  return el(doc, "p", { class: "problem" }, `The ${what} in the draft are not in the form this view edits; mend them in the JSON text.`);
}

function combinationsSection(fc: FormContext): HTMLElement {
  const { doc, data } = fc;
  if (!Array.isArray(data.combinations)) return section(fc, "combinations", "Combinations", "combinations", notAList(doc, "combinations"));
  const list: unknown[] = data.combinations;
  const items = list.map((c, i) => {
    const where = `combination ${i + 1}${isObject(c) && typeof c.id === "string" && c.id !== "" ? ` (${c.id})` : ""}`;
    const move = (to: number, direction: string) => () => {
      const [moved] = list.splice(i, 1);
      list.splice(to, 0, moved);
      fc.rebuild(`[data-path="combinations[${to}]"] button[data-move="${direction}"]`);
    };
    return entryItem(
      fc,
      `combinations[${i}]`,
      entryName(doc, `Combination ${i + 1}`),
      [
        marked(entryButton(doc, "↑", `Move ${where} up`, move(i - 1, "up"), i === 0), "up"),
        marked(entryButton(doc, "↓", `Move ${where} down`, move(i + 1, "down"), i === list.length - 1), "down"),
        entryButton(doc, "✕", `Remove ${where}`, () => {
          list.splice(i, 1);
          fc.rebuild(`[data-path="combinations[${Math.min(i, list.length - 1)}]"] input`);
        }),
      ],
      isObject(c)
        ? entryFields(
            doc,
            textField(fc, { label: "Id", path: ["combinations", i, "id"], mono: true, className: "narrow" }),
            textField(fc, { label: "Expression", path: ["combinations", i, "expression"], mono: true }),
            textField(fc, { label: "Clause", path: ["combinations", i, "clause"] }),
            textField(fc, { label: "Description", path: ["combinations", i, "description"], optional: true, multiline: true }),
          )
        : notAList(doc, `entries of combination ${i + 1}`),
    );
  });
  const add = button(doc, "Add a combination", () => {
    const ids = new Set(list.map((c) => (isObject(c) ? String(c.id) : "")));
    let n = list.length + 1;
    while (ids.has(String(n))) n++;
    list.push({ id: String(n), expression: "", clause: "" });
    fc.rebuild(`[data-path="combinations[${list.length - 1}]"] [data-control-for="combinations[${list.length - 1}].expression"]`);
  });
  return section(fc, "combinations", `Combinations (${list.length})`, "combinations", el(doc, "ol", { class: "entries", id: "lw-form-combinations" }, ...items), add);
}

function marked(b: HTMLButtonElement, move: string): HTMLButtonElement {
  b.dataset.move = move;
  return b;
}

const SYMBOL_NAME_HINT = "a letter, then letters, digits or _";

/** Name field of a symbol or parameter: renamed when the field is left, refused when empty or taken. */
function nameField(fc: FormContext, record: JsonObject, name: string, recordPath: string, what: string): HTMLElement {
  return parsedField(fc, {
    label: "Name",
    path: [recordPath, name, "(name)"],
    text: name,
    mono: true,
    on: "change",
    className: "narrow",
    read: (text) => {
      const next = text.trim();
      if (next === "") return { problem: `give the ${what} a name` };
      if (!NAME_PATTERN.test(next)) return { problem: `"${next}" is not a name: ${SYMBOL_NAME_HINT}` };
      if (next !== name && next in record) return { problem: `"${next}" already names another ${what}` };
      return {
        apply: () => {
          if (next === name) return;
          renameKey(record, name, next);
          fc.localProblems.forEach((_, k) => {
            if (k.startsWith(formatPath([recordPath, name]))) fc.localProblems.delete(k);
          });
          fc.rebuild(`[data-control-for="${cssPath([recordPath, next, "(name)"])}"]`);
        },
      };
    },
  });
}

function cssPath(path: (string | number)[]): string {
  return formatPath(path).replaceAll('"', '\\"');
}

function addNamed(fc: FormContext, record: JsonObject, recordPath: string, what: string, make: () => JsonObject): HTMLElement {
  const { doc } = fc;
  const id = `lw-add-${recordPath}`;
  const input = el(doc, "input", { id, type: "text", class: "mono", autocomplete: "off", spellcheck: "false" });
  const problem = el(doc, "p", { class: "field-problem", role: "alert" });
  const add = () => {
    const name = input.value.trim();
    const why = name === "" ? `give the new ${what} a name` : !NAME_PATTERN.test(name) ? `"${name}" is not a name: ${SYMBOL_NAME_HINT}` : name in record ? `"${name}" already names a ${what}` : null;
    if (why) {
      problem.textContent = why;
      input.focus();
      return;
    }
    record[name] = make();
    fc.rebuild(`[data-path="${cssPath([recordPath, name])}"] [data-control-for="${cssPath([recordPath, name, "description"])}"]`);
  };
  input.addEventListener("keydown", (e) => {
    if (e.key === "Enter") add();
  });
  return el(doc, "div", { class: "add-named" }, el(doc, "label", { for: id }, `New ${what}'s name`), input, button(doc, `Add the ${what}`, add), problem);
}

function removeNamed(fc: FormContext, record: JsonObject, name: string, what: string, recordPath: string): HTMLButtonElement {
  return entryButton(fc.doc, "✕", `Remove the ${what} ${name}`, () => {
    delete record[name];
    fc.localProblems.forEach((_, k) => {
      if (k.startsWith(formatPath([recordPath, name]))) fc.localProblems.delete(k);
    });
    fc.rebuild(`#lw-add-${recordPath}`);
  });
}

const yesNo = (v: boolean) => (v ? "yes" : "no");

const OPTIONAL_BOOLEAN = (absent: string): Option[] => [
  { value: "", label: `(not written: ${absent})` },
  { value: "true", label: "yes" },
  { value: "false", label: "no" },
];

/** What each case mode does, in a line; every mode of the format must have one. */
const CASE_MODE_WORDS: Readonly<Record<CaseMode, string>> = {
  sum: "all act together",
  each: "one at a time",
  orthogonal: "each leading, others at the share",
  independent: "all act, each taking the term's factors on its own",
};

/** The case modes the format knows (read off its schema), and what leaving the field out means. */
const CASE_MODE_OPTIONS: Option[] = [
  { value: "", label: `(not written: ${SYMBOL_DEFAULTS.permanent.cases} if permanent, ${SYMBOL_DEFAULTS.transient.cases} if transient)` },
  ...caseModeSchema.options.map((m) => ({ value: m, label: `${m}: ${CASE_MODE_WORDS[m]}` })),
];

const PERMANENCE_OPTIONS: Option[] = permanenceSchema.options.map((p) => ({ value: p, label: p }));

/** A provenance status as the form words it; every status of the format must have one. */
const PROVENANCE_STATUS_WORDS: Readonly<Record<(typeof provenanceStatusSchema.options)[number], string>> = {
  confirmed: "confirmed: checked against this source",
  "from-memory": "from memory: to be verified (shows UNVERIFIED)",
};

function symbolsSection(fc: FormContext): HTMLElement {
  const { doc, data } = fc;
  const symbols = data.symbols;
  if (!isObject(symbols)) return section(fc, "symbols", "Load symbols", "symbols", notAList(doc, "symbols"));
  const items = Object.entries(symbols).map(([name, s]) => {
    const p = (field: string) => ["symbols", name, field];
    return entryItem(
      fc,
      formatPath(["symbols", name]),
      entryName(doc, name, true),
      [removeNamed(fc, symbols, name, "symbol", "symbols")],
      isObject(s)
        ? entryFields(
            doc,
            nameField(fc, symbols, name, "symbols", "symbol"),
            textField(fc, { label: "Description", path: p("description") }),
            selectField(fc, { label: "Permanence", path: p("permanence"), options: PERMANENCE_OPTIONS }),
            selectField(fc, { label: "Acts both ways (reversible)", path: p("reversible"), options: OPTIONAL_BOOLEAN(yesNo(SYMBOL_DEFAULTS.transient.reversible)), parse: (v) => v === "true" }),
            selectField(fc, { label: "Several cases in a table", path: p("cases"), options: CASE_MODE_OPTIONS }),
            textField(fc, {
              label: "Orthogonal share",
              path: p("orthogonalShare"),
              optional: true,
              mono: true,
              hint: `a number (${DEFAULT_ORTHOGONAL_SHARE} if not written) or a parameter name; only with orthogonal`,
            }),
            selectField(fc, {
              label: "May be absent where that is worse",
              path: p("canBeAbsent"),
              options: OPTIONAL_BOOLEAN(`transient ${yesNo(SYMBOL_DEFAULTS.transient.canBeAbsent)}, permanent ${yesNo(SYMBOL_DEFAULTS.permanent.canBeAbsent)}`),
              parse: (v) => v === "true",
            }),
            attributesField(fc, s, name),
          )
        : notAList(doc, `fields of symbol ${name}`),
    );
  });
  return section(
    fc,
    "symbols",
    `Load symbols (${items.length})`,
    "symbols",
    el(doc, "ul", { class: "entries" }, ...items),
    addNamed(fc, symbols, "symbols", "symbol", () => ({ description: "", permanence: "transient" })),
  );
}

/** "psi0=0.7; psi1=psi1_Q": per-symbol values, each a number or a parameter's (or choice value's) name. */
function attributesField(fc: FormContext, symbol: JsonObject, name: string): HTMLElement {
  const current = isObject(symbol.attributes) ? symbol.attributes : {};
  const text = Object.entries(current)
    .map(([k, v]) => `${k}=${shownText(v)}`)
    .join("; ");
  return parsedField(fc, {
    label: "Attributes",
    path: ["symbols", name, "attributes"],
    text,
    mono: true,
    hint: "name=value pairs separated by ';', e.g. psi0=0.7; psi1=psi1_Q",
    read: (typed) => {
      const out: JsonObject = {};
      let offset = 0;
      for (const piece of typed.split(";")) {
        const start = offset;
        offset += piece.length + 1;
        if (piece.trim() === "") continue;
        const at = start + piece.search(/\S/) + 1;
        const eq = piece.indexOf("=");
        if (eq < 0) return { problem: `character ${at}: "${piece.trim()}" is not name=value` };
        const key = piece.slice(0, eq).trim();
        const value = piece.slice(eq + 1).trim();
        if (!NAME_PATTERN.test(key)) return { problem: `character ${at}: "${key}" is not a name (${SYMBOL_NAME_HINT})` };
        if (key in out) return { problem: `character ${at}: ${key} is given twice` };
        if (DECIMAL_TEXT.test(value)) out[key] = Number(value);
        else if (NAME_PATTERN.test(value)) out[key] = value;
        else return { problem: `character ${start + eq + 2}: "${value}" is neither a number (1.5, 0.5, 1e3) nor a parameter name` };
      }
      return {
        apply: () => {
          if (Object.keys(out).length === 0 && symbol.attributes === undefined) return fc.changed();
          symbol.attributes = out;
          if (Object.keys(out).length === 0) delete symbol.attributes;
          fc.changed();
        },
      };
    },
  });
}

function parametersSection(fc: FormContext): HTMLElement {
  const { doc, data } = fc;
  if (data.parameters !== undefined && !isObject(data.parameters)) return section(fc, "parameters", "Parameters", "parameters", notAList(doc, "parameters"));
  const parameters: JsonObject = isObject(data.parameters) ? data.parameters : {};
  const items = Object.entries(parameters).map(([name, p]) => {
    const path = (field: string) => ["parameters", name, field];
    const fields: HTMLElement[] = [];
    if (isObject(p)) {
      fields.push(
        nameField(fc, parameters, name, "parameters", "parameter"),
        kindField(fc, parameters, name, p),
        textField(fc, { label: "Description", path: path("description"), multiline: true }),
      );
      if (p.type === "choice") {
        fields.push(
          textField(fc, { label: "Default choice", path: path("default") }),
          choicesField(fc, p, name),
        );
      } else {
        fields.push(
          textField(fc, { label: "Unit", path: path("unit"), optional: true, className: "narrow" }),
          numberField(fc, { label: "Default (empty: the user must give it)", path: path("default") }),
          numberField(fc, { label: "Smallest allowed", path: path("min"), className: "narrow" }),
          numberField(fc, { label: "Largest allowed", path: path("max"), className: "narrow" }),
          allowedField(fc, p, name),
        );
      }
    }
    return entryItem(
      fc,
      formatPath(["parameters", name]),
      entryName(doc, name, true),
      [removeNamed(fc, parameters, name, "parameter", "parameters")],
      isObject(p) ? entryFields(doc, ...fields) : notAList(doc, `fields of parameter ${name}`),
    );
  });
  return section(
    fc,
    "parameters",
    `Parameters (${items.length})`,
    "parameters",
    el(doc, "ul", { class: "entries" }, ...items),
    addNamed(fc, parameters, "parameters", "parameter", () => {
      if (!isObject(data.parameters)) data.parameters = parameters;
      return { type: "number", description: "" };
    }),
  );
}

/** Number or choice: switching starts the parameter afresh (keeping its description), so no field of the other kind lingers. */
function kindField(fc: FormContext, parameters: JsonObject, name: string, p: JsonObject): HTMLElement {
  const { doc } = fc;
  const path = ["parameters", name, "type"];
  const current = shownText(p.type);
  const words: Record<string, string> = { number: "number", choice: "choice (a named set of values, such as a category)" };
  const control = el(
    doc,
    "select",
    {},
    ...(PARAMETER_TYPES.includes(current) ? [] : [optionOf(doc, { value: current, label: `${current || "(none)"} (not a kind of the format)` })]),
    ...PARAMETER_TYPES.map((t) => optionOf(doc, { value: t, label: words[t] ?? t })),
  );
  control.value = current;
  control.addEventListener("change", () => {
    const description = p.description ?? "";
    parameters[name] =
      control.value === "choice" ? { type: "choice", description, default: "A", choices: { A: {} } } : { type: "number", description };
    fc.rebuild(`[data-control-for="${cssPath(path)}"]`);
  });
  return fieldShell(fc, { label: "Kind", path, className: "narrow" }, control);
}

/** "0.5, 1.0": the only values a number parameter may take. */
function allowedField(fc: FormContext, p: JsonObject, name: string): HTMLElement {
  return parsedField(fc, {
    label: "Only these values",
    path: ["parameters", name, "allowed"],
    text: Array.isArray(p.allowed) ? p.allowed.map(shownText).join(", ") : shownText(p.allowed),
    mono: true,
    hint: "numbers (decimals with a point), separated by ', ' or ';' — empty: any value in range",
    read: (typed) => {
      if (/\d,\d/.test(typed)) return { problem: `"${/\d,\d/.exec(typed)?.[0] ?? ""}": write decimals with a point and separate values with ", " or ";"` };
      const items = typed.split(/[,;]/).map((t) => t.trim()).filter((t) => t !== "");
      return {
        apply: () => {
          if (items.length === 0) delete p.allowed;
          else p.allowed = items.map((t) => (DECIMAL_TEXT.test(t) ? Number(t) : t));
          fc.changed();
        },
      };
    },
  });
}

/** A choice parameter's table of choices, as JSON: {"A": {"psi0_Q": 0.7, …}, …}. */
function choicesField(fc: FormContext, p: JsonObject, name: string): HTMLElement {
  return parsedField(fc, {
    label: "Choices (JSON: each choice sets the same named values)",
    path: ["parameters", name, "choices"],
    text: JSON.stringify(p.choices ?? {}, null, 1),
    multiline: true,
    mono: true,
    read: (typed) => {
      const parsed = parseJson(typed);
      if (!parsed.ok) return { problem: `not JSON: ${parsed.reason}` };
      return {
        apply: () => {
          p.choices = parsed.value;
          fc.changed();
        },
      };
    },
  });
}

function notesSection(fc: FormContext): HTMLElement {
  const { doc, data } = fc;
  if (data.notes !== undefined && !Array.isArray(data.notes)) return section(fc, "notes", "Notes", "notes", notAList(doc, "notes"));
  const notes: unknown[] = Array.isArray(data.notes) ? data.notes : [];
  const items = notes.map((_, i) =>
    entryItem(
      fc,
      `notes[${i}]`,
      entryName(doc, `Note ${i + 1}`),
      [
        entryButton(doc, "✕", `Remove note ${i + 1}`, () => {
          notes.splice(i, 1);
          fc.rebuild("#lw-add-note");
        }),
      ],
      textField(fc, { label: `Note ${i + 1}`, path: ["notes", i], multiline: true }),
    ),
  );
  return section(
    fc,
    "notes",
    `Notes (${notes.length})`,
    "notes",
    el(doc, "ol", { class: "entries" }, ...items),
    button(doc, "Add a note", () => {
      if (!Array.isArray(data.notes)) data.notes = notes;
      notes.push("");
      fc.rebuild(`[data-control-for="notes[${notes.length - 1}]"]`);
    }, { id: "lw-add-note" }),
  );
}

function provenanceSection(fc: FormContext): HTMLElement {
  const { doc, data } = fc;
  const list = data.provenance;
  if (!Array.isArray(list)) return section(fc, "provenance", "Provenance", "provenance", notAList(doc, "provenance"));
  const items = list.map((_, i) => {
    const path = (field: string) => ["provenance", i, field];
    return entryItem(
      fc,
      `provenance[${i}]`,
      entryName(doc, `Source ${i + 1}`),
      [
        entryButton(doc, "✕", `Remove source ${i + 1}`, () => {
          list.splice(i, 1);
          fc.rebuild("#lw-add-source");
        }),
      ],
      entryFields(
        doc,
        textField(fc, { label: "Source (standard, edition, clause or page)", path: path("source"), multiline: true }),
        textField(fc, { label: "Where a checker finds it (title, issuing body, address, clause)", path: path("locator"), optional: true, multiline: true }),
        textField(fc, { label: "Web address (https://…)", path: path("address"), optional: true }),
        textField(fc, { label: "Document number (ISBN, report or permit number)", path: path("document"), optional: true }),
        selectField(fc, {
          label: "Status",
          path: path("status"),
          options: provenanceStatusSchema.options.map((v) => ({ value: v, label: PROVENANCE_STATUS_WORDS[v] })),
        }),
        textField(fc, { label: "Covers", path: path("covers"), multiline: true }),
        combinationIdsField(fc, i),
        textField(fc, { label: "Note", path: path("note"), optional: true }),
      ),
    );
  });
  return section(
    fc,
    "provenance",
    `Provenance (${list.length})`,
    "provenance",
    el(doc, "p", { class: "hint" }, "Any source marked from memory shows the ruleset as UNVERIFIED wherever it is used."),
    el(doc, "ol", { class: "entries" }, ...items),
    button(doc, "Add a source", () => {
      list.push({ source: "", status: "from-memory", covers: "" });
      fc.rebuild(`[data-control-for="provenance[${list.length - 1}].source"]`);
    }, { id: "lw-add-source" }),
  );
}

/** "1, 2, 5": the ids of the combinations a source vouches for (or, from memory, leaves open); empty: not written. */
function combinationIdsField(fc: FormContext, index: number): HTMLElement {
  const entry = (fc.data.provenance as unknown[])[index];
  const current = isObject(entry) ? entry.combinations : undefined;
  return parsedField(fc, {
    label: "Combinations it covers (ids)",
    path: ["provenance", index, "combinations"],
    text: Array.isArray(current) ? current.map(shownText).join(", ") : shownText(current),
    mono: true,
    hint: "combination ids separated by ',' — empty: not listed",
    read: (typed) => {
      const ids = typed
        .split(",")
        .map((t) => t.trim())
        .filter((t) => t !== "");
      return {
        apply: () => {
          if (!isObject(entry)) return fc.changed();
          if (ids.length === 0) delete entry.combinations;
          else entry.combinations = ids;
          fc.changed();
        },
      };
    },
  });
}

function approvalSection(fc: FormContext): HTMLElement {
  const { doc, data } = fc;
  const a = isObject(data.approval) ? data.approval : {};
  const text = a.fingerprint
    ? `Recorded: approved by ${shownText(a.approvedBy) || "(no name)"} on ${shownText(a.date) || "(no date)"}, fingerprint ${shownText(a.fingerprint).slice(0, 12)}${a.note ? `; note: ${shownText(a.note)}` : ""}.`
    : "Not approved.";
  return section(fc, "approval", "Approval", "approval", el(doc, "p", {}, text), el(doc, "p", { class: "hint" }, "Written only by Approve, for one exact content; this view does not edit it."));
}
