/**
 * The report font for the CLI: DejaVu Sans from the npm package `dejavu-fonts-ttf` (Bitstream Vera licence with
 * public-domain DejaVu changes; covers Ω, ε, Γ, °). Read here because the core never reads files.
 */
import { readFile } from 'node:fs/promises';
import { createRequire } from 'node:module';

export async function reportFont(): Promise<Uint8Array> {
  const path = createRequire(import.meta.url).resolve('dejavu-fonts-ttf/ttf/DejaVuSans.ttf');
  return new Uint8Array(await readFile(path));
}
