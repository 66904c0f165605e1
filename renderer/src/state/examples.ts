/**
 * The example designs shipped in assets/examples/ (demo.json is the one the app opens on), bundled as text by
 * Vite so they open the same way a user's file does: through the core's parser.
 */
const files = import.meta.glob('../../../assets/examples/*.json', { query: '?raw', import: 'default', eager: true }) as Record<string, string>;

export interface Example { id: string; title: string; text: string }

function titleOf(text: string, id: string): string {
  try {
    const name = (JSON.parse(text) as { name?: unknown }).name;
    return typeof name === 'string' && name ? name : id;
  } catch {
    return id;
  }
}

export const EXAMPLES: Example[] = Object.entries(files)
  .map(([path, text]) => {
    const id = path.split('/').pop()!.replace(/\.json$/, '');
    return { id, title: titleOf(text, id), text };
  })
  // The demo first, the rest by title.
  .sort((a, b) => (a.id === 'demo' ? -1 : b.id === 'demo' ? 1 : a.title.localeCompare(b.title)));

export function exampleText(id: string): string | null {
  return EXAMPLES.find((e) => e.id === id)?.text ?? null;
}
