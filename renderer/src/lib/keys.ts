/**
 * Keyboard shortcuts as text ('Mod+Shift+Z', 'Delete', '?') and matching them against KeyboardEvents.
 * 'Mod' is Ctrl, or Cmd on macOS, so one table serves every desktop.
 */
export interface KeyLike { key: string; ctrlKey: boolean; metaKey: boolean; shiftKey: boolean; altKey: boolean }

const ALIASES: Record<string, string> = { esc: 'escape', del: 'delete', plus: '+', space: ' ' };

export function parseShortcut(s: string): { key: string; mod: boolean; shift: boolean; alt: boolean } {
  const parts = s.split('+').filter((p, i, a) => p !== '' || i === a.length - 1);
  // 'Mod++' → ['Mod', '', ''] after split; treat a trailing empty part as the '+' key.
  const keyPart = s.endsWith('++') || s === '+' ? '+' : parts[parts.length - 1];
  const mods = new Set(parts.slice(0, -1).map((p) => p.toLowerCase()));
  const k = keyPart.toLowerCase();
  return { key: ALIASES[k] ?? k, mod: mods.has('mod'), shift: mods.has('shift'), alt: mods.has('alt') };
}

export function matches(e: KeyLike, shortcut: string): boolean {
  const p = parseShortcut(shortcut);
  const key = e.key.toLowerCase();
  if (key !== p.key) return false;
  if ((e.ctrlKey || e.metaKey) !== p.mod) return false;
  if (e.altKey !== p.alt) return false;
  // Shift is part of printable keys like '?' or '+': only insist on it for letters, named keys and when asked.
  const printable = p.key.length === 1 && !/[a-z0-9]/.test(p.key);
  if (!printable && e.shiftKey !== p.shift) return false;
  return true;
}

/** Shortcut as shown to the user: 'Ctrl+Shift+Z' (or '⌘⇧Z' on macOS). */
export function showShortcut(s: string, mac = typeof navigator !== 'undefined' && /Mac/.test(navigator.platform)): string {
  if (!mac) return s.replace(/^Mod\+/, 'Ctrl+').replace(/\+Mod\+/, '+Ctrl+');
  return s.replace('Mod+', '⌘').replace('Shift+', '⇧').replace('Alt+', '⌥');
}

/** True when keys typed there belong to the field, not to the editor. */
export function isTextTarget(t: EventTarget | null): boolean {
  if (!t || typeof (t as HTMLElement).tagName !== 'string') return false;
  const el = t as HTMLElement;
  return el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.tagName === 'SELECT' || el.isContentEditable;
}
