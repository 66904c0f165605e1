/** Export layer: pure functions from BoardGeometry to the text of DXF, SVG, Gerber X2, Excellon and photo masks. */
export * from './frame.ts';
export * from './layers.ts';
export * from './dxf.ts';
export * from './svg.ts';
export * from './gerber.ts';
export * from './excellon.ts';
export * from './mask.ts';
export * from './mask-pdf.ts';
export * from './bias.ts';
export * from './milling.ts';
export * from './dxf-r12.ts';
export * from './file-names.ts';
export * from './gcode.ts';
export * from './milling-preview.ts';
export * from './report/index.ts';
