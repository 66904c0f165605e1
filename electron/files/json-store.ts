/**
 * Small JSON settings files in userData (window placement, recent files): read with validation, written
 * atomically. A missing, damaged or invalid file reads as the default, never as an error, because a settings file
 * must not stop the app from starting.
 */
import { readFile } from 'node:fs/promises';
import { atomicWriteFile } from './atomic-write.ts';

export async function readJson<T>(path: string, validate: (v: unknown) => T | null, fallback: T): Promise<T> {
  let raw: string;
  try { raw = await readFile(path, 'utf8'); } catch { return fallback; }
  if (raw.length > 1024 * 1024) return fallback;
  try { return validate(JSON.parse(raw)) ?? fallback; } catch { return fallback; }
}

export async function writeJson(path: string, value: unknown): Promise<void> {
  await atomicWriteFile(path, JSON.stringify(value, null, 2));
}

export interface WindowState { x?: number; y?: number; width: number; height: number; maximized: boolean }
export const DEFAULT_WINDOW: WindowState = { width: 1366, height: 860, maximized: false };

const int = (v: unknown, lo: number, hi: number): number | undefined => (typeof v === 'number' && Number.isInteger(v) && v >= lo && v <= hi ? v : undefined);

export function validateWindowState(v: unknown): WindowState | null {
  if (!v || typeof v !== 'object' || Array.isArray(v)) return null;
  const o = v as Record<string, unknown>;
  const width = int(o.width, 480, 16384), height = int(o.height, 360, 16384);
  if (width === undefined || height === undefined) return null;
  const x = int(o.x, -32768, 32767), y = int(o.y, -32768, 32767);
  const s: WindowState = { width, height, maximized: o.maximized === true };
  if (x !== undefined && y !== undefined) { s.x = x; s.y = y; }
  return s;
}

export interface Rect { x: number; y: number; width: number; height: number }

/** Keep the saved position only if at least 100×60 px of the title area lands on a display (a monitor unplugged). */
export function placeOnDisplays(s: WindowState, workAreas: Rect[]): WindowState {
  if (s.x === undefined || s.y === undefined) return s;
  const { x, y } = s;
  const visible = workAreas.some((a) => {
    const w = Math.min(x + s.width, a.x + a.width) - Math.max(x, a.x);
    const h = Math.min(y + 60, a.y + a.height) - Math.max(y, a.y);
    return w >= 100 && h >= 60;
  });
  if (visible) return s;
  const { x: _x, y: _y, ...rest } = s;
  return rest;
}

export interface RecentEntry { path: string; name: string; openedAt: number }

export function validateRecent(v: unknown, maxEntries: number): RecentEntry[] | null {
  if (!Array.isArray(v)) return null;
  const out: RecentEntry[] = [];
  for (const e of v) {
    if (!e || typeof e !== 'object') continue;
    const o = e as Record<string, unknown>;
    if (typeof o.path !== 'string' || o.path.length === 0 || o.path.length > 4096 || o.path.includes('\u0000')) continue;
    if (typeof o.name !== 'string' || typeof o.openedAt !== 'number' || !Number.isFinite(o.openedAt)) continue;
    if (out.some((r) => r.path === o.path)) continue;
    out.push({ path: o.path, name: o.name, openedAt: o.openedAt });
    if (out.length >= maxEntries) break;
  }
  return out;
}

/** The list after opening or saving `entry`: it moves to the front, duplicates go, the tail is cut. */
export function touchRecent(list: RecentEntry[], entry: RecentEntry, maxEntries: number): RecentEntry[] {
  return [entry, ...list.filter((r) => r.path !== entry.path)].slice(0, maxEntries);
}
