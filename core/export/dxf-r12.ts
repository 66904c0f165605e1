/**
 * DXF Release 12 (AC1009) text writer, for laser cutters, CNC controllers and older CAM importers that read only
 * the simple entities (common practice: R12 with closed POLYLINE is the safest input for such machines; DXF reference, open format).
 * Written directly, without handles ($HANDLING 0 is the R12 default):
 * - HEADER: $ACADVER AC1009 and $EXTMIN/$EXTMAX; R12 has no $INSUNITS, so the unit is stated in 999 comments;
 * - TABLES: LTYPE CONTINUOUS and one LAYER entry per layer used (plus layer 0);
 * - ENTITIES: each ring a POLYLINE (66 = 1 vertices follow, 70 bit 1 closed) with its VERTEX entities and SEQEND,
 *   last vertex not repeated; drills as CIRCLE.
 * Group codes from the Autodesk DXF Reference (R12): 0 entity type, 8 layer, 10/20/30 point, 40 radius,
 * 62 colour, 6 linetype, 70 flags, 66 entities-follow flag.
 */
import { fmtMm, makeFrame, roundMm, toMm, type FrameOptions, type PointMm } from './frame.ts';
import { dxfCommentText } from './dxf.ts';
import { LAYER_INFO, checkLayers, layerRegions, type ExportGeometry, type ExportLayer } from './layers.ts';

export interface DxfR12Options extends FrameOptions {
  layers?: readonly string[];
  /** The pipeline's stamp (design hash, application and version; never a timestamp), as a 999 comment. */
  stamp?: string;
}

export function toDxfR12(geometry: ExportGeometry, options: DxfR12Options = {}): string {
  const frame = makeFrame(geometry, options);
  const layers = checkLayers(options.layers, geometry);
  const t: string[] = [];
  const tag = (code: number, value: string | number) => { t.push(String(code), typeof value === 'number' ? fmtMm(value) : value); };
  tag(999, 'Stripwright DXF R12 export. Units: millimetres.');
  tag(999, `Origin: ${frame.origin === 'board' ? 'lower-left corner of the board' : 'design origin'}. Mirrored: ${frame.mirror ? 'yes (left-right)' : 'no'}.`);
  if (options.stamp) tag(999, `Made by ${dxfCommentText(options.stamp)}.`);
  tag(0, 'SECTION'); tag(2, 'HEADER');
  tag(9, '$ACADVER'); tag(1, 'AC1009');
  tag(9, '$EXTMIN'); tag(10, frame.box.minX); tag(20, frame.box.minY); tag(30, 0);
  tag(9, '$EXTMAX'); tag(10, frame.box.maxX); tag(20, frame.box.maxY); tag(30, 0);
  tag(0, 'ENDSEC');
  tag(0, 'SECTION'); tag(2, 'TABLES');
  tag(0, 'TABLE'); tag(2, 'LTYPE'); tag(70, '1');
  tag(0, 'LTYPE'); tag(2, 'CONTINUOUS'); tag(70, '0'); tag(3, 'Solid line'); tag(72, '65'); tag(73, '0'); tag(40, 0);
  tag(0, 'ENDTAB');
  tag(0, 'TABLE'); tag(2, 'LAYER'); tag(70, String(layers.length + 1));
  for (const [name, aci] of [['0', 7] as const, ...layers.map((l) => [LAYER_INFO[l].dxf, LAYER_INFO[l].aci] as const)]) {
    tag(0, 'LAYER'); tag(2, name); tag(70, '0'); tag(62, String(aci)); tag(6, 'CONTINUOUS');
  }
  tag(0, 'ENDTAB');
  tag(0, 'ENDSEC');
  tag(0, 'SECTION'); tag(2, 'ENTITIES');
  for (const layer of layers) {
    const name = LAYER_INFO[layer as ExportLayer].dxf;
    if (layer === 'drills') {
      for (const hit of geometry.drills) {
        const c = frame.point(hit.at);
        tag(0, 'CIRCLE'); tag(8, name); tag(10, c.x); tag(20, c.y); tag(30, 0); tag(40, roundMm(toMm(hit.diameter) / 2));
      }
      continue;
    }
    for (const region of layerRegions(geometry, layer)) {
      for (const ring of [region.outer, ...region.holes]) polyline(tag, name, frame.ring(ring));
    }
  }
  tag(0, 'ENDSEC');
  tag(0, 'EOF');
  return t.join('\n') + '\n';
}

function polyline(tag: (c: number, v: string | number) => void, layer: string, pts: PointMm[]): void {
  tag(0, 'POLYLINE'); tag(8, layer); tag(66, '1'); tag(10, 0); tag(20, 0); tag(30, 0); tag(70, '1');
  for (const p of pts) { tag(0, 'VERTEX'); tag(8, layer); tag(10, p.x); tag(20, p.y); tag(30, 0); }
  tag(0, 'SEQEND'); tag(8, layer);
}
