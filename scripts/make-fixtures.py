#!/usr/bin/python3
"""Writes headcheck's reader fixtures with ezdxf, an independent DXF writer (Debian python3-ezdxf).

Scenario (invented): "Bay 2" of a fictional model-railway workshop, 48 ft x 30 ft, one riser west of the
room, a 2" feed main to a cross main along the west wall, three 1-1/4"/1" branch lines with four heads each.
Every version holds the same layout; the truth file records what ezdxf itself computes (world positions
of every head through nested, rotated, mirrored references), so the reader is checked against another
program's transform code. Usage: /usr/bin/python3 scripts/make-fixtures.py fixtures
"""
import json
import math
import sys
from pathlib import Path

import ezdxf

FT = 12.0  # the drawing is in inches

VERSIONS = {"R12": "AC1009", "R2000": "AC1015", "R2018": "AC1032"}


def p(x, y):
    return (x * FT, y * FT)


def define_blocks(doc):
    spk = doc.blocks.new("SPK", base_point=(0, 0))
    spk.add_circle((0, 0), 3)
    spk.add_line((-3, 0), (3, 0))
    spk.add_attdef("K", (4, 4), dxfattribs={"height": 2}).dxf.text = "5.6"
    pair = doc.blocks.new("SPK-PAIR", base_point=(6 * FT, 0))
    for x in (0, 12 * FT):
        ref = pair.add_blockref("SPK", (x, 0), dxfattribs={"layer": "0"})
        ref.add_attrib("K", "5.6", (x + 4, 4))
    riser = doc.blocks.new("RISER", base_point=(0, 0))
    riser.add_circle((0, 0), 6)
    riser.add_line((-6, -6), (6, 6))
    riser.add_line((-6, 6), (6, -6))


def polyline(msp, version, pts, layer, closed=False):
    if version == "R12":
        return msp.add_polyline2d(pts, close=closed, dxfattribs={"layer": layer})
    return msp.add_lwpolyline(pts, close=closed, dxfattribs={"layer": layer})


def head(msp, x, y, k="5.6", layer="FP-HEAD", **attribs):
    ref = msp.add_blockref("SPK", p(x, y), dxfattribs={"layer": layer, **attribs})
    ref.add_attrib("K", k, (p(x, y)[0] + 4, p(x, y)[1] + 4))
    return ref


def build(version):
    doc = ezdxf.new(VERSIONS[version])
    if version != "R12":
        doc.header["$INSUNITS"] = 1
    for name, color in [("FP-HEAD", 1), ("FP-PIPE", 5), ("A-WALL", 8), ("FP-SOURCE", 3),
                        ("A-GRID", 9), ("A-ANNO-\u00d8", 7)]:
        doc.layers.new(name, dxfattribs={"color": color})
    define_blocks(doc)
    msp = doc.modelspace()

    # Room outline and a column grid in the background.
    polyline(msp, version, [p(0, 0), p(48, 0), p(48, 30), p(0, 30)], "A-WALL", closed=True)
    for gx in (0, 24, 48):
        msp.add_line(p(gx, -4), p(gx, 34), dxfattribs={"layer": "A-GRID"})
    msp.add_text("\u00d8 25 \u2013 Hinweis", dxfattribs={"layer": "A-ANNO-\u00d8", "height": 6, "insert": p(20, -3)})

    # Source, feed main (meets the cross main mid-span: a T on its interior), cross main.
    msp.add_blockref("RISER", p(-10, 15), dxfattribs={"layer": "FP-SOURCE"})
    msp.add_line(p(-10, 15), p(2, 15), dxfattribs={"layer": "FP-PIPE"})
    polyline(msp, version, [p(2, 5), p(2, 25)], "FP-PIPE")

    # Branch line 1 (y = 5): one LINE, heads on its interior; one head rotated, one scaled.
    msp.add_line(p(2, 5), p(42, 5), dxfattribs={"layer": "FP-PIPE"})
    head(msp, 6, 5)
    head(msp, 18, 5, rotation=90)
    head(msp, 30, 5, xscale=2, yscale=2)
    head(msp, 42, 5, k="8.0")
    # Branch line 2 (y = 15): a polyline with a vertex at every head.
    polyline(msp, version, [p(2, 15), p(6, 15), p(18, 15), p(30, 15), p(42, 15)], "FP-PIPE")
    for x in (6, 18, 30):
        head(msp, x, 15)
    ref = head(msp, 42, 15)
    ref.add_attrib("ELEV", "14", (p(42, 15)[0] + 4, p(42, 15)[1] - 4))
    # Branch line 3 (y = 25): two heads in a nested pair block turned 180 degrees, two mirrored singles.
    msp.add_line(p(2, 25), p(42, 25), dxfattribs={"layer": "FP-PIPE"})
    msp.add_blockref("SPK-PAIR", p(24, 25), dxfattribs={"layer": "FP-HEAD", "rotation": 180})
    head(msp, 6, 25, xscale=-1)
    head(msp, 42, 25, yscale=-1)

    # A head on no pipe, and a pipe crossing branch line 3 with no shared vertex (not a joint).
    head(msp, 40, 10)
    msp.add_line(p(36, 22), p(36, 28), dxfattribs={"layer": "FP-PIPE"})

    # Size labels beside the pipes (ASCII and a non-ASCII fraction).
    for text, x, y in [("2\u00bd\"", -5, 15.6), ("2\"", 2.6, 20), ("1-1/4\"", 24, 5.6), ("1 1/4\"", 24, 15.6), ("1\"", 12, 25.6)]:
        msp.add_text(text, dxfattribs={"layer": "FP-PIPE", "height": 4, "insert": p(x, y)})
    return doc


def heads_in_world(doc):
    """World position of every SPK reference, through nested references, as ezdxf computes them."""
    out = []

    def visit(entity, top_handle):
        if entity.dxftype() != "INSERT":
            return
        if entity.dxf.name == "SPK":
            ins = entity.dxf.insert
            attribs = {a.dxf.tag.upper(): a.dxf.text for a in entity.attribs}
            out.append({"handle": top_handle, "x": ins.x / FT, "y": ins.y / FT, "attributes": attribs})
            return
        for child in entity.virtual_entities():
            visit(child, top_handle)

    for e in doc.modelspace().query("INSERT"):
        if e.dxf.layer == "FP-HEAD":
            visit(e, e.dxf.handle)
    return sorted(out, key=lambda h: (round(h["y"], 6), round(h["x"], 6)))


def build_transforms():
    """Block references nested three deep with base points, rotation, mirroring, scale and a MINSERT array."""
    doc = ezdxf.new("AC1015")
    doc.header["$INSUNITS"] = 2  # feet
    head = doc.blocks.new("HD", base_point=(0.25, -0.5))
    head.add_circle((0.25, -0.5), 0.2)
    pair = doc.blocks.new("PAIR", base_point=(1, 1))
    pair.add_blockref("HD", (1, 1), dxfattribs={"layer": "0"})
    pair.add_blockref("HD", (4, 1), dxfattribs={"layer": "0", "rotation": 30, "xscale": -1})
    quad = doc.blocks.new("QUAD", base_point=(0, 0))
    quad.add_blockref("PAIR", (0, 0), dxfattribs={"layer": "0", "rotation": 90})
    quad.add_blockref("PAIR", (10, 2), dxfattribs={"layer": "0", "xscale": 2, "yscale": -0.5})
    msp = doc.modelspace()
    msp.add_blockref("QUAD", (100, 50), dxfattribs={"layer": "HEADS", "rotation": 45, "xscale": 1.5, "yscale": 1.5})
    msp.add_blockref("QUAD", (-20, 5), dxfattribs={"layer": "HEADS", "rotation": 200, "xscale": -1, "yscale": 1})
    msp.add_blockref("HD", (7, 7), dxfattribs={"layer": "HEADS", "rotation": 15, "xscale": 3, "yscale": 2})
    grid = msp.add_blockref("PAIR", (30, 30), dxfattribs={"layer": "HEADS", "rotation": 10})
    grid.grid(size=(2, 3), spacing=(5, 8))  # 2 rows, 3 columns
    return doc


def transforms_truth(doc):
    out = []

    def visit(entity, top_handle):
        if entity.dxftype() != "INSERT":
            return
        if entity.dxf.name == "HD":
            ins = entity.dxf.insert
            out.append({"handle": top_handle, "x": ins.x, "y": ins.y})
            return
        for child in entity.virtual_entities():
            visit(child, top_handle)

    for e in doc.modelspace().query("INSERT"):
        for single in e.multi_insert():
            visit(single, e.dxf.handle)
    return sorted(out, key=lambda h: (round(h["x"], 6), round(h["y"], 6)))


def room_and_pipes(msp, layer_pipe="FP-PIPE", layer_wall="A-WALL", layer_source="FP-SOURCE"):
    """The bay's room, riser, feed main, cross main and three branch lines (heads at x = 6, 18, 30, 42 ft)."""
    msp.add_lwpolyline([p(0, 0), p(48, 0), p(48, 30), p(0, 30)], close=True, dxfattribs={"layer": layer_wall})
    msp.add_blockref("RISER", p(-10, 15), dxfattribs={"layer": layer_source})
    msp.add_line(p(-10, 15), p(2, 15), dxfattribs={"layer": layer_pipe})
    msp.add_lwpolyline([p(2, 5), p(2, 25)], dxfattribs={"layer": layer_pipe})
    for y in (5, 15, 25):
        msp.add_line(p(2, y), p(42, y), dxfattribs={"layer": layer_pipe})
    for text, x, y in [("2-1/2\"", -5, 15.6), ("2\"", 2.6, 20), ("1\"", 12, 5.6), ("1\"", 12, 15.6), ("1\"", 12, 25.6)]:
        msp.add_text(text, dxfattribs={"layer": layer_pipe, "height": 4, "insert": p(x, y)})


HEAD_POINTS = [(x, y) for y in (5, 15, 25) for x in (6, 18, 30, 42)]


def build_exploded():
    """The bay with its heads exploded: each head a plain CIRCLE (3 in radius) on the head layer, no block."""
    doc = ezdxf.new("AC1015")
    doc.header["$INSUNITS"] = 1
    for name in ("FP-HEAD", "FP-PIPE", "A-WALL", "FP-SOURCE"):
        doc.layers.new(name)
    define_blocks(doc)
    msp = doc.modelspace()
    room_and_pipes(msp)
    for x, y in HEAD_POINTS:
        msp.add_circle(p(x, y), 3, dxfattribs={"layer": "FP-HEAD"})
    return doc


def build_busy():
    """Heads on a layer named like nothing in particular, beside furniture, light fixtures and dimension ticks."""
    doc = ezdxf.new("AC1032")
    doc.header["$INSUNITS"] = 1
    for name in ("FP-DEVICES", "FP-PIPE", "A-WALL", "FP-SOURCE", "I-FURN", "E-LITE", "A-ANNO-DIMS"):
        doc.layers.new(name)
    define_blocks(doc)
    head = doc.blocks.new("SPRK-UPRIGHT", base_point=(0, 0))
    head.add_circle((0, 0), 3)
    head.add_line((-3, 0), (3, 0))
    head.add_attdef("K", (4, 4), dxfattribs={"height": 2}).dxf.text = "5.6"
    chair = doc.blocks.new("CHAIR-A", base_point=(0, 0))
    chair.add_lwpolyline([(0, 0), (20, 0), (20, 22), (0, 22)], close=True)
    light = doc.blocks.new("LIGHT-2X4", base_point=(0, 0))
    light.add_lwpolyline([(0, 0), (24, 0), (24, 48), (0, 48)], close=True)
    tick = doc.blocks.new("TICK", base_point=(0, 0))
    tick.add_line((-0.05, -0.05), (0.05, 0.05))
    msp = doc.modelspace()
    room_and_pipes(msp)
    for x, y in HEAD_POINTS:
        msp.add_blockref("SPRK-UPRIGHT", p(x, y), dxfattribs={"layer": "FP-DEVICES"}).add_attrib("K", "5.6", p(x + 0.5, y + 0.5))
    for i in range(40):
        msp.add_blockref("CHAIR-A", p(3 + (i % 10) * 4, 2 + (i // 10) * 7), dxfattribs={"layer": "I-FURN"})
    for i in range(20):
        msp.add_blockref("LIGHT-2X4", p(4 + (i % 5) * 9, 3 + (i // 5) * 7), dxfattribs={"layer": "E-LITE"})
    for i in range(60):
        msp.add_blockref("TICK", p(i * 0.8, -2), dxfattribs={"layer": "A-ANNO-DIMS"})
    return doc


def layer_counts(doc):
    """Model-space entity counts by layer and type as ezdxf reads them, a block's contents counted once per placed
    copy on the layer they take (their own, or the reference's for layer 0); attribute definitions not counted."""
    counts = {}

    def count(entity, layer, times):
        by_type = counts.setdefault(layer, {})
        by_type[entity.dxftype()] = by_type.get(entity.dxftype(), 0) + times
        if entity.dxftype() == "INSERT":
            copies = entity.dxf.get("row_count", 1) * entity.dxf.get("column_count", 1)
            for inner in doc.blocks[entity.dxf.name]:
                if inner.dxftype() != "ATTDEF":
                    count(inner, layer if inner.dxf.layer == "0" else inner.dxf.layer, times * copies)

    for e in doc.modelspace():
        count(e, e.dxf.layer, 1)
    return counts


def block_sizes(doc, names):
    """Each block's drawn extent across (the larger of width and height; attribute definitions are not drawn), by
    ezdxf's bounding-box module."""
    from ezdxf import bbox
    out = {}
    for name in names:
        box = bbox.extents([e for e in doc.blocks[name] if e.dxftype() != "ATTDEF"], fast=True)
        out[name] = round(max(box.size.x, box.size.y), 6)
    return out


def first_contact(out):
    """Drawings a reviewer meets first: exploded heads, heads among furniture, a drawing that states no unit."""
    truth = {}
    exploded = build_exploded()
    exploded.saveas(out / "exploded-heads.dxf")
    doc = ezdxf.readfile(out / "exploded-heads.dxf")
    truth["exploded"] = {
        "file": "exploded-heads.dxf",
        "heads": sorted(({"handle": c.dxf.handle, "x": c.dxf.center.x / FT, "y": c.dxf.center.y / FT}
                         for c in doc.modelspace().query("CIRCLE[layer=='FP-HEAD']")), key=lambda h: (h["y"], h["x"])),
    }
    busy = build_busy()
    busy.saveas(out / "busy-layers.dxf")
    doc = ezdxf.readfile(out / "busy-layers.dxf")
    truth["busy"] = {
        "file": "busy-layers.dxf",
        "heads": sorted(({"handle": e.dxf.handle, "x": e.dxf.insert.x / FT, "y": e.dxf.insert.y / FT}
                         for e in doc.modelspace().query("INSERT[name=='SPRK-UPRIGHT']")), key=lambda h: (h["y"], h["x"])),
        "layers": layer_counts(doc),
        "blockSizes": block_sizes(doc, ["SPRK-UPRIGHT", "CHAIR-A", "LIGHT-2X4", "TICK", "RISER"]),
    }
    r12 = ezdxf.readfile(out / "bay2-r12.dxf")
    truth["noUnit"] = {"file": "bay2-r12.dxf", "insunits": r12.header.get("$INSUNITS", None), "layers": layer_counts(r12)}
    (out / "first-contact.truth.json").write_text(json.dumps(truth, indent=2, ensure_ascii=False) + "\n", encoding="utf-8")


def pipe_label(msp, text, x, y):
    msp.add_text(text, dxfattribs={"layer": "FP-PIPE", "height": 4, "insert": p(x, y)})


def new_building():
    doc = ezdxf.new("AC1027")
    doc.header["$INSUNITS"] = 1
    for name in ("FP-HEAD", "FP-PIPE", "A-WALL", "FP-SOURCE", "FP-ZONE"):
        doc.layers.new(name)
    define_blocks(doc)
    return doc


def piped_room(msp, riser, cross_x, lines, heads_x, sizes=("3\"", "2\"", "1-1/4\"")):
    """A riser, a feed main to a cross main at x = cross_x, and a branch line at each y of `lines` with heads at
    `heads_x` (a list per line, or one list for all)."""
    ys = list(lines)
    mid = (ys[0] + ys[-1]) / 2
    msp.add_blockref("RISER", p(*riser), dxfattribs={"layer": "FP-SOURCE"})
    msp.add_lwpolyline([p(*riser), p(riser[0], mid), p(cross_x, mid)], dxfattribs={"layer": "FP-PIPE"})
    msp.add_line(p(cross_x, ys[0]), p(cross_x, ys[-1]), dxfattribs={"layer": "FP-PIPE"})
    pipe_label(msp, sizes[0], riser[0] + 0.6, (riser[1] + mid) / 2)
    pipe_label(msp, sizes[1], cross_x + 0.6, (ys[0] + ys[1]) / 2)
    for k, y in enumerate(ys):
        xs = heads_x[k] if isinstance(heads_x[0], list) else heads_x
        far = max(xs, key=lambda x: abs(x - cross_x))
        msp.add_line(p(cross_x, y), p(far, y), dxfattribs={"layer": "FP-PIPE"})
        pipe_label(msp, sizes[2], (cross_x + xs[0]) / 2 if xs[0] > cross_x else (cross_x + xs[-1]) / 2, y + 0.6)
        for x in xs:
            head(msp, x, y)


def build_two_risers():
    """Two halls of an invented community workshop, each fed by a riser of its own: the west hall 60 x 40 ft at
    12 x 10 ft, the east hall 52 x 33 ft with uneven spacing (heads 10 and 11 ft apart, lines 11 ft apart)."""
    doc = new_building()
    msp = doc.modelspace()
    msp.add_lwpolyline([p(0, 0), p(60, 0), p(60, 40), p(0, 40)], close=True, dxfattribs={"layer": "A-WALL"})
    piped_room(msp, (-8, 18), 1, [5, 15, 25, 35], [6, 18, 30, 42, 54])
    msp.add_lwpolyline([p(80, 0), p(132, 0), p(132, 33), p(80, 33)], close=True, dxfattribs={"layer": "A-WALL"})
    piped_room(msp, (140, 12), 131, [5.5, 16.5, 27.5], [85, 95, 106, 117, 127])
    return doc


def build_zones():
    """One system across an office (light hazard, heads 12 ft apart) and a storage room (ordinary hazard group 2,
    heads 10 ft apart) of an invented print shop: 76 x 40 ft, the zones split at x = 36 ft; the branch lines run
    through both, so their spacing changes on the way."""
    doc = new_building()
    msp = doc.modelspace()
    msp.add_lwpolyline([p(0, 0), p(76, 0), p(76, 40), p(0, 40)], close=True, dxfattribs={"layer": "A-WALL"})
    piped_room(msp, (-8, 20), 1, [5, 15, 25, 35], [6, 18, 30, 41, 51, 61, 71])
    msp.add_lwpolyline([p(0, 0), p(36, 0), p(36, 40), p(0, 40)], close=True, dxfattribs={"layer": "FP-ZONE"})
    msp.add_lwpolyline([p(36, 0), p(76, 0), p(76, 40), p(36, 40)], close=True, dxfattribs={"layer": "FP-ZONE"})
    msp.add_text("OFFICE 1.01", dxfattribs={"layer": "FP-ZONE", "height": 12, "insert": p(12, 20)})
    msp.add_mtext("STORAGE\\P1.02", dxfattribs={"layer": "FP-ZONE", "char_height": 12, "insert": p(50, 21)})
    return doc


def build_l_room():
    """An L-shaped studio of an invented dance school: a 72 x 24 ft bar along the south and a 24 x 36 ft wing up the
    west side; branch lines run east-west, six heads long in the bar and two in the wing."""
    doc = new_building()
    msp = doc.modelspace()
    msp.add_lwpolyline([p(0, 0), p(72, 0), p(72, 24), p(24, 24), p(24, 60), p(0, 60)], close=True,
                       dxfattribs={"layer": "A-WALL"})
    bar = [6, 18, 30, 42, 54, 66]
    piped_room(msp, (-8, 30), 1, [4, 12, 20, 28, 37, 46, 55], [bar, bar, bar, [6, 18], [6, 18], [6, 18], [6, 18]])
    return doc


def building(out):
    """Whole-building drawings (two risers, hazard zones, an L-shaped room) and what ezdxf reads back of them: the
    risers' handles and every head's handle and position, feet."""
    truth = {}
    for name, build_doc in [("two-risers", build_two_risers), ("zones", build_zones), ("l-room", build_l_room)]:
        file = f"building-{name}.dxf"
        build_doc().saveas(out / file)
        doc = ezdxf.readfile(out / file)
        assert not doc.audit().has_errors, name
        msp = doc.modelspace()
        truth[name] = {
            "file": file,
            "risers": [e.dxf.handle for e in msp.query("INSERT[name=='RISER']")],
            "heads": [{"handle": e.dxf.handle, "x": e.dxf.insert.x / FT, "y": e.dxf.insert.y / FT}
                      for e in msp.query("INSERT[name=='SPK']")],
        }
    (out / "building.truth.json").write_text(json.dumps(truth, indent=2) + "\n", encoding="utf-8")


def main(out_dir):
    out = Path(out_dir)
    out.mkdir(parents=True, exist_ok=True)
    truth = {"writer": f"ezdxf {ezdxf.__version__}", "units": "in", "versions": {}}
    for version in VERSIONS:
        doc = build(version)
        name = f"bay2-{version.lower()}.dxf"
        doc.saveas(out / name)
        reread = ezdxf.readfile(out / name)
        auditor = reread.audit()
        truth["versions"][version] = {
            "file": name,
            "acadver": reread.dxfversion,
            "auditErrors": len(auditor.errors),
            "heads": heads_in_world(reread),
            "layers": sorted(layer.dxf.name for layer in reread.layers),
        }
    tdoc = build_transforms()
    tdoc.saveas(out / "transforms.dxf")
    truth["transforms"] = {"file": "transforms.dxf", "heads": transforms_truth(ezdxf.readfile(out / "transforms.dxf"))}
    (out / "bay2.truth.json").write_text(json.dumps(truth, indent=2, ensure_ascii=False) + "\n", encoding="utf-8")
    first_contact(out)
    building(out)


if __name__ == "__main__":
    main(sys.argv[1] if len(sys.argv) > 1 else "fixtures")
