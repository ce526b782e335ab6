/**
 * The add-in only XML manifest's rules, written from the platform's manifest
 * reference: for each element the children it may have, in the order they
 * must appear, the children and attributes it must have, and the resources
 * its resid attributes name. Each rule carries the address of the page it was
 * written from. The platform's downloadable XSD schemas predate the shared
 * runtime (<Runtimes>), so the manifest is held to these pages instead.
 *
 * Pages (learn.microsoft.com):
 *   ORDER    /office/dev/add-ins/develop/manifest-element-ordering — "the manifest elements in the order
 *            in which they must appear" (task pane add-in, and within VersionOverrides)
 *   OWEMXML  /openspecs/office_file_formats/ms-owemxml/514d1f0e-5775-49cd-82ee-44ccbb02ade0 — [MS-OWEMXML]
 *            2.2 Host: sequence Runtimes, AllFormFactors; a host type (Workbook) extends it with
 *            DesktopFormFactor after them
 *   manifest/<element> — /javascript/api/manifest/<element>, the element's own page
 */

export const ORDER = "https://learn.microsoft.com/office/dev/add-ins/develop/manifest-element-ordering";
export const OWEMXML_HOST = "https://learn.microsoft.com/openspecs/office_file_formats/ms-owemxml/514d1f0e-5775-49cd-82ee-44ccbb02ade0";
export const page = (element: string) => `https://learn.microsoft.com/javascript/api/manifest/${element}`;

export const NS = {
  app: "http://schemas.microsoft.com/office/appforoffice/1.1",
  overrides: "http://schemas.microsoft.com/office/taskpaneappversionoverrides",
  basicTypes: "http://schemas.microsoft.com/office/officeappbasictypes/1.0",
  xsi: "http://www.w3.org/2001/XMLSchema-instance",
} as const;

export interface ElementRule {
  /** The children it may have, in the order they must appear; names in one inner list may mix. */
  children: (string | string[])[];
  /** Children it must have. */
  required?: string[];
  /** The most of a child it may have. */
  most?: Record<string, number>;
  /** Attributes it must have (xsi:type written so), with the values allowed where the page lists them. */
  attributes?: Record<string, readonly string[] | null>;
  /** Text content it must have, from a list where the page gives one. */
  text?: readonly string[] | "any";
  /** Where the rule is written from. */
  source: string[];
}

const EXCEL_TABS = ["TabHome", "TabInsert", "TabPageLayoutExcel", "TabFormulas", "TabData", "TabReview", "TabView", "TabDeveloper", "TabAddIns", "TabPrintPreview", "TabBackgroundRemoval"];
const leaf = (source: string[], attributes?: ElementRule["attributes"]): ElementRule => ({ children: [], source, ...(attributes ? { attributes } : {}) });
const withDefault = (element: string): ElementRule => ({ children: ["Override"], attributes: { DefaultValue: null }, source: [page(element), ORDER] });
const residLeaf = (...source: string[]): ElementRule => leaf(source, { resid: null });

/**
 * Rules by the element's place: the longest matching suffix of its ancestry
 * ("Supertip>Title", then "Title") is the rule that applies. An element with
 * no rule fails the check, so a new element needs its page read first.
 */
export const RULES: Record<string, ElementRule> = {
  OfficeApp: {
    children: ["Id", "AlternateId", "Version", "ProviderName", "DefaultLocale", "DisplayName", "Description", "IconUrl", "HighResolutionIconUrl", "SupportUrl", "AppDomains", "Hosts", "Requirements", "DefaultSettings", "Permissions", "Dictionary", "VersionOverrides", "ExtendedOverrides"],
    // "Must contain", TaskPane column.
    required: ["Id", "Version", "ProviderName", "DefaultLocale", "DefaultSettings", "DisplayName", "Description", "Permissions"],
    attributes: { "xsi:type": ["TaskPaneApp"] },
    source: [page("officeapp"), ORDER],
  },
  Id: { children: [], text: "any", source: [page("officeapp"), ORDER] },
  Version: { children: [], text: "any", source: [page("officeapp"), ORDER] },
  ProviderName: { children: [], text: "any", source: [page("officeapp"), ORDER] },
  DefaultLocale: { children: [], text: "any", source: [page("officeapp"), ORDER] },
  "OfficeApp>DisplayName": withDefault("displayname"),
  "OfficeApp>Description": withDefault("officeapp"),
  IconUrl: withDefault("officeapp"),
  HighResolutionIconUrl: withDefault("officeapp"),
  SupportUrl: { children: [], attributes: { DefaultValue: null }, source: [page("officeapp"), ORDER] },
  "OfficeApp>Hosts": { children: ["Host"], required: ["Host"], source: [page("hosts"), ORDER] },
  "OfficeApp>Hosts>Host": leaf([page("host")], { Name: ["Document", "Database", "Mailbox", "Notebook", "Presentation", "Project", "Workbook"] }),
  "OfficeApp>Requirements": { children: ["Sets", "Methods"], source: [page("requirements"), ORDER] },
  Sets: { children: ["Set"], required: ["Set"], source: [page("requirements"), page("set"), ORDER] },
  Set: leaf([page("set")], { Name: null }),
  // "Can contain", TaskPane column: SourceLocation only (RequestedWidth and RequestedHeight are for content add-ins).
  DefaultSettings: { children: ["SourceLocation"], required: ["SourceLocation"], source: [page("defaultsettings"), ORDER] },
  "DefaultSettings>SourceLocation": { children: ["Override"], attributes: { DefaultValue: null }, source: [page("defaultsettings"), ORDER] },
  Permissions: { children: [], text: ["Restricted", "ReadDocument", "ReadAllDocument", "WriteDocument", "ReadWriteDocument"], source: [page("permissions")] },

  // VersionOverrides 1.0 of a task pane add-in.
  VersionOverrides: {
    children: ["Description", "Requirements", "Hosts", "Resources", "WebApplicationInfo", "EquivalentAddins", "VersionOverrides"],
    required: ["Hosts", "Resources"],
    attributes: { "xsi:type": ["VersionOverridesV1_0"] },
    source: [page("versionoverrides-1-0-taskpane"), page("versionoverrides"), ORDER],
  },
  "VersionOverrides>Hosts": { children: ["Host"], required: ["Host"], source: [page("hosts"), ORDER] },
  "VersionOverrides>Hosts>Host": {
    children: ["Runtimes", "AllFormFactors", "DesktopFormFactor", "MobileFormFactor"],
    required: ["DesktopFormFactor"],
    attributes: { "xsi:type": ["Document", "MailHost", "Notebook", "Presentation", "Workbook"] },
    source: [page("host"), OWEMXML_HOST, ORDER],
  },
  Runtimes: { children: ["Runtime"], required: ["Runtime"], most: { Runtime: 1 }, source: [page("runtimes")] },
  // lifetime: "long" is the only value a shared runtime supports.
  Runtime: { children: ["Override"], attributes: { resid: null, lifetime: ["long"] }, source: [page("runtime")] },
  AllFormFactors: { children: ["ExtensionPoint"], required: ["ExtensionPoint"], source: [page("allformfactors"), ORDER] },
  "AllFormFactors>ExtensionPoint": {
    children: ["Script", "Page", "Metadata", "Namespace"],
    required: ["Script", "Page", "Metadata"],
    attributes: { "xsi:type": ["CustomFunctions"] },
    source: [page("extensionpoint"), ORDER],
  },
  Script: { children: ["SourceLocation"], required: ["SourceLocation"], source: [page("extensionpoint"), page("customfunctionssourcelocation"), ORDER] },
  Page: { children: ["SourceLocation"], required: ["SourceLocation"], source: [page("extensionpoint"), page("customfunctionssourcelocation"), ORDER] },
  Metadata: { children: ["SourceLocation"], required: ["SourceLocation"], source: [page("metadata"), ORDER] },
  "Script>SourceLocation": residLeaf(page("customfunctionssourcelocation")),
  "Page>SourceLocation": residLeaf(page("customfunctionssourcelocation")),
  "Metadata>SourceLocation": residLeaf(page("customfunctionssourcelocation")),
  Namespace: residLeaf(page("namespace")),
  DesktopFormFactor: { children: ["GetStarted", "FunctionFile", "ExtensionPoint", "SupportsSharedFolders"], required: ["ExtensionPoint"], source: [page("desktopformfactor"), ORDER] },
  GetStarted: { children: ["Title", "Description", "LearnMoreUrl"], required: ["Title", "Description", "LearnMoreUrl"], source: [page("getstarted"), ORDER] },
  "GetStarted>Title": residLeaf(page("getstarted")),
  "GetStarted>Description": residLeaf(page("getstarted")),
  "GetStarted>LearnMoreUrl": residLeaf(page("getstarted")),
  FunctionFile: residLeaf(page("functionfile")),
  "DesktopFormFactor>ExtensionPoint": {
    // OfficeTab or CustomTab, not both.
    children: [["OfficeTab", "CustomTab"]],
    most: { OfficeTab: 1, CustomTab: 1 },
    attributes: { "xsi:type": ["PrimaryCommandSurface", "ContextMenu"] },
    source: [page("extensionpoint"), ORDER],
  },
  // "You can add only one group per add-in to the default tab."
  OfficeTab: { children: ["Group"], required: ["Group"], most: { Group: 1 }, attributes: { id: EXCEL_TABS }, source: [page("officetab")] },
  Group: {
    children: ["OverriddenByRibbonApi", "Label", "Icon", ["Control", "OfficeControl"]],
    required: ["Label", "Icon"],
    attributes: { id: null },
    source: [page("group"), ORDER],
  },
  "Group>Label": residLeaf(page("group")),
  Icon: { children: ["Image"], required: ["Image"], source: [page("icon")] },
  "Icon>Image": leaf([page("icon")], { size: ["16", "20", "24", "32", "40", "48", "64", "80"], resid: null }),
  Control: {
    children: ["OverriddenByRibbonApi", "Label", "ToolTip", "Supertip", "Icon", "Action", "Enabled"],
    required: ["Label", "Supertip", "Icon", "Action"],
    most: { Action: 1 },
    attributes: { "xsi:type": ["Button"], id: null },
    source: [page("control-button"), ORDER],
  },
  "Control>Label": residLeaf(page("control-button")),
  Supertip: { children: ["Title", "Description"], required: ["Title", "Description"], source: [page("supertip"), ORDER] },
  "Supertip>Title": residLeaf(page("supertip")),
  "Supertip>Description": residLeaf(page("supertip")),
  Action: {
    children: ["TaskpaneId", "SourceLocation", "Title"],
    required: ["SourceLocation"],
    attributes: { "xsi:type": ["ShowTaskpane"] },
    source: [page("action"), ORDER],
  },
  TaskpaneId: { children: [], text: "any", source: [page("action")] },
  "Action>SourceLocation": residLeaf(page("action")),
  Resources: { children: ["Images", "Urls", "ShortStrings", "LongStrings"], source: [page("resources"), ORDER] },
  Images: { children: ["Image"], source: [page("resources"), ORDER] },
  "Images>Image": { children: ["Override"], attributes: { id: null, DefaultValue: null }, source: [page("resources"), ORDER] },
  Urls: { children: ["Url"], source: [page("resources"), ORDER] },
  Url: { children: ["Override"], attributes: { id: null, DefaultValue: null }, source: [page("resources"), ORDER] },
  ShortStrings: { children: ["String"], source: [page("resources"), ORDER] },
  LongStrings: { children: ["String"], source: [page("resources"), ORDER] },
  String: { children: ["Override"], attributes: { id: null, DefaultValue: null }, source: [page("resources"), ORDER] },
};

/** Elements of the basic-types namespace (prefix bt) inside VersionOverrides; the rest there are in its own namespace. */
export const BASIC_TYPES = new Set(["Image", "Images", "Url", "Urls", "ShortStrings", "LongStrings", "String"]);

/** Which resource collection a resid names, by the element's place (each element's page, "resid … must be set to the id of …"). */
export const RESID_TARGETS: { place: string; collection: "Urls" | "ShortStrings" | "LongStrings" | "Images"; source: string }[] = [
  { place: "Runtime", collection: "Urls", source: page("runtime") },
  { place: "Script>SourceLocation", collection: "Urls", source: page("customfunctionssourcelocation") },
  { place: "Page>SourceLocation", collection: "Urls", source: page("customfunctionssourcelocation") },
  { place: "Metadata>SourceLocation", collection: "Urls", source: page("customfunctionssourcelocation") },
  { place: "Namespace", collection: "ShortStrings", source: page("namespace") },
  { place: "GetStarted>Title", collection: "ShortStrings", source: page("getstarted") },
  { place: "GetStarted>Description", collection: "LongStrings", source: page("getstarted") },
  { place: "GetStarted>LearnMoreUrl", collection: "Urls", source: page("getstarted") },
  { place: "FunctionFile", collection: "Urls", source: page("functionfile") },
  { place: "Group>Label", collection: "ShortStrings", source: page("group") },
  { place: "Control>Label", collection: "ShortStrings", source: page("control-button") },
  { place: "Supertip>Title", collection: "ShortStrings", source: page("supertip") },
  { place: "Supertip>Description", collection: "LongStrings", source: page("supertip") },
  { place: "Icon>Image", collection: "Images", source: page("icon") },
  { place: "Action>SourceLocation", collection: "Urls", source: page("action") },
];

/**
 * Requirement sets the elements in use are associated with ("Associated with
 * these requirement sets" on each page), which the base manifest's
 * <Requirements> must declare at least at this version.
 */
export const ELEMENT_REQUIREMENTS: { place: string; set: string; version: string; source: string }[] = [
  { place: "Runtime", set: "SharedRuntime", version: "1.1", source: page("runtime") },
  { place: "Runtimes", set: "SharedRuntime", version: "1.1", source: page("runtimes") },
  // "AddinCommands 1.1 (Required for Excel, PowerPoint, and Word)".
  { place: "VersionOverrides", set: "AddinCommands", version: "1.1", source: page("versionoverrides-1-0-taskpane") },
  { place: "GetStarted", set: "AddinCommands", version: "1.1", source: page("getstarted") },
  { place: "OfficeTab", set: "AddinCommands", version: "1.1", source: page("officetab") },
  { place: "Group", set: "AddinCommands", version: "1.1", source: page("group") },
  { place: "Control", set: "AddinCommands", version: "1.1", source: page("control-button") },
  { place: "Action", set: "AddinCommands", version: "1.1", source: page("action") },
  { place: "Icon", set: "AddinCommands", version: "1.1", source: page("icon") },
  { place: "AllFormFactors", set: "CustomFunctionsRuntime", version: "1.1", source: page("allformfactors") },
  { place: "Script>SourceLocation", set: "CustomFunctionsRuntime", version: "1.1", source: page("customfunctionssourcelocation") },
  { place: "Page>SourceLocation", set: "CustomFunctionsRuntime", version: "1.1", source: page("customfunctionssourcelocation") },
];

/** Limits stated on the pages. */
export const LIMITS = {
  /** "resid … can be no more than 32 characters"; a resource "id must be unique … maximum of 32 characters" (Resources). */
  resid: 32,
  /** Resources: "A URL can have a maximum of 2048 characters"; every Image and Url over SSL. */
  url: 2048,
  /** Resources: ShortStrings "a maximum of 125 characters", LongStrings "a maximum of 250". */
  shortString: 125,
  longString: 250,
  /** DisplayName: "a string up to 125 characters long". */
  displayName: 125,
  /** Group: id "a string with a maximum of 125 characters". */
  groupId: 125,
} as const;
