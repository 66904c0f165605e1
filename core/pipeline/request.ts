/**
 * What a face asks the pipeline to write: formats and every option, the same set for the CLI's flags and the app's
 * Outputs panel. `resolveExportRequest` checks it and fills the defaults, naming the field in the user's words.
 */
import type { MillingOptions } from '../toolpath/index.ts';
import { InputError, describe } from '../util/errors.ts';
import { MAX_BIAS } from '../export/bias.ts';
import { EXPORT_LAYERS, type ExportLayer } from '../export/layers.ts';
import { EXPORT_FORMATS, type ExportFormat } from './formats.ts';

export interface ExportRequest {
  /** Which files to write (none: nothing but the checks). */
  formats: readonly string[];
  /** Stem of the file names (see exportBase in core/export/file-names.ts). */
  base: string;
  /** Version of the writing application, written into the files (never a timestamp). */
  version: string;
  /** (0, 0) at the board's lower-left corner (default) or at the design origin. */
  origin?: 'board' | 'design';
  /** Mirror left-right (every format). */
  mirror?: boolean;
  /** Etch bias per copper edge, m (+ grows copper); every format but G-code. */
  bias?: number;
  /** Isolation width override, m; without it the design's process gives the width of the isolation outlines. */
  tool?: number;
  /** Layers of DXF and SVG (default: copper, ground, outline, clearance, drills, and keep-outs/isolation when present). */
  layers?: readonly string[];
  /** DXF flavour: AC1021 with LWPOLYLINE (default) or R12 POLYLINE for older cutters. */
  dxfVersion?: '2007' | 'r12';
  /** SVG: filled copper (default) or outlines only. */
  svgStyle?: 'filled' | 'outline';
  /** Mask sheet page and polarity. */
  maskPage?: 'a4' | 'letter';
  maskPolarity?: 'positive' | 'negative';
  /** Machining settings for G-code (defaults for the rest). */
  milling?: Partial<MillingOptions>;
}

export interface ResolvedRequest extends Required<Omit<ExportRequest, 'formats' | 'layers' | 'tool' | 'milling'>> {
  formats: ExportFormat[];
  layers?: ExportLayer[];
  tool?: number;
  milling: Partial<MillingOptions>;
}

function choice<T extends string>(field: string, v: unknown, allowed: readonly T[], fallback: T): T {
  if (v === undefined) return fallback;
  if (typeof v !== 'string' || !(allowed as readonly string[]).includes(v)) throw new InputError('bad-choice', field, allowed.map((a) => `'${a}'`).join(' or '), describe(v));
  return v as T;
}

export function resolveExportRequest(req: ExportRequest): ResolvedRequest {
  const formats: ExportFormat[] = [];
  for (const f of req.formats ?? []) {
    if (!(EXPORT_FORMATS as readonly string[]).includes(f)) throw new InputError('bad-choice', 'formats', `formats among ${EXPORT_FORMATS.join(', ')}`, describe(f));
    if (!formats.includes(f as ExportFormat)) formats.push(f as ExportFormat);
  }
  if (typeof req.base !== 'string' || req.base === '') throw new InputError('invalid-design', 'base', 'a file name stem', describe(req.base));
  const bias = req.bias ?? 0;
  if (typeof bias !== 'number' || !Number.isFinite(bias) || Math.abs(bias) > MAX_BIAS) {
    throw new InputError('out-of-range', 'bias', 'an etch bias between −0.5 mm and +0.5 mm per edge', describe(bias), 'a typical value is about the copper thickness, e.g. 0.035mm for 1 oz copper');
  }
  let layers: ExportLayer[] | undefined;
  if (req.layers !== undefined) {
    layers = [];
    for (const l of req.layers) {
      if (!(EXPORT_LAYERS as readonly string[]).includes(l)) throw new InputError('bad-choice', 'layers', `layer names among ${EXPORT_LAYERS.join(', ')}`, describe(l));
      if (!layers.includes(l as ExportLayer)) layers.push(l as ExportLayer);
    }
    if (layers.length === 0) throw new InputError('bad-choice', 'layers', `a non-empty list of layers among ${EXPORT_LAYERS.join(', ')}`, 'an empty list');
  }
  return {
    formats, base: req.base, version: String(req.version ?? 'dev'),
    origin: choice('origin', req.origin, ['board', 'design'] as const, 'board'),
    mirror: req.mirror === true,
    bias,
    ...(req.tool !== undefined ? { tool: req.tool } : {}),
    ...(layers ? { layers } : {}),
    dxfVersion: choice('dxfVersion', req.dxfVersion, ['2007', 'r12'] as const, '2007'),
    svgStyle: choice('svgStyle', req.svgStyle, ['filled', 'outline'] as const, 'filled'),
    maskPage: choice('maskPage', req.maskPage, ['a4', 'letter'] as const, 'a4'),
    maskPolarity: choice('maskPolarity', req.maskPolarity, ['positive', 'negative'] as const, 'positive'),
    milling: req.milling ?? {},
  };
}
