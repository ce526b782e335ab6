/**
 * Load symbols a ruleset typed into cells may use. The letters are those the
 * codes print (ASCE/SEI 7 §2.2, EN 1990 §1.6, NBCC 4.1.2); which are permanent and
 * which act both ways is common practice (no source). A file ruleset declares its
 * own symbols instead.
 */
import type { SymbolFile } from "./schema.js";

const permanent = (description: string): SymbolFile => ({ description, permanence: "permanent" });
const transient = (description: string, reversible = false): SymbolFile =>
  reversible ? { description, permanence: "transient", reversible } : { description, permanence: "transient" };

export const SYMBOL_CATALOGUE: Readonly<Record<string, SymbolFile>> = {
  D: permanent("dead load"),
  G: permanent("permanent action"),
  F: permanent("load due to fluids with well-defined pressures and maximum heights"),
  H: permanent("lateral earth pressure, ground water pressure or pressure of bulk materials"),
  P: permanent("prestressing"),
  L: transient("live load"),
  Lr: transient("roof live load"),
  Q: transient("variable (imposed) action"),
  S: transient("snow load"),
  R: transient("rain load"),
  T: transient("self-straining load (temperature, shrinkage, settlement)"),
  W: transient("wind load", true),
  Wt: transient("tornado load", true),
  Wi: transient("wind-on-ice load", true),
  Di: transient("weight of ice"),
  Fa: transient("flood load"),
  E: transient("earthquake load", true),
  Ad: transient("accidental action"),
  AEd: transient("design seismic action", true),
};
