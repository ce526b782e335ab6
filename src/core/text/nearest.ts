import { distance } from "fastest-levenshtein";

/**
 * The known name closest to a mistyped one, if it is close enough to be the
 * likely intent: the same letters in another case, or a few edits apart (none
 * for names of one or two characters, where any other name is one edit away).
 */
export function nearest(typed: string, known: readonly string[]): string | undefined {
  const lower = typed.toLowerCase();
  const sameLetters = known.find((k) => k.toLowerCase() === lower);
  if (sameLetters) return sameLetters;
  const limit = typed.length <= 2 ? 0 : typed.length <= 4 ? 1 : 2;
  let best: string | undefined;
  let bestDistance = limit + 1;
  for (const k of known) {
    const d = distance(lower, k.toLowerCase());
    if (d < bestDistance) {
      best = k;
      bestDistance = d;
    }
  }
  return best;
}
