"""Independent DXF check with ezdxf (Debian python3-ezdxf), used by test/reference/export-dxf.test.ts.

Run with Debian's own interpreter:  PATH="$(getconf PATH)" python3 scripts/oracles/audit_dxf.py FILE.dxf
Prints one JSON object: strict-load result, audit errors and fixes, header units, and every entity read back
(LWPOLYLINE / POLYLINE vertices with bulge and closed flag, CIRCLE centre and radius, layer).
Exit 0 = strict load passed and audit found no errors and no fixes; 1 = readable but flawed; 2 = unreadable.
The strict loader is the gate: ezdxf's recover module is a repair tool and may report nothing on a broken file.
"""
import json
import sys

import ezdxf
from ezdxf import recover
from ezdxf.lldxf.const import DXFStructureError

path = sys.argv[1]
report = {"strict": True, "strict_error": None}
try:
    doc = ezdxf.readfile(path)
except (IOError, DXFStructureError, ValueError) as e:
    report["strict"] = False
    report["strict_error"] = str(e)
    try:
        doc, _ = recover.readfile(path)
    except (IOError, DXFStructureError) as e2:
        report["unreadable"] = str(e2)
        print(json.dumps(report))
        sys.exit(2)

auditor = doc.audit()
report["version"] = doc.dxfversion
report["insunits"] = doc.header.get("$INSUNITS")
report["measurement"] = doc.header.get("$MEASUREMENT")
report["audit_errors"] = [str(e.message) for e in auditor.errors]
report["audit_fixes"] = [str(f.message) for f in auditor.fixes]
report["layers"] = sorted(layer.dxf.name for layer in doc.layers)
entities = []
for e in doc.modelspace():
    t = e.dxftype()
    if t == "LWPOLYLINE":
        entities.append({"type": t, "layer": e.dxf.layer, "closed": bool(e.closed),
                         "points": [[p[0], p[1], p[2]] for p in e.get_points("xyb")]})
    elif t == "POLYLINE":
        entities.append({"type": t, "layer": e.dxf.layer, "closed": bool(e.is_closed),
                         "points": [[v.dxf.location.x, v.dxf.location.y, v.dxf.bulge] for v in e.vertices]})
    elif t == "CIRCLE":
        entities.append({"type": t, "layer": e.dxf.layer, "center": [e.dxf.center.x, e.dxf.center.y],
                         "radius": e.dxf.radius})
    else:
        entities.append({"type": t, "layer": e.dxf.layer})
report["entities"] = entities
print(json.dumps(report))
flawed = (not report["strict"]) or auditor.has_errors or len(auditor.fixes) > 0
sys.exit(1 if flawed else 0)
