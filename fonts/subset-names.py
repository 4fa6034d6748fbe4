# Renames a subset of Source Sans 3 to "Squadline Sans" (the OFL reserves the name "Source" for
# unmodified versions). Usage: python3 fonts/subset-names.py SUBSET.ttf OUT.ttf Regular|Bold (see README.md).
import sys
from fontTools.ttLib import TTFont
src, dst, style = sys.argv[1], sys.argv[2], sys.argv[3]
f = TTFont(src)
family = 'Squadline Sans'
full = f'{family} {style}'
ps = 'SquadlineSans-' + style.replace(' ', '')
name = f['name']
for rec in list(name.names):
    if rec.nameID in (1, 3, 4, 6, 16, 17, 21, 22, 25):
        name.removeNames(nameID=rec.nameID)
for pid, eid, lid in ((3, 1, 0x409), (1, 0, 0)):
    name.setName(family, 1, pid, eid, lid)
    name.setName(style, 2, pid, eid, lid)
    name.setName(f'{full}; 3.052 subset', 3, pid, eid, lid)
    name.setName(full, 4, pid, eid, lid)
    name.setName(ps, 6, pid, eid, lid)
f.save(dst)
for rec in f["name"].names:
    if rec.platformID == 3: print(rec.nameID, rec.toUnicode())
