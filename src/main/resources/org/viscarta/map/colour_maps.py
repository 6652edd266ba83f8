"""Writes the colour-map tables Viscarta's maps use, from matplotlib's published tables.

viridis: van der Walt and Smith (2015), the matplotlib default, perceptually uniform and readable
by the common forms of colour blindness; cividis: Nuñez, Anderton and Renslow, PLoS ONE 13 (2018)
e0199239, optimised for colour-vision deficiency. 256 entries each, written as hex RGB, one a line.

Run: python3 colour_maps.py   (writes viridis.txt and cividis.txt beside this script)
"""
import os

import matplotlib
from matplotlib import colormaps

HERE = os.path.dirname(os.path.abspath(__file__))
for name in ("viridis", "cividis"):
    cmap = colormaps[name]
    with open(os.path.join(HERE, name + ".txt"), "w") as f:
        f.write(f"# {name}, 256 entries, from matplotlib {matplotlib.__version__}\n")
        for i in range(256):
            r, g, b, _ = cmap(i / 255)
            f.write("#%02X%02X%02X\n" % (round(r * 255), round(g * 255), round(b * 255)))
