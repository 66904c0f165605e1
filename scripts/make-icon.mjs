// Draws assets/icon.png (512×512): a copper strip with a mitered bend on a green laminate. Run once: node scripts/make-icon.mjs
import { PNG } from 'pngjs';
import { writeFileSync } from 'node:fs';
const N = 512, png = new PNG({ width: N, height: N });
const inStrip = (x, y) => {
  // horizontal run y in [300,360], x in [60, 330]; vertical run x in [270,330], y in [60, 360]; miter cut on the outer corner
  const h = y >= 300 && y <= 360 && x >= 60 && x <= 330;
  const v = x >= 270 && x <= 330 && y >= 60 && y <= 360;
  const miter = x + (N - y) > 330 + (N - 360) + 40; // cut the outer corner at 45°
  return (h || v) && !(x > 300 && y > 330 && miter);
};
for (let y = 0; y < N; y++) for (let x = 0; x < N; x++) {
  const i = (N * y + x) << 2;
  const r = Math.hypot(x - N / 2, y - N / 2);
  const board = Math.max(Math.abs(x - N / 2), Math.abs(y - N / 2)) < 236;
  let c = board ? [22, 72, 52, 255] : [0, 0, 0, 0];
  if (board && inStrip(x, y)) c = [214, 140, 62, 255];
  if (board && Math.hypot(x - 420, y - 100) < 26 && r >= 0) c = Math.hypot(x - 420, y - 100) < 12 ? [22, 72, 52, 255] : [214, 140, 62, 255];
  png.data.set(c, i);
}
writeFileSync(new URL('../assets/icon.png', import.meta.url), PNG.sync.write(png));
