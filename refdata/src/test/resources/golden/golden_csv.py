"""The CSV writer of the golden-data scripts in this directory (make_hyperfine_uncertainty_golden.py,
make_zeeman_uncertainty_golden.py): comment lines, the column row, then one row per value list, each
value free of commas, LF line ends."""


def write(name, comments, columns, rows):
    with open(name, "w", newline="\n") as f:
        for line in comments:
            f.write(line + "\n")
        f.write(",".join(columns) + "\n")
        for row in rows:
            assert len(row) == len(columns) and all("," not in str(x) for x in row), row
            f.write(",".join(str(x) for x in row) + "\n")
