#!/usr/bin/env python3
"""The palette for colour-blind readers and greyscale print.

  cvd.py check [palette.h]        every pair that must read apart still does after a simulated
                                  deuteranopia and after greyscale conversion; exit 1 if not
  cvd.py image IN.ppm OUT-PREFIX  writes OUT-PREFIX-deut.png and OUT-PREFIX-grey.png from a
                                  rendered page (pdftoppm -r 60 page.pdf x gives x-1.ppm), to look at

Deuteranopia: the severity-1.0 matrix of Machado, Oliveira & Fernandes (2009), applied to
linear RGB (coefficients from memory, to four decimals). Greyscale: luminance with the ITU-R
BT.709 weights, as print drivers and most converters do. Distances: CIE L*a*b* (D65), the
1976 colour difference."""
import re
import struct
import sys
import zlib

MACHADO_DEUT = ((0.367322, 0.860646, -0.227968),
                (0.280085, 0.672501, 0.047413),
                (-0.011820, 0.042940, 0.968881))


def lin(c):
    c /= 255.0
    return c / 12.92 if c <= 0.04045 else ((c + 0.055) / 1.055) ** 2.4


def gam(c):
    c = min(max(c, 0.0), 1.0)
    return 255.0 * (12.92 * c if c <= 0.0031308 else 1.055 * c ** (1 / 2.4) - 0.055)


def deut(rgb):
    l = [lin(v) for v in rgb]
    return tuple(gam(sum(MACHADO_DEUT[i][k] * l[k] for k in range(3))) for i in range(3))


def grey(rgb):
    y = sum(w * lin(v) for w, v in zip((0.2126, 0.7152, 0.0722), rgb))
    g = gam(y)
    return (g, g, g)


def lab(rgb):
    r, g, b = (lin(v) for v in rgb)
    x = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047
    y = 0.2126 * r + 0.7152 * g + 0.0722 * b
    z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883
    f = lambda t: t ** (1 / 3) if t > 0.008856 else 7.787 * t + 16 / 116
    return (116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z)))


def de(a, b):
    return sum((p - q) ** 2 for p, q in zip(lab(a), lab(b))) ** 0.5


def palette(path):
    pal = {}
    for m in re.finditer(r'\{ 0x(..), 0x(..), 0x(..), \d+, "([a-z0-9-]+)" \}', open(path).read()):
        pal[m.group(4)] = tuple(int(m.group(i), 16) for i in (1, 2, 3))
    pal["white"] = (255, 255, 255)
    return pal


# Pairs drawn on or beside each other, which a reader must tell apart (chart_*.c).
PAIRS = [("band-curve", "band-group"), ("band-group", "band-athlete"), ("band-athlete", "white"),
         ("curve", "band-curve"), ("curve", "band-group"), ("mark", "band-curve"),
         ("mark", "band-group"), ("mark", "band-athlete"), ("mark", "curve"), ("mark", "white"),
         ("zone-plateau", "zone-building"), ("zone-beyond", "zone-plateau"), ("swc", "white"),
         ("heat0", "heat1"), ("heat1", "heat2"), ("heat2", "heat3"), ("ink", "band-curve"),
         ("grid", "white")]
MIN_DE = 8.0       # colour difference after the deuteranopia simulation
MIN_DL = 4.0       # lightness difference in greyscale (grid lines are meant to be faint)


def check(path):
    pal = palette(path)
    bad = 0
    for a, b in PAIRS:
        d = de(deut(pal[a]), deut(pal[b]))
        g = abs(lab(grey(pal[a]))[0] - lab(grey(pal[b]))[0])
        ok = d >= MIN_DE and g >= MIN_DL
        bad += not ok
        print("%-13s %-13s deuteranopia dE %5.1f  greyscale dL %5.1f  %s" % (a, b, d, g, "ok" if ok else "TOO CLOSE"))
    # The heat ramp must darken monotonically in greyscale, so order survives print.
    ls = [lab(grey(pal["heat%d" % i]))[0] for i in range(4)]
    if any(ls[i] <= ls[i + 1] for i in range(3)):
        print("heat ramp does not darken monotonically in greyscale:", ls)
        bad += 1
    return 1 if bad else 0


def read_ppm(path):
    data = open(path, "rb").read()
    parts, pos = [], 0
    while len(parts) < 4:
        while data[pos:pos + 1].isspace():
            pos += 1
        s = pos
        while not data[pos:pos + 1].isspace():
            pos += 1
        parts.append(data[s:pos])
    assert parts[0] == b"P6", "wants a binary PPM (P6)"
    return int(parts[1]), int(parts[2]), data[pos + 1:]


def write_png(path, w, h, rgb):
    raw = b"".join(b"\0" + rgb[y * w * 3:(y + 1) * w * 3] for y in range(h))
    chunk = lambda t, d: struct.pack(">I", len(d)) + t + d + struct.pack(">I", zlib.crc32(t + d))
    open(path, "wb").write(b"\x89PNG\r\n\x1a\n" + chunk(b"IHDR", struct.pack(">IIBBBBB", w, h, 8, 2, 0, 0, 0))
                           + chunk(b"IDAT", zlib.compress(raw, 6)) + chunk(b"IEND", b""))


def image(src, prefix):
    w, h, px = read_ppm(src)
    for name, fn in (("deut", deut), ("grey", grey)):
        cache, out = {}, bytearray(len(px))
        for i in range(0, len(px), 3):
            k = px[i:i + 3]
            if k not in cache:
                cache[k] = bytes(int(round(v)) for v in fn(tuple(k)))
            out[i:i + 3] = cache[k]
        write_png("%s-%s.png" % (prefix, name), w, h, bytes(out))


if __name__ == "__main__":
    if len(sys.argv) >= 2 and sys.argv[1] == "check":
        sys.exit(check(sys.argv[2] if len(sys.argv) > 2 else "src/plot/palette.h"))
    if len(sys.argv) == 4 and sys.argv[1] == "image":
        image(sys.argv[2], sys.argv[3])
        sys.exit(0)
    sys.exit(__doc__)
