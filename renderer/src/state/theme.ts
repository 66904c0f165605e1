/** Light or dark: the user's last choice, else the system's preference. A class on <html> switches the CSS variables. */
export type Theme = 'light' | 'dark';
const KEY = 'stripwright.theme';

export function initialTheme(): Theme {
  try {
    const saved = globalThis.localStorage?.getItem(KEY);
    if (saved === 'light' || saved === 'dark') return saved;
  } catch { /* storage blocked: fall back to the system */ }
  return globalThis.matchMedia?.('(prefers-color-scheme: dark)').matches ? 'dark' : 'light';
}

export function applyTheme(t: Theme): void {
  if (typeof document === 'undefined') return;
  document.documentElement.classList.toggle('dark', t === 'dark');
  try { globalThis.localStorage?.setItem(KEY, t); } catch { /* not saved; still applied */ }
}
