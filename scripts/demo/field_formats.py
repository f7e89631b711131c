#!/usr/bin/python3
"""Write the invented demo field's spectroscopic list as FITS and VOTable (for the format demos).

Uses Debian's python3-astropy (5.2.1 when these files were made); run with /usr/bin/python3.
The FITS file is a binary table in HDU 1 with EXTNAME KESTREL_SPEC and units in TUNITn; the VOTable
uses TABLEDATA with UCDs on the position and redshift columns.
"""
import os

import astropy
from astropy.io import ascii
from astropy.io.votable import from_table

here = os.path.dirname(os.path.abspath(__file__))
demo = os.path.join(here, "..", "..", "fixtures", "demo")
table = ascii.read(os.path.join(demo, "kestrel_spec.csv"), format="csv", comment="#")
table["group_id"] = [str(v) if v is not None and str(v) != "--" else "" for v in table["group_id"].filled("")]
table["ra"].unit = "deg"
table["dec"].unit = "deg"
table.meta = {"ORIGIN": "forehalo demo (invented data)", "COMMENT": ["astropy " + astropy.__version__]}

fits_path = os.path.join(demo, "kestrel_spec.fits")
t = table.copy()
t.meta["EXTNAME"] = "KESTREL_SPEC"
t.write(fits_path, format="fits", overwrite=True)

vot = from_table(table)
fields = vot.get_first_table().fields
ucds = {"id": "meta.id;meta.main", "ra": "pos.eq.ra;meta.main", "dec": "pos.eq.dec;meta.main", "z": "src.redshift"}
for f in fields:
    if f.name in ucds:
        f.ucd = ucds[f.name]
vot.to_xml(os.path.join(demo, "kestrel_spec.vot"), tabledata_format="tabledata")
print("wrote kestrel_spec.fits and kestrel_spec.vot with astropy", astropy.__version__)
