#!/usr/bin/python3
"""Lists a DXF drawing's model-space entities as ezdxf (Debian python3-ezdxf), an independent reader, reads them:
per entity its handle, type, layer, defining point (insertion point, start point, centre, location or first
vertex) and vertex count (polylines), and the layer table's names. Prints one JSON object. Usage: /usr/bin/python3 scripts/ezdxf-entities.py FILE.dxf
"""
import json
import sys

import ezdxf


def point(e):
    t = e.dxftype()
    try:
        if t in ("INSERT", "TEXT", "MTEXT", "ATTDEF"):
            p = e.dxf.insert
        elif t == "LINE":
            p = e.dxf.start
        elif t in ("CIRCLE", "ARC"):
            p = e.dxf.center
        elif t == "POINT":
            p = e.dxf.location
        elif t == "LWPOLYLINE":
            p = next(iter(e.get_points("xy")), None)
            return None if p is None else [p[0], p[1]]
        elif t == "POLYLINE":
            v = next(iter(e.vertices), None)
            p = None if v is None else v.dxf.location
        else:
            return None
        return None if p is None else [p[0], p[1]]
    except Exception:
        return None


def vertex_count(e):
    t = e.dxftype()
    if t == "LWPOLYLINE":
        return len(e)
    if t == "POLYLINE":
        return len(e.vertices)
    return None


def attr(e, name, default):
    try:
        return e.dxf.get(name, default)
    except ezdxf.DXFAttributeError:  # a type ezdxf 0.18 keeps without the attribute (ACAD_TABLE: no layer)
        return default


def main(path):
    doc = ezdxf.readfile(path)
    out = [{"handle": attr(e, "handle", ""), "type": e.dxftype(), "layer": attr(e, "layer", None), "at": point(e),
            "vertices": vertex_count(e)}
           for e in doc.modelspace()]
    print(json.dumps({"file": path, "layers": sorted(l.dxf.name for l in doc.layers), "entities": out}))


if __name__ == "__main__":
    main(sys.argv[1])
