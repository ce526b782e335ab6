/**
 * The report's style sheet: one column of text for A4 and Letter alike (the
 * narrower page, less margins), serif text and tabular figures, numbers right
 * aligned, every section after the first page starting on a page of its own,
 * table headers repeated on every page a table runs onto, derivations and
 * charts kept whole, and a running footer naming the ruleset's status and
 * fingerprint with the page number. Only black, white and greys: it prints the
 * same on any printer.
 */
import { cssString } from "./html.js";

export function reportStyle(footer: string): string {
  return `
@page { margin: 16mm 14mm 18mm 14mm;
  @bottom-left { content: ${cssString(footer)}; font: 7.5pt/1.2 "DejaVu Sans", Arial, sans-serif; color: #333; }
  @bottom-right { content: "page " counter(page) " of " counter(pages); font: 7.5pt/1.2 "DejaVu Sans", Arial, sans-serif; color: #333; } }
:root { color: #000; background: #fff; }
body { font: 9.5pt/1.35 "DejaVu Serif", Georgia, serif; margin: 0 auto; max-width: 182mm; padding: 8mm 0; }
@media print { body { padding: 0; max-width: none; } }
h1 { font: bold 17pt/1.2 "DejaVu Sans", Arial, sans-serif; margin: 0 0 2mm; }
h2 { font: bold 12pt/1.2 "DejaVu Sans", Arial, sans-serif; margin: 6mm 0 2mm; border-bottom: 0.6pt solid #000; padding-bottom: 1mm; break-after: avoid; }
h3 { font: bold 10pt/1.2 "DejaVu Sans", Arial, sans-serif; margin: 4mm 0 1.5mm; break-after: avoid; }
p { margin: 1.5mm 0; }
section.page { break-before: page; }
.title-block { border: 1.2pt solid #000; padding: 3mm 4mm; margin-bottom: 4mm; }
.title-block dl, .facts { display: grid; grid-template-columns: max-content 1fr; gap: 0.8mm 5mm; margin: 0; }
dt { font-weight: bold; } dd { margin: 0; overflow-wrap: anywhere; }
.status { border: 1.2pt solid #000; padding: 2mm 3mm; margin: 2mm 0; font: bold 10pt/1.3 "DejaVu Sans", Arial, sans-serif; }
.status.alarm { border-width: 2.4pt; background: #e6e6e6; }
.fingerprint { font: 8pt/1.3 "DejaVu Sans Mono", monospace; overflow-wrap: anywhere; }
ul.memory, ul.cautions, ul.notes { margin: 1mm 0; padding-left: 5mm; }
table { border-collapse: collapse; margin: 2mm 0; font-size: 8.5pt; }
table.wide { font-size: 7.5pt; }
thead { display: table-header-group; }
th, td { border: 0.4pt solid #777; padding: 0.6mm 1.4mm; vertical-align: top; }
th { background: #e6e6e6; font: bold 8pt/1.2 "DejaVu Sans", Arial, sans-serif; text-align: left; }
th.num, td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
td.zero { color: #888; }
tr { break-inside: avoid; }
tr.group th { background: #f3f3f3; font-weight: normal; }
td.label { font-family: "DejaVu Sans", Arial, sans-serif; font-size: 7.5pt; }
.summary { border-left: 2pt solid #000; padding-left: 2mm; }
.derivation { break-inside: avoid; border: 0.6pt solid #000; padding: 1.5mm 3mm; margin: 3mm 0; }
.derivation table { margin: 1mm 0; }
.derivation .sum td { border-top: 1.2pt solid #000; font-weight: bold; }
figure { break-inside: avoid; margin: 3mm 0 5mm; }
figcaption { font: 8.5pt/1.3 "DejaVu Sans", Arial, sans-serif; margin-top: 1mm; }
svg.row-chart { width: 100%; height: auto; display: block; }
svg .bar { fill: #a6a6a6; } svg .bar.max, svg .bar.min { fill: #000; }
svg .grid { stroke: #d0d0d0; stroke-width: 0.5; } svg .zero, svg .axis { stroke: #000; stroke-width: 0.8; }
svg .marker { fill: #000; }
svg text { font: 8px "DejaVu Sans", Arial, sans-serif; fill: #000; } svg .axis-title { font-size: 8.5px; }
`;
}
