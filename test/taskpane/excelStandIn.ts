/**
 * A stand-in for Office and Excel.run, installed in the page before the
 * add-in's script runs (page.addInitScript): Office.onReady answers "Excel",
 * the document settings keep the stored rulesets in memory, and Excel.run
 * hands the batch a request context over a small workbook of the test's own.
 * It records every call the add-in makes (run, load, sync, each range
 * asked for, each write, clear and calculation) and keeps the platform's
 * rules that a real workbook would enforce on the add-in:
 *
 * - a property is readable only after load() and a context.sync()
 *   (https://learn.microsoft.com/office/dev/add-ins/develop/application-specific-api-model,
 *   "load" and "sync"); isNullObject only after a sync;
 * - writes, clears and calculations take effect at context.sync();
 * - a value written through `formulas` is read as Excel reads typed input
 *   (Range.formulas and Range.values, learn.microsoft.com/javascript/api/excel/excel.range):
 *   "=…" a formula, and a string starting with "+" or "-" a formula too; a
 *   number-like string a number, TRUE/FALSE a boolean; a leading apostrophe
 *   keeps the rest as text; "" empties the cell;
 * - an empty cell's value is "" (Range.values).
 *
 * Nothing here computes a formula: the test evaluates the recorded formulas
 * itself, through the formula layer. The function is self-contained because
 * it is sent to the browser as source.
 */

export interface StandInSeed {
  /** Sheet name → A1 address → a constant (a formula as "=…"). */
  sheets: Record<string, Record<string, string | number | boolean>>;
  active: string;
  /** The selection, as `Sheet!A1:B3`. */
  selection: string;
  /** Defined names → `Sheet!A1:B3`. */
  names?: Record<string, string>;
  /** Document settings (the stored rulesets live under "loadwright.rulesets"). */
  settings?: Record<string, string>;
}

export interface StandInCell {
  value: string | number | boolean;
  formula: string;
}

export interface StandInRecord {
  /** Every call in order: "run", "load Range …", "sync", "getRange Loads!A1:B3", "formulas Loads!D2:E2", "clear …", "calculate Full", "settings.saveAsync" … */
  calls: string[];
  writes: { sheet: string; address: string; formulas: unknown[][] }[];
  clears: { sheet: string; address: string; applyTo: string }[];
  calculations: string[];
  /** Formatting set on a written cell: address → "bold" or a colour. */
  formats: Record<string, string>;
}

declare global {
  interface Window {
    __standIn: {
      record: StandInRecord;
      sheets: Record<string, Record<string, StandInCell>>;
      names: Record<string, string>;
      settings: Record<string, string>;
      /** The document's copy of the settings: what the last successful saveAsync persisted. */
      savedSettings: Record<string, string>;
      /**
       * Steps of the next settings writes to fail, in the order they are met: "set throws", "remove throws",
       * "saveAsync throws" (at once), "saveAsync fails later" (in its callback, with a failed status).
       */
      failing: string[];
      select(address: string): void;
    };
  }
}

export function installExcelStandIn(seed: StandInSeed): void {
  type Cell = { value: string | number | boolean; formula: string };
  type Area = { sheet: string; top: number; left: number; rows: number; columns: number };
  const record: StandInRecord = { calls: [], writes: [], clears: [], calculations: [], formats: {} };
  const sheets: Record<string, Record<string, Cell>> = {};
  const names: Record<string, string> = { ...(seed.names ?? {}) };
  const settings: Record<string, string> = { ...(seed.settings ?? {}) };
  const savedSettings: Record<string, string> = { ...settings };
  const failing: string[] = [];
  const failsNow = (step: string) => failing[0] === step && failing.shift() === step;
  let active = seed.active;
  let selection = seed.selection;

  const letters = (column: number) => {
    let n = column + 1;
    let s = "";
    while (n > 0) {
      const r = (n - 1) % 26;
      s = String.fromCharCode(65 + r) + s;
      n = Math.floor((n - 1) / 26);
    }
    return s;
  };
  const columnOf = (text: string) => [...text.toUpperCase()].reduce((n, ch) => n * 26 + ch.charCodeAt(0) - 64, 0) - 1;
  const a1 = (row: number, column: number) => `${letters(column)}${row + 1}`;
  const quoted = (sheet: string) => (/^[A-Za-z_][A-Za-z0-9_]*$/.test(sheet) ? sheet : `'${sheet.replace(/'/g, "''")}'`);
  const areaText = (a: Area) => `${a1(a.top, a.left)}${a.rows === 1 && a.columns === 1 ? "" : `:${a1(a.top + a.rows - 1, a.left + a.columns - 1)}`}`;
  /** "A1", "A1:B3", "$A$1:$B$3", optionally after "Sheet!" or "'My sheet'!". */
  const parse = (text: string, sheet: string | null): Area => {
    const m = /^(?:('(?:[^']|'')+'|[^'!]+)!)?\$?([A-Za-z]{1,3})\$?(\d+)(?::\$?([A-Za-z]{1,3})\$?(\d+))?$/.exec(text.trim());
    if (!m) throw new Error(`InvalidArgument: the address "${text}" is not valid`);
    const on = m[1] ? (m[1].startsWith("'") ? m[1].slice(1, -1).replace(/''/g, "'") : m[1]) : sheet;
    if (on === null) throw new Error(`InvalidArgument: the address "${text}" names no sheet`);
    const r1 = Number(m[3]) - 1;
    const c1 = columnOf(m[2]);
    const r2 = m[5] ? Number(m[5]) - 1 : r1;
    const c2 = m[4] ? columnOf(m[4]) : c1;
    return { sheet: on, top: Math.min(r1, r2), left: Math.min(c1, c2), rows: Math.abs(r2 - r1) + 1, columns: Math.abs(c2 - c1) + 1 };
  };
  /** What Excel makes of one entry written through Range.formulas. */
  const typed = (input: unknown): Cell | null => {
    if (typeof input === "number" || typeof input === "boolean") return { value: input, formula: "" };
    const s = String(input);
    if (s === "") return null;
    if (s.startsWith("'")) return { value: s.slice(1), formula: "" };
    if (/^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(s)) return { value: Number(s), formula: "" };
    if (/^(TRUE|FALSE)$/i.test(s)) return { value: s.toUpperCase() === "TRUE", formula: "" };
    if (s.startsWith("=") || s.startsWith("+") || s.startsWith("-")) return { value: "", formula: s.startsWith("=") ? s : `=${s}` };
    return { value: s, formula: "" };
  };
  for (const [name, cells] of Object.entries(seed.sheets)) {
    sheets[name] = {};
    for (const [address, v] of Object.entries(cells)) {
      const cell = typed(v);
      if (cell) sheets[name][address] = cell;
    }
  }

  const notLoaded = (type: string, property: string) =>
    new Error(`PropertyNotLoaded: the property '${property}' of ${type} is not available. Before reading the property's value, call the load method on the containing object and call "context.sync()".`);

  class Context {
    queue: (() => void)[] = [];
    proxies: Proxied[] = [];
    workbook: Workbook;
    constructor() {
      this.workbook = new Workbook(this);
    }
    sync(): Promise<void> {
      record.calls.push("sync");
      const queue = this.queue;
      this.queue = [];
      try {
        for (const step of queue) step();
      } catch (e) {
        return Promise.reject(e);
      }
      for (const p of this.proxies) p.synced();
      return Promise.resolve();
    }
  }

  /** A proxy whose properties become readable after load() and a sync. */
  class Proxied {
    pending = new Set<string>();
    loaded = new Set<string>();
    syncedOnce = false;
    constructor(
      readonly context: Context,
      readonly kind: string,
    ) {
      context.proxies.push(this);
    }
    load(what: string | string[]): this {
      const list = Array.isArray(what) ? what : what.split(",").map((s) => s.trim());
      record.calls.push(`load ${this.kind} ${list.join(",")}`);
      for (const p of list) this.pending.add(p.split("/")[0]);
      return this;
    }
    synced(): void {
      for (const p of this.pending) this.loaded.add(p);
      this.pending.clear();
      this.syncedOnce = true;
    }
    need(property: string): void {
      if (!this.loaded.has(property)) throw notLoaded(this.kind, property);
    }
    get isNullObject(): boolean {
      if (!this.syncedOnce) throw notLoaded(this.kind, "isNullObject");
      return this.missing();
    }
    missing(): boolean {
      return false;
    }
  }

  class Workbook {
    worksheets: Worksheets;
    names: Names;
    application: Application;
    constructor(readonly context: Context) {
      this.worksheets = new Worksheets(context);
      this.names = new Names(context);
      this.application = new Application(context);
    }
    getSelectedRange(): Range {
      record.calls.push("getSelectedRange");
      return new Range(this.context, () => parse(selection, active));
    }
  }

  class Application {
    constructor(readonly context: Context) {}
    calculate(type: string): void {
      record.calls.push(`calculate ${type}`);
      this.context.queue.push(() => record.calculations.push(type));
    }
  }

  class Worksheets extends Proxied {
    constructor(context: Context) {
      super(context, "WorksheetCollection");
    }
    get items(): { name: string }[] {
      this.need("items");
      return Object.keys(sheets).map((name) => ({ name }));
    }
    getItemOrNullObject(name: string): Worksheet {
      record.calls.push(`worksheets.getItemOrNullObject ${name}`);
      return new Worksheet(this.context, () => Object.keys(sheets).find((s) => s.toLowerCase() === name.toLowerCase()) ?? null);
    }
    getActiveWorksheet(): Worksheet {
      record.calls.push("worksheets.getActiveWorksheet");
      return new Worksheet(this.context, () => active);
    }
    add(name: string): Worksheet {
      record.calls.push(`worksheets.add ${name}`);
      this.context.queue.push(() => {
        if (Object.keys(sheets).some((s) => s.toLowerCase() === name.toLowerCase())) throw new Error(`ItemAlreadyExists: a worksheet named "${name}" exists`);
        sheets[name] = {};
      });
      return new Worksheet(this.context, () => (name in sheets ? name : null));
    }
  }

  class Worksheet extends Proxied {
    constructor(
      context: Context,
      readonly resolve: () => string | null,
    ) {
      super(context, "Worksheet");
    }
    override missing(): boolean {
      return this.resolve() === null;
    }
    get name(): string {
      this.need("name");
      return this.resolve() ?? "";
    }
    getRange(address: string): Range {
      record.calls.push(`getRange ${this.resolve() ?? "?"}!${address}`);
      return new Range(this.context, () => parse(address, this.resolve()));
    }
    activate(): void {
      record.calls.push(`activate ${this.resolve() ?? "?"}`);
      this.context.queue.push(() => {
        active = this.resolve() ?? active;
      });
    }
  }

  class Names {
    constructor(readonly context: Context) {}
    getItemOrNullObject(name: string): NamedItem {
      record.calls.push(`names.getItemOrNullObject ${name}`);
      return new NamedItem(this.context, name);
    }
  }

  class NamedItem extends Proxied {
    constructor(
      context: Context,
      readonly key: string,
    ) {
      super(context, "NamedItem");
    }
    override missing(): boolean {
      return !(this.key in names);
    }
    get name(): string {
      this.need("name");
      return this.key;
    }
    get type(): string {
      this.need("type");
      return "Range";
    }
    getRange(): Range {
      record.calls.push(`names.getRange ${this.key}`);
      return new Range(this.context, () => parse(names[this.key], null));
    }
  }

  class Range extends Proxied {
    format: { font: { bold: boolean; color: string } };
    constructor(
      context: Context,
      readonly area: () => Area,
    ) {
      super(context, "Range");
      const note = (what: string) => context.queue.push(() => (record.formats[`${area().sheet}!${areaText(area())}`] = what));
      this.format = {
        font: {
          set bold(_v: boolean) {
            note("bold");
          },
          set color(v: string) {
            note(v);
          },
          get bold(): boolean {
            throw notLoaded("RangeFont", "bold");
          },
          get color(): string {
            throw notLoaded("RangeFont", "color");
          },
        },
      };
    }
    /** A navigation property: the same proxy each time, as Office.js gives it. */
    private sheetProxy: Worksheet | null = null;
    get worksheet(): Worksheet {
      this.sheetProxy ??= new Worksheet(this.context, () => this.area().sheet);
      return this.sheetProxy;
    }
    get address(): string {
      this.need("address");
      const a = this.area();
      return `${quoted(a.sheet)}!${areaText(a)}`;
    }
    get rowIndex(): number {
      this.need("rowIndex");
      return this.area().top;
    }
    get columnIndex(): number {
      this.need("columnIndex");
      return this.area().left;
    }
    get rowCount(): number {
      this.need("rowCount");
      return this.area().rows;
    }
    get columnCount(): number {
      this.need("columnCount");
      return this.area().columns;
    }
    cells(pick: (c: Cell | undefined) => string | number | boolean): (string | number | boolean)[][] {
      const a = this.area();
      const sheet = sheets[a.sheet] ?? {};
      return Array.from({ length: a.rows }, (_, r) => Array.from({ length: a.columns }, (_, c) => pick(sheet[a1(a.top + r, a.left + c)])));
    }
    get values(): (string | number | boolean)[][] {
      this.need("values");
      return this.cells((c) => (c ? c.value : ""));
    }
    get formulas(): (string | number | boolean)[][] {
      this.need("formulas");
      return this.cells((c) => (c ? c.formula || c.value : ""));
    }
    set formulas(matrix: (string | number | boolean)[][]) {
      const a = this.area();
      record.calls.push(`formulas ${a.sheet}!${areaText(a)}`);
      if (matrix.length !== a.rows || matrix.some((row) => row.length !== a.columns)) throw new Error(`InvalidArgument: ${matrix.length} rows written to ${areaText(a)}`);
      this.context.queue.push(() => {
        const sheet = sheets[a.sheet];
        if (!sheet) throw new Error(`ItemNotFound: no worksheet "${a.sheet}"`);
        record.writes.push({ sheet: a.sheet, address: areaText(a), formulas: matrix.map((row) => [...row]) });
        matrix.forEach((row, r) =>
          row.forEach((input, c) => {
            const cell = typed(input);
            const key = a1(a.top + r, a.left + c);
            if (cell) sheet[key] = cell;
            else delete sheet[key];
          }),
        );
      });
    }
    clear(applyTo: string): void {
      const a = this.area();
      record.calls.push(`clear ${a.sheet}!${areaText(a)} ${applyTo}`);
      this.context.queue.push(() => {
        record.clears.push({ sheet: a.sheet, address: areaText(a), applyTo });
        const sheet = sheets[a.sheet] ?? {};
        for (let r = 0; r < a.rows; r++) for (let c = 0; c < a.columns; c++) delete sheet[a1(a.top + r, a.left + c)];
      });
    }
  }

  const w = window as unknown as Record<string, unknown>;
  w.Office = {
    HostType: { Excel: "Excel" },
    AsyncResultStatus: { Succeeded: "succeeded", Failed: "failed" },
    onReady: () => Promise.resolve({ host: "Excel", platform: "PC" }),
    context: {
      document: {
        settings: {
          get: (key: string) => settings[key] ?? null,
          set: (key: string, value: string) => {
            record.calls.push("settings.set");
            if (failsNow("set throws")) throw new Error("the settings cannot be changed now");
            settings[key] = value;
          },
          remove: (key: string) => {
            record.calls.push("settings.remove");
            if (failsNow("remove throws")) throw new Error("the setting cannot be removed now");
            delete settings[key];
          },
          saveAsync: (callback: (r: { status: string; error?: { message: string } }) => void) => {
            record.calls.push("settings.saveAsync");
            if (failsNow("saveAsync throws")) throw new Error("the document is busy");
            if (failsNow("saveAsync fails later")) {
              setTimeout(() => callback({ status: "failed", error: { message: "the document is read-only" } }), 0);
              return;
            }
            setTimeout(() => {
              for (const k of Object.keys(savedSettings)) delete savedSettings[k];
              Object.assign(savedSettings, settings);
              callback({ status: "succeeded" });
            }, 0);
          },
        },
      },
    },
  };
  w.Excel = {
    CalculationType: { full: "Full", recalculate: "Recalculate", fullRebuild: "FullRebuild" },
    ClearApplyTo: { all: "All", formats: "Formats", contents: "Contents" },
    NamedItemType: { range: "Range", string: "String", double: "Double", boolean: "Boolean", error: "Error", array: "Array", integer: "Integer" },
    run: async <T>(batch: (context: Context) => Promise<T>): Promise<T> => {
      record.calls.push("run");
      return batch(new Context());
    },
  };
  window.__standIn = {
    record,
    sheets,
    names,
    settings,
    savedSettings,
    failing,
    select: (address: string) => {
      selection = address;
    },
  };
}
