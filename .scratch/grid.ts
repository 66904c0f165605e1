import { buildShapes } from '../core/section/shapes.ts';
import { gradedAxis } from '../core/section/grid.ts';
const spec = { er: 4.3, h: 1e-3, width: 1e-3, t: 35e-6 };
const s = buildShapes(spec, 0, 0.03);
console.log(s.keysX, s.keysY, s.feature);
const edge = s.feature/40, iface = Math.min(1e-3, s.feature)/6;
const x = gradedAxis(-0.03, 0.03, [...s.keysX.map(k=>({at:k.at,size:k.edge?edge:iface})), {at:-0.03,size:0.0075},{at:0.03,size:0.0075}], 1.3);
console.log(x.length, x.slice(0, 80).map(v=>(v*1e3).toFixed(4)).join(' '));
