#!/usr/bin/python3
"""Measures the texts headcheck wrote on HC- layers of an annotated drawing with ezdxf (Debian python3-ezdxf), an
independent reader: each TEXT's box from its insertion point and ezdxf's own text-size tool (ezdxf.tools.text_size:
Matplotlib's font metrics where installed, else ezdxf's monospace font, each character as wide as the text is high
and the box reaching a third of the height below the baseline), and the legend's frame as placed (the HC-LEGEND
reference's insertion point plus its block's outline). Prints one JSON object.
Usage: /usr/bin/python3 scripts/ezdxf-texts.py ANNOTATED.dxf
"""
import json
import re
import sys

import ezdxf
from ezdxf.tools.text_size import text_size


def outline(e):
    if e.dxftype() == "LWPOLYLINE":
        return list(e.get_points("xy"))
    if e.dxftype() == "POLYLINE":
        return [(v.dxf.location.x, v.dxf.location.y) for v in e.vertices]
    return []


def main(path):
    doc = ezdxf.readfile(path)
    msp = doc.modelspace()
    texts = []
    for e in msp.query("TEXT"):
        if not e.dxf.layer.upper().startswith("HC-"):
            continue
        # A \U+XXXX escape (how pre-2007 files hold other characters) shows as its one character.
        e.dxf.text = re.sub(r"\\U\+([0-9A-Fa-f]{4})", lambda m: chr(int(m.group(1), 16)), e.dxf.text)
        size = text_size(e)
        x, y = e.dxf.insert.x, e.dxf.insert.y
        below = size.total_height - size.cap_height
        texts.append({"text": e.dxf.text, "layer": e.dxf.layer,
                      "box": [x, y - below, x + size.width, y + size.cap_height]})
    legends = []
    for ref in msp.query("INSERT"):
        if ref.dxf.layer != "HC-LEGEND":
            continue
        pts = [p for e in doc.blocks[ref.dxf.name] for p in outline(e)]
        ix, iy = ref.dxf.insert.x, ref.dxf.insert.y
        legends.append([ix + min(p[0] for p in pts), iy + min(p[1] for p in pts), ix + max(p[0] for p in pts), iy + max(p[1] for p in pts)])
    print(json.dumps({"file": path, "texts": texts, "legends": legends}))


if __name__ == "__main__":
    main(sys.argv[1])
