#!/usr/bin/python3
"""Measures the design-area outlines headcheck drew on an annotated drawing with ezdxf (Debian python3-ezdxf), an
independent reader and geometry library: per closed polyline on HC-DESIGN-AREA its area (ezdxf.math.area) and
whether every vertex lies in or on a room outline (a closed polyline on the walls layer, is_point_in_polygon_2d).
Prints one JSON object. Usage: /usr/bin/python3 scripts/ezdxf-areas.py ANNOTATED.dxf WALL-LAYER
"""
import json
import sys

import ezdxf
from ezdxf.math import Vec2, area, is_point_in_polygon_2d


def outline(e):
    return [Vec2(x, y) for x, y, *_ in e.get_points()]


def main(path, wall_layer):
    doc = ezdxf.readfile(path)
    msp = doc.modelspace()
    rooms = [outline(e) for e in msp.query("LWPOLYLINE") if e.dxf.layer == wall_layer and e.closed]
    rings = []
    for e in msp.query("LWPOLYLINE"):
        if e.dxf.layer != "HC-DESIGN-AREA" or not e.closed:
            continue
        pts = outline(e)
        inside = all(any(is_point_in_polygon_2d(p, room, abs_tol=1e-6) >= 0 for room in rooms) for p in pts)
        rings.append({"area": abs(area(pts)), "inside": inside, "vertices": len(pts)})
    print(json.dumps({"file": path, "rooms": len(rooms), "rings": rings}))


if __name__ == "__main__":
    main(sys.argv[1], sys.argv[2])
