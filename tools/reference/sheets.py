"""Writes R datasets (as exported by tools/reference/reading.R into
testdata/reading) as spreadsheet files, .xlsx with openpyxl and .ods with
odfpy through pandas, into testdata/sheets, and, for each file and sheet,
every cell as pandas.read_excel reads it (header=None), one line per row,
cells separated by tabs, numbers written with repr. Run from the project
root with Debian's python3 (python3-pandas, python3-openpyxl, python3-odf):
    /usr/bin/python3 tools/reference/sheets.py
"""
import pandas as pd

src = "testdata/reading"
out = "testdata/sheets"
books = {
    # the data on the first sheet, a second sheet after it
    "chickweight": [("ChickWeight", "chickweight_id_diet_weight.csv"), ("Morley", "morley_expt_speed.csv")],
    # the data on the second sheet, behind a sheet of notes
    "npk": [("About", None), ("npk", "npk.csv")],
    "states": [("states", "states_thousands_comma.csv")],
}


def frame(csv):
    if csv is None:
        return pd.DataFrame({"Note": ["R dataset npk (R 4.2.2, package datasets)", "data on the next sheet"]})
    df = pd.read_csv(f"{src}/{csv}", sep=";" if "point" in csv else ",", thousands="," if "comma" in csv else None)
    return df.drop(columns=[c for c in df.columns if c.startswith("Unnamed")])


def cell(v):
    if isinstance(v, float):
        return "" if v != v else repr(v)
    return str(v)


# R's warpbreaks with a title merged over the table and a header on two rows, "Loom" merged over wool and tension,
# as a report-style export has it (openpyxl: merged cells keep their value in the top-left cell only)
def merged_book(path):
    from openpyxl import Workbook
    wb = Workbook()
    ws = wb.active
    ws.title = "warpbreaks"
    ws.append(["Warp breaks by wool and tension (R dataset warpbreaks)"])
    ws.merge_cells("A1:C1")
    ws.append(["Loom", None, "Breaks"])
    ws.merge_cells("A2:B2")
    ws.append(["wool", "tension", None])
    for row in pd.read_csv(f"{src}/warpbreaks.csv").itertuples(index=False):
        ws.append([row.wool, row.tension, int(row.breaks)])
    wb.save(path)


merged_book(f"{out}/warpbreaks_merged.xlsx")
df = pd.read_excel(f"{out}/warpbreaks_merged.xlsx", header=None, engine="openpyxl")
with open(f"{out}/warpbreaks_merged.xlsx.1.tsv", "w") as f:
    for row in df.itertuples(index=False):
        f.write("\t".join(cell(v) for v in row) + "\n")

for book, sheets in books.items():
    for ext, engine in (("xlsx", "openpyxl"), ("ods", "odf")):
        path = f"{out}/{book}.{ext}"
        with pd.ExcelWriter(path, engine=engine) as w:
            for name, csv in sheets:
                frame(csv).to_excel(w, sheet_name=name, index=False)
        for i, (name, _) in enumerate(sheets):
            df = pd.read_excel(path, sheet_name=name, header=None, engine=engine)
            with open(f"{out}/{book}.{ext}.{i + 1}.tsv", "w") as f:
                for row in df.itertuples(index=False):
                    f.write("\t".join(cell(v) for v in row) + "\n")
