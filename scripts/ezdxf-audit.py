#!/usr/bin/python3
"""Audits DXF files with ezdxf (Debian python3-ezdxf), an independent reader: prints one JSON line per file
with the audit's errors and fixes, the layers, and the entities on headcheck's HC- layers.

ezdxf's own `ezdxf audit` command exits 0 and reads through recovery, so this calls ezdxf.readfile() (which
fails on a structurally broken file) and doc.audit() directly. Usage: /usr/bin/python3 scripts/ezdxf-audit.py FILE...
"""
import json
import sys

import ezdxf


def layer_of(e):
    try:
        return e.dxf.get("layer", "0")
    except ezdxf.DXFAttributeError:  # a type ezdxf 0.18 keeps without its layer (ACAD_TABLE)
        return ""


def audit(path):
    try:
        doc = ezdxf.readfile(path)
    except Exception as err:  # a file ezdxf cannot read at all
        return {"file": path, "readError": f"{type(err).__name__}: {err}"}
    auditor = doc.audit()
    msp = doc.modelspace()
    hc = [e for e in msp if layer_of(e).upper().startswith("HC-")]
    return {
        "file": path,
        "dxfversion": doc.dxfversion,
        "errors": [str(e.message) for e in auditor.errors],
        "fixes": [str(f.message) for f in auditor.fixes],
        "layers": sorted(layer.dxf.name for layer in doc.layers),
        "hcEntities": len(hc),
        "hcTypes": sorted({e.dxftype() for e in hc}),
        "modelspace": len(msp),
        "handles": sorted(e.dxf.handle for e in msp),
        "handseed": doc.header.get("$HANDSEED"),
        "blocks": sorted(b.name for b in doc.blocks),
    }


if __name__ == "__main__":
    for p in sys.argv[1:]:
        print(json.dumps(audit(p)))
