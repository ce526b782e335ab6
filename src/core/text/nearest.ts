/**
 * The one "did you mean" policy: a known name is offered for a mistyped one
 * only where it is the likely intent — the same letters in another case, or a
 * few edits apart (none for names of one or two characters, where any other
 * name is one edit away). Every surface words the suggestion with didYouMean.
 */
import { distance } from "fastest-levenshtein";

/** Most edits between a typed name and the name offered for it, by the typed name's length. */
export function suggestionLimit(length: number): number {
  return length <= 2 ? 0 : length <= 4 ? 1 : 2;
}

/**
 * The nearest known name, found one candidate at a time, so that a name can be
 * looked for among the ids of a streamed file without keeping them.
 */
export class NearestName {
  private readonly lower: string;
  private readonly limit: number;
  private sameLetters: string | undefined;
  private closest: string | undefined;
  private closestDistance: number;

  constructor(readonly typed: string) {
    this.lower = typed.toLowerCase();
    this.limit = suggestionLimit(typed.length);
    this.closestDistance = this.limit + 1;
  }

  consider(candidate: string): void {
    const lower = candidate.toLowerCase();
    if (lower === this.lower) {
      this.sameLetters ??= candidate;
      return;
    }
    if (this.sameLetters !== undefined) return;
    const d = distance(this.lower, lower);
    if (d < this.closestDistance) {
      this.closest = candidate;
      this.closestDistance = d;
    }
  }

  /** The name to offer, if any is close enough. */
  get best(): string | undefined {
    return this.sameLetters ?? this.closest;
  }
}

/** The known name closest to a mistyped one, if it is close enough to be the likely intent. */
export function nearest(typed: string, known: Iterable<string>): string | undefined {
  const finder = new NearestName(typed);
  for (const k of known) finder.consider(k);
  return finder.best;
}

/** `; did you mean "rho"?`, or nothing when there is no likely name. */
export function didYouMean(guess: string | undefined): string {
  return guess === undefined ? "" : `; did you mean "${guess}"?`;
}
