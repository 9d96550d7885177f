import { countLoop } from "../math/loop-count.js";

/**
 * "Did you mean" for mistyped names (formula ids, unit symbols): the
 * candidates closest to `word` by edit distance (insertions, deletions,
 * substitutions and swaps of neighbours, each 1: the optimal string alignment
 * distance, so "shwo" is 1 from "show"; letters compared without case, so "uh" finds
 * "uH" at distance 0), at most `limit` of them, none farther than a third of
 * the word's length (at least 1, at most 3). Only the closest are kept: least
 * distance without case, then least with case ("mmm" gives "mm", not "Mm"),
 * ties in the candidates' order.
 *
 * Bounded work: a word or candidate longer than MAX_LENGTH characters is
 * not compared, so each comparison fills at most 65 x 65 cells, and the loop
 * over candidates runs once per candidate (a fixed list: the registry or the
 * unit table).
 */
export function suggest(word: string, candidates: readonly string[], limit = 3): string[] {
  if (word.length === 0 || word.length > MAX_LENGTH) return [];
  const w = word.toLowerCase();
  const most = Math.min(3, Math.max(1, Math.floor(word.length / 3)));
  const scored: [string, number][] = [];
  for (const c of candidates) {
    if (c === word || c.length > MAX_LENGTH || Math.abs(c.length - w.length) > most) continue;
    const d = distance(w, c.toLowerCase());
    // Case counts as a hundredth (at most 0.64 for 64 letters): it only orders names equally far apart without case.
    if (d <= most) scored.push([c, d + distance(word, c) / 100]);
  }
  countLoop(candidates.length);
  if (scored.length === 0) return [];
  const best = Math.min(...scored.map(([, d]) => d));
  return scored.filter(([, d]) => d === best).slice(0, limit).map(([c]) => c);
}

/** ' (did you mean "a" or "b"?)' text, or "" when nothing is close. */
export function didYouMean(word: string, candidates: readonly string[]): string {
  const s = suggest(word, candidates);
  if (s.length === 0) return "";
  return `did you mean ${s.map((x) => `"${x}"`).join(s.length === 2 ? " or " : ", ")}?`;
}

const MAX_LENGTH = 64;

// Dynamic programme over (a.length + 1) x (b.length + 1) cells (each length at most MAX_LENGTH),
// three rows kept: a swap of neighbours looks two rows back.
function distance(a: string, b: string): number {
  let back = new Array<number>(b.length + 1).fill(0);
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  let row = new Array<number>(b.length + 1);
  for (let i = 1; i <= a.length; i++) {
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      let d = Math.min(prev[j]! + 1, row[j - 1]! + 1, prev[j - 1]! + (a[i - 1] === b[j - 1] ? 0 : 1));
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d = Math.min(d, back[j - 2]! + 1);
      row[j] = d;
    }
    [back, prev, row] = [prev, row, back];
  }
  return prev[b.length]!;
}
