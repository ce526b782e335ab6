/**
 * The bench's analysis exports: cases as columns, one result row per member ×
 * station × component, values INVENTED by a generator with a fixed seed, so
 * every run reads the same files. Two sets of 16 case headers: one for the
 * ASCE/SEI 7-16 strength list (two dead load cases, L, Lr, S, R, eight wind
 * directions, seismic x and y) and one for EN 1990 (6.10) with four variable
 * actions (two permanent cases; Q, S and T two cases each; eight wind
 * directions).
 */
import { createWriteStream } from "node:fs";

const DIRECTIONS = ["N", "NE", "E", "SE", "S", "SW", "W", "NW"];
export const ASCE_CASES = ["D", "D:superimposed", "L", "Lr", "S", "R", ...DIRECTIONS.map((d) => `W:${d}`), "E:x", "E:y"];
export const EN1990_CASES = ["G", "G:superimposed", "Q:office", "Q:storage", "S:drift", "S:even", "T:summer", "T:winter", ...DIRECTIONS.map((d) => `W:${d}`)];
const COMPONENTS = ["N", "Vy", "Vz", "T", "My", "Mz"];

/** A small deterministic generator (mulberry32). */
export function generator(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Writes `rows` result rows under `cases`; permanent cases (the first two) lean positive. */
export async function writeExport(path: string, cases: readonly string[], rows: number, seed = 20261203): Promise<void> {
  const random = generator(seed);
  const out = createWriteStream(path);
  const write = (text: string) => (out.write(text) ? Promise.resolve() : new Promise<void>((r) => out.once("drain", () => r())));
  await write(`result,${cases.join(",")}\n`);
  let chunk = "";
  for (let i = 0; i < rows; i++) {
    const member = Math.floor(i / (COMPONENTS.length * 5)) + 1;
    const station = Math.floor(i / COMPONENTS.length) % 5;
    let line = `M${member} s${station} ${COMPONENTS[i % COMPONENTS.length]}`;
    for (let k = 0; k < cases.length; k++) line += `,${((random() - (k < 2 ? 0.2 : 0.5)) * 200).toFixed(2)}`;
    chunk += `${line}\n`;
    if (chunk.length > 1 << 16) {
      await write(chunk);
      chunk = "";
    }
  }
  await write(chunk);
  await new Promise<void>((resolve, reject) => out.end((e?: Error | null) => (e ? reject(e) : resolve())));
}
