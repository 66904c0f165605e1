/**
 * The child of the kill test (scripts/kill-test.ts): saves a large design over and over with the app's atomic save
 * (electron/files/atomic-write.ts, with .bak) and writes a recovery copy every third round (RecoveryStore), printing
 * `saved N` after each save returns, until it is killed. Arguments: folder, first sequence number, mode
 * ('atomic', or 'naive' for the comparison run that writes the file in place).
 */
import { writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { atomicWriteFile } from '../electron/files/atomic-write.ts';
import { RecoveryStore } from '../electron/files/recovery-store.ts';
import { killTestDesign, KILL_TEST_FILE } from './kill-test-design.ts';

const [folder, firstSeq, mode = 'atomic'] = process.argv.slice(2);
if (!folder || !firstSeq) { console.error('usage: kill-test-writer FOLDER FIRST_SEQ [atomic|naive]'); process.exit(2); }
const target = join(folder, KILL_TEST_FILE);
const recovery = new RecoveryStore(join(folder, 'recovery'), `writer-${process.pid}`);
const doc = killTestDesign();

await recovery.init();
process.stdout.write('ready\n');
for (let seq = Number(firstSeq); ; seq++) {
  doc.notes = `kill-test save ${seq}`;
  const text = JSON.stringify(doc);
  if (mode === 'naive') await writeFile(target, text);
  else await atomicWriteFile(target, text, { backup: true });
  process.stdout.write(`saved ${seq}\n`);
  if (seq % 3 === 0) await recovery.write({ docId: 'kill-test-doc', name: 'kill test', originalPath: target, text });
}
