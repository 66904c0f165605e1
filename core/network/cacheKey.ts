/**
 * Cache key of a design's response: everything that changes the physics (substrate, frequency, nodes, segments,
 * process — the layout's compensations depend on it) plus the sweep settings and solver options; not the name,
 * notes or view preferences, so renaming or zooming never recomputes a sweep.
 */
import type { DesignDoc } from '../design/types.ts';
import type { FromSizedOptions } from './fromSized.ts';
import { SweepCache, designHash, documentHash, type SweepSettings } from './sweep.ts';

export function responseCacheKey(doc: DesignDoc, settings: SweepSettings, opts: FromSizedOptions = {}): string {
  // The design's own sweep settings are left out too: the settings themselves are part of the key.
  const { name: _name, notes: _notes, view: _view, app: _app, sweep: _sweep, ...physics } = doc;
  void _name; void _notes; void _view; void _app; void _sweep;
  return SweepCache.key(documentHash(physics), settings, designHash(opts));
}
