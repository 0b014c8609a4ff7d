#!/usr/bin/env python3
"""Checks the layout a chart or report reports through SETDOSE_TEST_LAYOUT=1 (its standard
error: a "layout W H PAGES DROPPED" line, then "box PAGE GROUP KIND X Y W H SIZE TEXT" lines,
points at A4), and optionally the rendered pages.

usage: layout_check.py DUMP [--labels N] [--fill PDF] [--skip-pages K]
  - no box was dropped; every text is at least 8 pt;
  - within one chart (page, group) no two label boxes meet, and no label box meets a mark or
    an obstacle (threshold lines and their captions);
  - --labels N: the dump holds at least N label boxes (the test would pass on none otherwise);
  - --fill PDF: every page but the last reaches 75 % of its body (the content mark the layout
    records), and the rendered page (pdftoppm, greyscale) agrees: its last inked row above the
    footer is at least 75 % of the way down the body. --skip-pages K skips the first K pages
    (a roster's contents page).
Prints one line per failure and exits 1 on any."""
import subprocess
import sys
import tempfile
import os

MIN_PT = 8.0
TOP, FOOT = 40.0, 48.0          # the report's top margin and footer band (chart_report.c)


def load(path):
    head, boxes = None, []
    for line in open(path, encoding="utf-8", errors="replace"):
        f = line.rstrip("\n").split(" ", 9)
        if f[0] == "layout":
            head = (float(f[1]), float(f[2]), int(f[3]), int(f[4]))
        elif f[0] == "box":
            boxes.append(dict(page=int(f[1]), group=int(f[2]), kind=f[3], x=float(f[4]),
                              y=float(f[5]), w=float(f[6]), h=float(f[7]), size=float(f[8]),
                              text=f[9] if len(f) > 9 else ""))
    return head, boxes


def meet(a, b, eps=0.01):
    return (a["x"] + eps < b["x"] + b["w"] and b["x"] + eps < a["x"] + a["w"] and
            a["y"] + eps < b["y"] + b["h"] and b["y"] + eps < a["y"] + a["h"])


def rendered_fill(pdf, page, page_h):
    """Fraction of the body (top margin to footer) above the page's last inked row."""
    with tempfile.TemporaryDirectory() as d:
        out = os.path.join(d, "p")
        subprocess.run(["pdftoppm", "-gray", "-r", "36", "-f", str(page), "-l", str(page),
                        pdf, out], check=True)
        name = [n for n in os.listdir(d) if n.endswith(".pgm")][0]
        data = open(os.path.join(d, name), "rb").read()
    # PGM (P5): header of four tokens, then one byte a pixel.
    parts, pos = [], 0
    while len(parts) < 4:
        while data[pos:pos + 1].isspace():
            pos += 1
        start = pos
        while not data[pos:pos + 1].isspace():
            pos += 1
        parts.append(data[start:pos])
    pos += 1
    w, h = int(parts[1]), int(parts[2])
    px = data[pos:]
    scale = h / page_h
    top, foot = int(TOP * scale), int((page_h - FOOT) * scale)
    last = top
    for row in range(top, foot):
        line = px[row * w:(row + 1) * w]
        if min(line) < 200:
            last = row
    return (last - top) / (foot - top)


def main(argv):
    path, labels, pdf, skip = argv[1], 0, None, 0
    i = 2
    while i < len(argv):
        if argv[i] == "--labels":
            labels = int(argv[i + 1]); i += 2
        elif argv[i] == "--fill":
            pdf = argv[i + 1]; i += 2
        elif argv[i] == "--skip-pages":
            skip = int(argv[i + 1]); i += 2
        else:
            sys.exit("unknown argument " + argv[i])
    head, boxes = load(path)
    bad = []
    if not head:
        bad.append("no layout line")
        head = (0, 0, 0, 0)
    if head[3]:
        bad.append("%d boxes dropped" % head[3])
    small = [b for b in boxes if b["kind"] == "text" and b["text"] and b["size"] < MIN_PT - 1e-6]
    for b in small[:5]:
        bad.append("text '%s' is %.2f pt, under %g" % (b["text"], b["size"], MIN_PT))
    lab = [b for b in boxes if b["kind"] == "label"]
    if len(lab) < labels:
        bad.append("only %d label boxes, wanted at least %d" % (len(lab), labels))
    groups = {}
    for b in boxes:
        groups.setdefault((b["page"], b["group"]), []).append(b)
    for key, bs in groups.items():
        ls = [b for b in bs if b["kind"] == "label"]
        others = [b for b in bs if b["kind"] in ("mark", "obstacle")]
        for i, a in enumerate(ls):
            for b in ls[i + 1:]:
                if meet(a, b):
                    bad.append("page %d chart %d: labels '%s' and '%s' meet" % (key + (a["text"], b["text"])))
            for b in others:
                if meet(a, b):
                    bad.append("page %d chart %d: label '%s' meets %s '%s'" % (key + (a["text"], b["kind"], b["text"])))
    if pdf:
        pages = head[2]
        content = {}
        for b in boxes:
            if b["kind"] == "content":
                content[b["page"]] = max(content.get(b["page"], 0), b["y"] + b["h"])
        body = head[1] - TOP - FOOT
        for p in range(skip, pages - 1):
            fill = (content.get(p, TOP) - TOP) / body
            if fill < 0.75:
                bad.append("page %d: the layout fills %.0f%% of the body, under 75%%" % (p + 1, 100 * fill))
            seen = rendered_fill(pdf, p + 1, head[1])
            if seen < 0.75:
                bad.append("page %d: the rendered page is inked to %.0f%% of the body, under 75%%" % (p + 1, 100 * seen))
            print("page %d fill: layout %.0f%%, rendered %.0f%%" % (p + 1, 100 * fill, 100 * seen))
    for b in bad:
        print("FAIL " + b)
    print("%d boxes, %d labels, %d pages: %s" % (len(boxes), len(lab), head[2], "bad" if bad else "ok"))
    return 1 if bad else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
