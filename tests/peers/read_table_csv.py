"""Reads a table the way the page's reader is documented to, with Python's own csv module:
prints one JSON object with the kept rows (1-based file line and numbers, as repr strings so
they round-trip exactly) and the refused rows
(line, 1-based column, reason kind). Usage: read_table_csv.py FILE SEPARATOR DECIMAL_COMMA HEADER
where SEPARATOR is comma|semicolon|tab|spaces, DECIMAL_COMMA and HEADER are 0 or 1."""
import csv
import json
import math
import sys

path, sep, decimal_comma, header = sys.argv[1], sys.argv[2], sys.argv[3] == "1", sys.argv[4] == "1"
delim = {"comma": ",", "semicolon": ";", "tab": "\t"}.get(sep)
kept, refused = [], []
columns = None
with open(path, encoding="utf-8-sig", newline="") as f:
    lines = f.read().splitlines()
for number, line in enumerate(lines, start=1):
    if not line.strip() or line.lstrip().startswith("#"):
        continue
    cells = line.split() if delim is None else next(csv.reader([line], delimiter=delim))
    if columns is None:
        columns = len(cells)
        if header:
            continue
    row, why = [], None
    for j, cell in enumerate(cells[:columns]):
        text = cell.strip()
        if not text:
            why = why or (j + 1, "empty")
            continue
        if decimal_comma:
            text = text.replace(",", ".", 1)
        try:
            v = float(text)
        except ValueError:
            why = why or (j + 1, "word")
            continue
        if not math.isfinite(v):
            why = why or (j + 1, "nonfinite")
            continue
        row.append(repr(v))
    if why is None and len(cells) < columns:
        why = (len(cells) + 1, "toofew")
    if why is None:
        kept.append([number, row])
    else:
        refused.append([number, why[0], why[1]])
print(json.dumps({"kept": kept, "refused": refused}))
