/**
 * Ranking for the command finder: every query letter must appear in order in the label; earlier, adjacent and
 * word-start matches score higher. Returns null when the label does not match.
 */
export function fuzzyScore(query: string, label: string): number | null {
  const q = query.trim().toLowerCase();
  if (!q) return 0;
  const s = label.toLowerCase();
  let score = 0, j = 0, last = -2;
  for (const ch of q) {
    if (ch === ' ') continue;
    const k = s.indexOf(ch, j);
    if (k < 0) return null;
    score += 1;
    if (k === last + 1) score += 2;
    if (k === 0 || s[k - 1] === ' ' || s[k - 1] === '-') score += 3;
    score -= (k - j) * 0.05;
    last = k;
    j = k + 1;
  }
  return score;
}

export function rank<T>(items: T[], query: string, label: (t: T) => string): T[] {
  const scored: { t: T; s: number; i: number }[] = [];
  items.forEach((t, i) => { const s = fuzzyScore(query, label(t)); if (s !== null) scored.push({ t, s, i }); });
  return scored.sort((a, b) => b.s - a.s || a.i - b.i).map((x) => x.t);
}
