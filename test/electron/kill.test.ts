// The kill test of the issue: a child saving a large design in a loop, SIGKILLed at random moments, 100 rounds,
// zero corrupt or lost designs (the project's own rule "data lost = 0"; our own measurement found 4/60 corrupt for a plain
// writeFile and 0/60 for temp + fsync + rename). Figures are printed; speed is not asserted (bench rule).
import { afterEach, describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { checkAfterKill, expectedTextFactory, formatFigures, runKillTest } from '../../scripts/kill-test.ts';
import { KILL_TEST_FILE, killTestDesign } from '../../scripts/kill-test-design.ts';

let dir = '';
afterEach(() => { if (dir) rmSync(dir, { recursive: true, force: true }); });

describe('the kill-test checker can fail', () => {
  const setup = () => { dir = mkdtempSync(join(tmpdir(), 'sw-killcheck-')); mkdirSync(join(dir, 'recovery')); return join(dir, KILL_TEST_FILE); };
  const expected = expectedTextFactory();
  it('calls a truncated design corrupt, saying it does not load', async () => {
    const p = setup();
    const text = expected(3);
    writeFileSync(p, text.slice(0, Math.floor(text.length * 0.6)));
    const r = await checkAfterKill(dir, { lastAck: 3 }, expected);
    expect(r.corrupt).toEqual([expect.stringMatching(/^design does not load/)]);
  });
  it('calls a valid design that is not a saved version corrupt, and a bad backup too', async () => {
    const p = setup();
    const doc = killTestDesign();
    doc.notes = 'kill-test save 3';
    doc.name = 'changed';
    writeFileSync(p, JSON.stringify(doc));
    writeFileSync(`${p}.bak`, '');
    expect((await checkAfterKill(dir, { lastAck: 3 }, expected)).corrupt).toEqual([expect.stringMatching(/^design loads, but is not/), expect.stringMatching(/^backup does not load/)]);
  });
  it('calls a design older than the last completed save lost, and a missing one too', async () => {
    const p = setup();
    writeFileSync(p, expected(4));
    expect(await checkAfterKill(dir, { lastAck: 4 }, expected)).toEqual({ corrupt: [], lost: [] });
    expect((await checkAfterKill(dir, { lastAck: 5 }, expected)).lost).toHaveLength(1);
    rmSync(p);
    expect((await checkAfterKill(dir, { lastAck: 5 }, expected)).lost).toEqual(['design missing after a save had been reported done']);
  });
});

describe('kill test', () => {
  it('100 rounds of SIGKILL during saving leave no corrupt or lost design and no stray temp file', async () => {
    const f = await runKillTest({ rounds: 100 });
    console.log(formatFigures(f));
    expect(f.rounds).toBe(100);
    expect(f.killedAfterSaves).toBeGreaterThan(50); // most kills land while saving, not before the first save
    expect(f.problems).toEqual([]);
    expect(f.corrupt).toBe(0);
    expect(f.lost).toBe(0);
    expect(f.strayTempsLeft).toBe(0);
  }, 120_000);
});
