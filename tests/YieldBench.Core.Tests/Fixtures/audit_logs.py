# The fermentation logs and the review's lots.csv as the audit scripts of this folder read them (kinetics-audit.py,
# forecast-course-audit.py, forecast-backtest-audit.py, forecast-priors-audit.py; imported from the script's own folder,
# which python puts first on its path). Written from docs/methods.md Part 1 and the logs' own layouts, not from the C#
# code: a CSV (comma or semicolon) or a workbook; a sheet headed Timestamp is one lot's log named by its sheet, any other
# starts Lot, Date, Time; sugar in a column headed Brix or SG (SG to °Brix by the cubic below), temperature in the column
# whose header starts Temp; a reading's decimal comma read as a point.
import csv, datetime as dt

def brix_from_sg(s):  # the NBS-fitted cubic, docs/methods.md Part 1 §1
    return ((182.4601 * s - 775.6821) * s + 1262.7794) * s - 669.5622

def read_rows(path):
    if path.endswith(".csv"):
        with open(path, encoding="utf-8-sig") as f:
            text = f.read()
        return [("csv", list(csv.reader(text.splitlines(), delimiter=";" if ";" in text.splitlines()[0] else ",")))]
    import openpyxl
    wb = openpyxl.load_workbook(path, read_only=True, data_only=True)
    return [(ws.title, [list(r) for r in ws.iter_rows(values_only=True)]) for ws in wb.worksheets]

def num(v):
    if v is None or v == "": return None
    return float(str(v).replace(",", ".")) if isinstance(v, str) else float(v)

def when(d, t):
    if isinstance(d, str): d = dt.datetime.fromisoformat(d)
    if t is None or t == "": return d
    if isinstance(t, str): t = dt.time.fromisoformat(t)
    return dt.datetime.combine(d.date(), t)

def read_logs(paths):
    """lot id -> list of (timestamp, °Brix or None, °C or None) in the order read."""
    logs = {}
    for path in paths:
        for title, rows in read_rows(path):
            head = [str(h or "").strip() for h in rows[0]]
            sugar_col = next(i for i, h in enumerate(head) if h in ("Brix", "SG"))
            is_sg = head[sugar_col] == "SG"
            temp_col = next(i for i, h in enumerate(head) if h.startswith("Temp"))
            for r in rows[1:]:
                if all(v is None or v == "" for v in r): continue
                if head[0] == "Timestamp":
                    lot, ts = title, (r[0] if isinstance(r[0], dt.datetime) else dt.datetime.fromisoformat(r[0]))
                else:
                    lot, ts = str(r[0]), when(r[1], r[2])
                s = num(r[sugar_col]); t = num(r[temp_col])
                if s is not None and is_sg: s = brix_from_sg(s)
                logs.setdefault(lot, []).append((ts, s, t))
    return logs

def read_lots(path):
    """The review's data/lots.csv, lot id -> its row."""
    return {r["lot_id"]: r for r in csv.DictReader(open(path, encoding="utf-8"))}
