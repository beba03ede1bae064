// "Did you mean": the nearest known name to a misspelt one, for settings keys, config keys, rule
// ids in config files and in directives. Edit distance comes from fastest-levenshtein (a
// well-kept implementation); the threshold and the tie rule (first candidate wins) are ours.
import { distance } from 'fastest-levenshtein';

/**
 * The candidate nearest to `name` (compared in lower case), when it is close enough to be a likely
 * typo: an edit distance of at most a third of the name's length, and at least 2.
 */
export function nearestName(name: string, candidates: Iterable<string>): string | null {
  const n = name.toLowerCase();
  let best: string | null = null;
  let bestD = Infinity;
  for (const c of candidates) {
    const d = distance(n, c);
    if (d < bestD) [best, bestD] = [c, d];
  }
  return best !== null && bestD <= Math.max(2, Math.floor(name.length / 3)) ? best : null;
}
