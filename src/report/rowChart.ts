/**
 * One result's factored value in every concrete row, as a bar chart drawn in
 * SVG by the report itself: rows in listing order along the bottom, grouped by
 * combination (its id under each group), values up the side on a scale of
 * round numbers with zero drawn across. Bars are grey; the row giving the
 * largest value and the one giving the smallest are black, pointed at by ▼
 * above and ▲ below, and named under the chart with their values — so the chart reads the same printed in grey scale.
 * Every name in it is text, escaped.
 */
import { el, raw, type Html } from "./html.js";
import { computedText, givenText } from "./reportNumbers.js";

export interface ChartRow {
  label: string;
  combination: string;
  value: number;
}

export interface ChartOptions {
  title: string;
  digits: number;
  /** The rows the envelope names for the largest and smallest value. */
  maxLabel: string;
  minLabel: string;
}

const WIDTH = 680;
const HEIGHT = 190;
const LEFT = 64;
const RIGHT = 12;
const TOP = 14;
const BOTTOM = 38;

/** Round steps (1, 2, 2.5, 5 × 10ⁿ) covering [low, high] in about five intervals, zero included. */
export function axisTicks(low: number, high: number): number[] {
  const lo = Math.min(0, low);
  const hi = Math.max(0, high);
  const span = hi - lo || Math.abs(hi) || 1;
  const rough = span / 5;
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * power).find((s) => s >= rough) ?? 10 * power;
  const first = Math.floor(lo / step) * step;
  const ticks: number[] = [];
  for (let t = first; t <= hi + step * 1e-9; t += step) ticks.push(Math.abs(t) < step * 1e-9 ? 0 : Number(t.toPrecision(12)));
  if (ticks[ticks.length - 1] < hi) ticks.push(Number((ticks[ticks.length - 1] + step).toPrecision(12)));
  return ticks;
}

export function rowChart(rows: readonly ChartRow[], options: ChartOptions): Html {
  const values = rows.map((r) => r.value);
  const ticks = axisTicks(values.reduce((a, v) => Math.min(a, v), Infinity), values.reduce((a, v) => Math.max(a, v), -Infinity));
  const low = ticks[0];
  const high = ticks[ticks.length - 1];
  const plotWidth = WIDTH - LEFT - RIGHT;
  const plotHeight = HEIGHT - TOP - BOTTOM;
  const y = (v: number) => TOP + ((high - v) / (high - low || 1)) * plotHeight;
  const slot = plotWidth / Math.max(1, rows.length);
  const barWidth = Math.max(0.6, slot * 0.78);
  const zero = y(0);
  const maxIndex = rows.findIndex((r) => r.label === options.maxLabel);
  const minIndex = rows.findIndex((r) => r.label === options.minLabel);

  const parts: Html[] = [];
  // Scale: grid lines at round values, zero heavier.
  for (const t of ticks) {
    const ty = y(t).toFixed(2);
    parts.push(el("line", { x1: LEFT, x2: WIDTH - RIGHT, y1: ty, y2: ty, class: t === 0 ? "zero" : "grid" }));
    parts.push(el("text", { x: LEFT - 6, y: (y(t) + 3.5).toFixed(2), class: "tick", "text-anchor": "end" }, givenText(t)));
  }
  // Bars, and the combination groups below them.
  let groupStart = 0;
  rows.forEach((r, k) => {
    const x = LEFT + k * slot + (slot - barWidth) / 2;
    const top = Math.min(y(r.value), zero);
    const height = Math.max(Math.abs(y(r.value) - zero), 0.4);
    const mark = k === maxIndex ? "bar max" : k === minIndex ? "bar min" : "bar";
    parts.push(el("rect", { x: x.toFixed(2), y: top.toFixed(2), width: barWidth.toFixed(2), height: height.toFixed(2), class: mark }, el("title", null, `${r.label}: ${computedText(r.value, options.digits)}`)));
    const last = k === rows.length - 1 || rows[k + 1].combination !== r.combination;
    if (last) {
      const x0 = LEFT + groupStart * slot;
      const x1 = LEFT + (k + 1) * slot;
      parts.push(el("line", { x1: x0.toFixed(2), x2: x0.toFixed(2), y1: HEIGHT - BOTTOM, y2: HEIGHT - BOTTOM + 6, class: "axis" }));
      if (x1 - x0 >= 9) parts.push(el("text", { x: ((x0 + x1) / 2).toFixed(2), y: HEIGHT - BOTTOM + 15, class: "group", "text-anchor": "middle" }, r.combination));
      groupStart = k + 1;
    }
  });
  // The extremes, marked above and below their bars.
  for (const [index, sign] of [
    [maxIndex, "max"],
    [minIndex, "min"],
  ] as const) {
    if (index < 0) continue;
    const cx = LEFT + index * slot + slot / 2;
    const v = rows[index].value;
    const tip = sign === "max" ? Math.min(y(v), zero) - 3 : Math.max(y(v), zero) + 3;
    const d = sign === "max" ? `M${cx - 4},${tip - 7} L${cx + 4},${tip - 7} L${cx},${tip} Z` : `M${cx - 4},${tip + 7} L${cx + 4},${tip + 7} L${cx},${tip} Z`;
    parts.push(el("path", { d, class: "marker" }));
  }
  parts.push(el("line", { x1: LEFT, x2: LEFT, y1: TOP, y2: HEIGHT - BOTTOM, class: "axis" }));
  parts.push(el("text", { x: LEFT + plotWidth / 2, y: HEIGHT - 4, class: "axis-title", "text-anchor": "middle" }, "combination rows in listing order, grouped by combination id"));
  parts.push(el("text", { x: 12, y: TOP + plotHeight / 2, class: "axis-title", "text-anchor": "middle", transform: `rotate(-90 12 ${TOP + plotHeight / 2})` }, "factored value"));

  return el(
    "svg",
    { xmlns: "http://www.w3.org/2000/svg", viewBox: `0 0 ${WIDTH} ${HEIGHT}`, role: "img", "aria-label": `${options.title}: factored value of every combination row`, class: "row-chart" },
    el("title", null, options.title),
    raw(parts.map((p) => p.html).join("")),
  );
}
