// Prints "unit: N passed, N failed" lines from the vitest and Playwright JSON reports (CI reads this form).
import { readFileSync } from 'node:fs';
const read = (f) => { try { return JSON.parse(readFileSync(f, 'utf8')); } catch { return null; } };
const v = read('reports/vitest.json');
const e = read('reports/e2e.json');
const u = v ? [v.numPassedTests, v.numFailedTests, v.numPendingTests + v.numTodoTests] : [0, 0, 0];
const s = e?.stats;
const w = s ? [s.expected + s.flaky, s.unexpected, s.skipped] : [0, 0, 0];
console.log(`unit: ${u[0]} passed, ${u[1]} failed, ${u[2]} skipped${v ? '' : ' (no report)'}`);
console.log(`e2e: ${w[0]} passed, ${w[1]} failed, ${w[2]} skipped${e ? '' : ' (no report)'}`);
console.log(`total: ${u[0] + w[0]} passed, ${u[1] + w[1]} failed, ${u[2] + w[2]} skipped`);

// Every skipped browser test with its stated reason (e.g. the desktop smoke test where Electron cannot run).
function skipped(suite, out = []) {
  for (const spec of suite.specs ?? []) for (const t of spec.tests ?? []) {
    if ((t.results ?? []).some((r) => r.status === 'skipped')) {
      const reasons = [...new Set((t.annotations ?? []).filter((a) => a.type === 'skip').map((a) => a.description))];
      out.push(`skipped: ${spec.title} — ${reasons.join('; ') || 'no reason given'}`);
    }
  }
  for (const child of suite.suites ?? []) skipped(child, out);
  return out;
}
if (e) for (const line of skipped({ suites: e.suites })) console.log(line);
