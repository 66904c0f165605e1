/**
 * Writes test/fixtures/tune/wilkinson-block-3db-goals.json: an invented detuned design for the tune-a-block test —
 * a Wilkinson divider placed as a block with an equal split (ratio 0 dB), whose goals (targets) are those the same
 * block gives for a 3 dB split. Tuning the block's ratio brings it to them. Run: npx tsx scripts/make-tune-fixture.ts
 */
import { writeFileSync } from 'node:fs';
import { makeBlockDesign, serializeDesign } from '../core/index.ts';

const opts = { f0: 2.45e9, asMade: { sizing: 'microstrip' as const, sideCopper: 'stitched' as const } };
const equal = makeBlockDesign('wilkinson', { ratioDb: 0 }, opts);
const wanted = makeBlockDesign('wilkinson', { ratioDb: 3 }, opts);
const doc = { ...equal, name: 'Divider to retune (3 dB goals)', targets: wanted.targets };
writeFileSync('test/fixtures/tune/wilkinson-block-3db-goals.json', serializeDesign(doc));
