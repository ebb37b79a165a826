"""One interface: the README's vocabulary table matches the CLI, and every option of every
command is either honoured (the output changes as documented) or refused with ``error:``
naming the option (docs/interface.md, §15).

The values behind the honoured cases are checked elsewhere against outside sources; here the
check is that an option is never silently ignored, and that the documented equalities hold
(``--color n`` is ``--rep [n-1]``; ``--K`` is ``--level`` + 2 for SU(2), common practice).
"""

from __future__ import annotations

import json
import os
import re
from pathlib import Path

import pytest
import typer.main
from typer.testing import CliRunner

from knotobs.cli import app

README = Path(__file__).resolve().parent.parent / "README.md"
runner = CliRunner()


def _commands():
    root = typer.main.get_command(app)

    def walk(c, path=()):
        if hasattr(c, "commands"):
            for n, sub in c.commands.items():
                yield from walk(sub, path + (n,))
        else:
            yield path, c

    return list(walk(root))


def _options(cmd, hidden=False):
    return [p for p in cmd.params if p.param_type_name == "option" and bool(getattr(p, "hidden", False)) == hidden]


def _readme_table():
    text = README.read_text()
    start = text.index("| concept | option | short | default | meaning |")
    rows = {}
    for line in text[start:].splitlines()[2:]:
        if not line.startswith("|"):
            break
        cells = [c.strip() for c in line.strip("|").split("|")]
        names = re.findall(r"--[a-zA-Z-]+", cells[1])
        short = cells[2].strip("`") if cells[2] != "—" else None
        default = cells[3][1:-1] if cells[3].startswith("`") else cells[3]
        rows[names[0]] = {"all": names, "short": short, "default": default}
    return rows


# ------------------------------------------------------------------ the vocabulary table
def test_readme_vocabulary_table_matches_the_cli():
    table = _readme_table()
    assert {"--group", "--rep", "--color", "--level", "--digits", "--framing", "--normalized", "--raw", "--route",
            "--in", "--fiber", "--output", "--json"} <= set(table)
    seen = set()
    for path, cmd in _commands():
        for p in _options(cmd):
            longs = [o for o in p.opts if o.startswith("--")]
            shorts = [o for o in p.opts if not o.startswith("--")]
            name = longs[0]
            if name not in table:
                continue
            seen.add(name)
            row = table[name]
            where = f"knotobs {' '.join(path)} {name}"
            assert (shorts[0] if shorts else None) == row["short"], where
            if p.secondary_opts:
                assert row["all"] == [name] + list(p.secondary_opts), where
            if row["default"] == "off":
                assert p.default in (False, None), where
            elif row["default"] not in ("—", "as defined", "on a terminal") and p.default is not None:
                assert str(p.default) == row["default"], (where, p.default, row["default"])
    assert seen == set(table), set(table) - seen       # every row of the table is a real option


def test_short_flags_mean_one_thing():
    meaning = {}
    for path, cmd in _commands():
        for p in _options(cmd):
            longs = [o for o in p.opts if o.startswith("--")]
            for s in (o for o in p.opts if not o.startswith("--")):
                assert meaning.setdefault(s, longs[0]) == longs[0], (path, s, longs[0], meaning[s])


def test_every_command_takes_json():
    for path, cmd in _commands():
        assert "--json" in [o for p in _options(cmd) for o in p.opts], path


def test_spelling_of_options():
    for path, cmd in _commands():
        for p in _options(cmd):
            for o in list(p.opts) + list(p.secondary_opts):
                assert not re.search(r"colour|fibre|normalis", o), (path, o)


# ------------------------------------------------------------------ every option honoured or refused
def _run(args, tmp):
    args = [a.replace("{tmp}", str(tmp)) for a in args]
    r = runner.invoke(app, args)
    return r.exit_code, r.output


#: (command, option, base args, args with the option, expectation)
#: expectation: "changes" (both succeed, outputs differ), "same" (a documented default or
#: equality), "refused" (exit 2, one ``error:`` line naming the option), "renamed" (names the new option).
CASES = [
    # loop
    ("loop", "--group", ["loop", "T(2,3)"], ["loop", "T(2,3)", "-g", "SU(3)"], "changes"),
    ("loop", "--rep", ["loop", "T(2,3)"], ["loop", "T(2,3)", "-r", "[2]"], "changes"),
    ("loop", "--color", ["loop", "T(2,3)", "-r", "[2]", "--json"], ["loop", "T(2,3)", "-c", "3", "--json"], "same-exact"),
    ("loop", "--color", ["loop", "T(2,3)"], ["loop", "T(2,3)", "-c", "3"], "changes"),
    ("loop", "--framing", ["loop", "T(2,3)"], ["loop", "T(2,3)", "-f", "1"], "changes"),
    ("loop", "--normalized", ["loop", "T(2,3)"], ["loop", "T(2,3)", "--normalized"], "changes"),
    ("loop", "--unnormalized", ["loop", "T(2,3)"], ["loop", "T(2,3)", "--unnormalized"], "same"),
    ("loop", "--normalized", None, ["loop", "T(2,3)", "-k", "3", "--normalized"], "refused"),
    ("loop", "--route", ["loop", "T(2,3)"], ["loop", "T(2,3)", "--route", "both"], "changes"),
    ("loop", "--route", ["loop", "T(2,3)", "-k", "2", "--in", "L(5,1)"], ["loop", "T(2,3)", "-k", "2", "--in", "L(5,1)", "--route", "both"], "changes"),
    ("loop", "--route", None, ["loop", "T(2,3)", "-k", "2", "--route", "weight-sum"], "refused"),
    ("loop", "--level", ["loop", "T(2,3)"], ["loop", "T(2,3)", "-k", "3"], "changes"),
    ("loop", "--in", None, ["loop", "T(2,3)", "--in", "L(5,1)"], "refused"),
    ("loop", "--in", ["loop", "fiber", "-k", "2"], ["loop", "fiber", "-k", "2", "--in", "Sigma(2,3,5)"], "changes"),
    ("loop", "--fiber", None, ["loop", "--fiber", "1"], "refused"),
    ("loop", "--fiber", ["loop", "--in", "Sigma(2,3,5)", "-k", "2", "--fiber", "1"],
     ["loop", "--in", "Sigma(2,3,5)", "-k", "2", "--fiber", "3"], "changes"),
    ("loop", "--fiber", None, ["loop", "--in", "Sigma(2,3,5)", "-k", "2", "--fiber", "0"], "refused"),
    ("loop", "--digits", None, ["loop", "T(2,3)", "-d", "10"], "refused"),
    ("loop", "--digits", ["loop", "T(2,3)", "-k", "3"], ["loop", "T(2,3)", "-k", "3", "-d", "10"], "changes"),
    ("loop", "--raw", None, ["loop", "T(2,3)", "--raw"], "refused"),
    ("loop", "--raw", ["loop", "T(2,3)", "-k", "3"], ["loop", "T(2,3)", "-k", "3", "--raw"], "changes"),
    ("loop", "--json", ["loop", "T(2,3)"], ["loop", "T(2,3)", "--json"], "changes"),
    # poly
    ("poly", "--family", ["poly", "T(2,3)"], ["poly", "T(2,3)", "--family", "alexander"], "changes"),
    ("poly", "--color", None, ["poly", "T(2,3)", "-c", "3"], "refused"),
    ("poly", "--color", ["poly", "T(2,3)", "--family", "homfly"], ["poly", "T(2,3)", "--family", "homfly", "-c", "3"], "changes"),
    ("poly", "--color", ["poly", "T(2,3)", "--family", "colored-jones", "-c", "2"],
     ["poly", "T(2,3)", "--family", "colored-jones", "-c", "3"], "changes"),
    ("poly", "--rep", ["poly", "T(2,3)", "--family", "homfly"], ["poly", "T(2,3)", "--family", "homfly", "-r", "[2]"], "changes"),
    ("poly", "--rep", None, ["poly", "T(2,3)", "-r", "[2]"], "refused"),
    ("poly", "--rep", None, ["poly", "T(2,3)", "--family", "alexander", "-r", "[2]"], "refused"),
    ("poly", "--group", ["poly", "T(2,3)", "--family", "homfly"], ["poly", "T(2,3)", "--family", "homfly", "-g", "SU(3)"], "changes"),
    ("poly", "--group", None, ["poly", "T(2,3)", "-g", "SU(3)"], "refused"),
    ("poly", "--t", ["poly", "T(2,3)"], ["poly", "T(2,3)", "--t", "q"], "changes"),
    ("poly", "--t", None, ["poly", "T(2,3)", "--family", "homfly", "--t", "q"], "refused"),
    ("poly", "--mirror", ["poly", "T(2,3)"], ["poly", "T(2,3)", "--mirror"], "changes"),
    ("poly", "--form", ["poly", "T(2,3)", "--family", "homfly"], ["poly", "T(2,3)", "--family", "homfly", "--form", "aq"], "changes"),
    ("poly", "--form", None, ["poly", "T(2,3)", "--form", "aq"], "refused"),
    ("poly", "--unnormalized", ["poly", "T(2,3)"], ["poly", "T(2,3)", "--unnormalized"], "changes"),
    ("poly", "--normalized", ["poly", "T(2,3)"], ["poly", "T(2,3)", "--normalized"], "same"),
    ("poly", "--unnormalized", None, ["poly", "T(2,3)", "--family", "alexander", "--unnormalized"], "refused"),
    ("poly", "--N", None, ["poly", "T(2,3)", "--family", "homfly", "--N", "3"], "renamed:--group"),
    ("poly", "--rep", ["poly", "T(2,3)", "--family", "superpolynomial"], ["poly", "T(2,3)", "--family", "superpolynomial", "-r", "[2]"], "changes"),
    ("poly", "--rep", None, ["poly", "T(2,3)", "--family", "superpolynomial", "-r", "[2,1]"], "refused:[2, 1]"),
    ("poly", "--route", ["poly", "T(2,3)", "--family", "superpolynomial", "-r", "[2]"], ["poly", "T(2,3)", "--family", "superpolynomial", "-r", "[2]", "--route", "both"], "changes"),
    ("poly", "--route", ["poly", "T(2,3)", "--family", "superpolynomial", "-r", "[2]", "--json"], ["poly", "T(2,3)", "--family", "superpolynomial", "-r", "[2]", "--route", "elliptic-hall", "--json"], "same-exact"),
    ("poly", "--route", None, ["poly", "T(2,3)", "--family", "superpolynomial", "-r", "[2]", "--route", "nabla"], "refused:nabla"),
    ("poly", "--route", None, ["poly", "T(2,3)", "--route", "both"], "refused"),
    ("poly", "--json", ["poly", "T(2,3)"], ["poly", "T(2,3)", "--json"], "changes"),
    # fibers
    ("fibers", "--in", ["fibers", "fiber"], ["fibers", "fiber", "--in", "Sigma(2,3,5)"], "changes"),
    ("fibers", "--fiber", ["fibers", "T(2,5)"], ["fibers", "T(2,5)", "--fiber", "2"], "changes"),
    ("fibers", "--fiber", None, ["fibers", "T(2,5)", "--fiber", "3"], "refused"),
    ("fibers", "--core", None, ["fibers", "T(2,5)", "--core", "5"], "renamed:--fiber"),
    ("fibers", "--json", ["fibers", "T(2,5)"], ["fibers", "T(2,5)", "--json"], "changes"),
    # space
    ("space", "--surgery", ["space", "L(5,1)"], ["space", "--surgery", "T(2,3)", "--slope", "5"], "changes"),
    ("space", "--slope", ["space", "--surgery", "T(2,3)", "--slope", "5"], ["space", "--surgery", "T(2,3)", "--slope", "7"], "changes"),
    ("space", "--group", None, ["space", "L(5,1)", "-g", "SU(3)"], "refused"),
    ("space", "--group", ["space", "L(5,1)", "-k", "2"], ["space", "L(5,1)", "-k", "2", "-g", "SU(3)"], "changes"),
    ("space", "--level", ["space", "L(5,1)"], ["space", "L(5,1)", "-k", "2"], "changes"),
    ("space", "--digits", None, ["space", "L(5,1)", "-d", "10"], "refused"),
    ("space", "--digits", ["space", "L(5,1)", "-k", "2"], ["space", "L(5,1)", "-k", "2", "-d", "10"], "changes"),
    ("space", "--route", None, ["space", "L(5,1)", "--route", "both"], "refused"),
    ("space", "--route", ["space", "Sigma(2,3,5)", "-k", "3"], ["space", "Sigma(2,3,5)", "-k", "3", "--route", "both"], "changes"),
    ("space", "--route", ["space", "Sigma(2,3,5)", "-k", "3"], ["space", "Sigma(2,3,5)", "-k", "3", "--route", "integral"], "changes"),
    ("space", "--route", None, ["space", "Sigma(2,3,5)", "-k", "3", "--group", "SU(3)", "--route", "integral"], "refused"),
    ("space", "--route", ["space", "Sigma(2,3,5)", "-k", "3", "-g", "SU(3)"], ["space", "Sigma(2,3,5)", "-k", "3", "-g", "SU(3)", "--route", "convolution"], "changes"),
    ("space", "--route", None, ["space", "Sigma(2,3,5)", "-k", "3", "--route", "convolution"], "refused"),
    ("space", "--json", ["space", "L(5,1)"], ["space", "L(5,1)", "--json"], "changes"),
    # match
    ("match", "--poly", ["match", "--poly", "t + t^3 - t^4"], ["match", "--poly", "t^2 + t^4 - t^5 + t^6 - t^7"], "changes"),
    ("match", "--file", ["match", "--poly", "t + t^3 - t^4"], ["match", "--file", "{tmp}/p.txt"], "changes"),
    ("match", "--knotinfo", ["match", "T(2,3)", "--poly", "t + t^3 - t^4"], ["match", "T(2,3)", "--knotinfo"], "changes"),
    ("match", "--invariant", ["match", "T(2,3)", "--knotinfo"], ["match", "T(2,3)", "--knotinfo", "-i", "homfly"], "changes"),
    ("match", "--group", ["match", "--poly", "t + t^3 - t^4"], ["match", "--poly", "t + t^3 - t^4", "-g", "SU(3)"], "changes"),
    ("match", "--group", None, ["match", "T(2,3)", "--knotinfo", "-g", "SU(3)"], "refused"),
    ("match", "--rep", ["match", "T(2,3)", "--poly", "t + t^3 - t^4"], ["match", "T(2,3)", "--poly", "t + t^3 - t^4", "-r", "[2]"], "changes"),
    ("match", "--rep", None, ["match", "--poly", "t + t^3 - t^4", "-r", "[2]"], "refused"),
    ("match", "--color", ["match", "T(2,3)", "--poly", "t + t^3 - t^4"], ["match", "T(2,3)", "--poly", "t + t^3 - t^4", "-c", "3"], "changes"),
    ("match", "--color", None, ["match", "--poly", "t + t^3 - t^4", "-c", "3"], "refused"),
    ("match", "--max-p", ["match", "--poly", "t^3 + t^5 - t^8"], ["match", "--poly", "t^3 + t^5 - t^8", "--max-p", "2"], "changes"),
    ("match", "--max-p", None, ["match", "T(2,3)", "--knotinfo", "--max-p", "2"], "refused"),
    ("match", "--max-q", ["match", "--poly", "t + t^3 - t^4"], ["match", "--poly", "t + t^3 - t^4", "--max-q", "2"], "changes"),
    ("match", "--max-q", None, ["match", "T(2,3)", "--knotinfo", "--max-q", "2"], "refused"),
    ("match", "--max-boxes", ["match", "--poly", "t + t^3 - t^4"], ["match", "--poly", "t + t^3 - t^4", "--max-boxes", "1"], "changes"),
    ("match", "--max-boxes", None, ["match", "T(2,3)", "--knotinfo", "--max-boxes", "1"], "refused"),
    ("match", "--links", ["match", "--poly", "-t^(1/2) - t^(5/2)"], ["match", "--poly", "-t^(1/2) - t^(5/2)", "--knots-only"], "changes"),
    ("match", "--links", None, ["match", "T(2,3)", "--knotinfo", "--links"], "refused"),
    ("match", "--max-colour", None, ["match", "--poly", "t", "--max-colour", "2"], "renamed:--max-boxes"),
    ("match", "--json", ["match", "--poly", "t + t^3 - t^4"], ["match", "--poly", "t + t^3 - t^4", "--json"], "changes"),
    # flat
    ("flat", "--order", ["flat", "Sigma(2,3,5)"], ["flat", "Sigma(2,3,5)", "--order", "2"], "changes"),
    ("flat", "--order", None, ["flat", "L(5,1)", "-g", "SU(3)", "--order", "2"], "refused"),
    ("flat", "--group", ["flat", "L(5,1)"], ["flat", "L(5,1)", "-g", "SU(3)"], "changes"),
    ("flat", "--json", ["flat", "L(5,1)"], ["flat", "L(5,1)", "--json"], "changes"),
    ("flat", "--digits", ["flat", "Sigma(2,3,7)", "-g", "SL(2,C)"], ["flat", "Sigma(2,3,7)", "-g", "SL(2,C)", "-d", "25"], "changes"),
    ("flat", "--digits", None, ["flat", "Sigma(2,3,7)", "-d", "25"], "refused"),
    # borel
    ("borel", "--order", ["borel", "Sigma(2,3,5)", "--order", "20"], ["borel", "Sigma(2,3,5)", "--order", "24"], "changes"),
    ("borel", "--count", ["borel", "Sigma(2,3,5)", "--order", "20"], ["borel", "Sigma(2,3,5)", "--order", "20", "--count", "2"], "changes"),
    ("borel", "--digits", ["borel", "Sigma(2,3,5)", "--order", "20"], ["borel", "Sigma(2,3,5)", "--order", "20", "-d", "15"], "changes"),
    ("borel", "--K", ["borel", "Sigma(2,3,5)", "--order", "20"], ["borel", "Sigma(2,3,5)", "--order", "20", "--K", "9"], "changes"),
    ("borel", "--json", ["borel", "Sigma(2,3,5)", "--order", "20"], ["borel", "Sigma(2,3,5)", "--order", "20", "--json"], "changes"),
    # qseries
    ("qseries", "--order", ["qseries", "Sigma(2,3,5)", "--order", "8"], ["qseries", "Sigma(2,3,5)", "--order", "12"], "changes"),
    ("qseries", "--label", ["qseries", "L(5,2)", "--order", "4"], ["qseries", "L(5,2)", "--order", "4", "--label", "all"], "changes"),
    ("qseries", "--K", ["qseries", "Sigma(2,3,5)", "--order", "8"], ["qseries", "Sigma(2,3,5)", "--order", "8", "--K", "7"], "changes"),
    ("qseries", "--digits", ["qseries", "Sigma(2,3,5)", "--order", "8", "--K", "7"], ["qseries", "Sigma(2,3,5)", "--order", "8", "--K", "7", "-d", "15"], "changes"),
    ("qseries", "--digits", None, ["qseries", "Sigma(2,3,5)", "--order", "8", "-d", "15"], "refused"),
    ("qseries", "--json", ["qseries", "Sigma(2,3,5)", "--order", "8"], ["qseries", "Sigma(2,3,5)", "--order", "8", "--json"], "changes"),
    # continue
    ("continue", "--level", ["continue", "Sigma(2,3,5)", "-k", "3.5", "-d", "10"], ["continue", "Sigma(2,3,5)", "-k", "4.5", "-d", "10"], "changes"),
    ("continue", "--K", ["continue", "Sigma(2,3,5)", "-k", "3.5", "-d", "10", "--json"], ["continue", "Sigma(2,3,5)", "--K", "5.5", "-d", "10", "--json"], "same-numeric"),
    ("continue", "--K", None, ["continue", "Sigma(2,3,5)", "-k", "3.5", "--K", "5.5"], "refused"),
    ("continue", "--couplings", ["continue", "T(2,3)", "--couplings", "10+2i,10-2i", "-d", "10"], ["continue", "T(2,3)", "--couplings", "12+2i,12-2i", "-d", "10"], "changes"),
    ("continue", "--couplings", None, ["continue", "Sigma(2,3,5)", "-k", "3.5", "--couplings", "10,10"], "refused:--level"),
    ("continue", "--group", ["continue", "T(2,3)", "--couplings", "10+2i,10-2i", "-d", "10"], ["continue", "T(2,3)", "--couplings", "10+2i,10-2i", "-d", "10", "-g", "SL(3,C)"], "changes"),
    ("continue", "--group", None, ["continue", "Sigma(2,3,5)", "-k", "3.5", "-g", "SU(4)"], "refused"),
    ("continue", "--group", ["continue", "L(5,1)", "-k", "3.5", "-d", "10"], ["continue", "L(5,1)", "-k", "3.5", "-d", "10", "-g", "SU(3)"], "changes"),
    ("continue", "--group", None, ["continue", "L(5,1)", "-k", "3.5", "-g", "SO(3)"], "refused"),
    ("continue", "--K", ["continue", "L(5,1)", "-g", "SU(3)", "-k", "3.5", "-d", "10", "--json"], ["continue", "L(5,1)", "-g", "SU(3)", "--K", "6.5", "-d", "10", "--json"], "same-numeric"),
    ("continue", "--route", ["continue", "M(0; -1; (2,1), (4,1), (4,1))", "-k", "3.5", "-d", "10"], ["continue", "M(0; -1; (2,1), (4,1), (4,1))", "-k", "3.5", "-d", "10", "--route", "both"], "changes"),
    ("continue", "--route", None, ["continue", "L(5,1)", "-k", "3.5", "--route", "both"], "refused"),
    ("continue", "--phases", ["continue", "L(5,1)", "-g", "SU(3)", "-k", "3.5", "-d", "10"], ["continue", "L(5,1)", "-g", "SU(3)", "-k", "3.5", "-d", "10", "--phases", "lawrence-rozansky"], "changes"),
    ("continue", "--digits", ["continue", "L(5,1)", "-g", "SU(3)", "-k", "3.5", "-d", "10"], ["continue", "L(5,1)", "-g", "SU(3)", "-k", "3.5", "-d", "12"], "changes"),
    ("continue", "--json", ["continue", "L(5,1)", "-g", "SU(3)", "-k", "3.5", "-d", "10"], ["continue", "L(5,1)", "-g", "SU(3)", "-k", "3.5", "-d", "10", "--json"], "changes"),
    ("continue", "--level", ["continue", "L(5,1)", "-g", "SU(3)", "-k", "3.5", "-d", "10"], ["continue", "L(5,1)", "-g", "SU(3)", "-k", "4.5", "-d", "10"], "changes"),
    ("continue", "--rep", None, ["continue", "L(5,1)", "-g", "SU(3)", "-k", "3.5", "-r", "[2];[]"], "refused"),
    ("continue", "--rep", ["continue", "T(2,3)", "--couplings", "10+2i,10-2i", "-d", "10"], ["continue", "T(2,3)", "--couplings", "10+2i,10-2i", "-d", "10", "-r", "[2];[]"], "changes"),
    ("continue", "--rep", None, ["continue", "Sigma(2,3,5)", "-k", "3.5", "-r", "[2];[]"], "refused"),
    ("continue", "--digits", ["continue", "Sigma(2,3,5)", "-k", "3.5", "-d", "10"], ["continue", "Sigma(2,3,5)", "-k", "3.5", "-d", "12"], "changes"),
    ("continue", "--phases", None, ["continue", "T(2,3)", "--couplings", "10,10", "--phases", "reduced"], "refused"),
    ("continue", "--phases", ["continue", "Sigma(2,3,5)", "-k", "3.5", "-d", "10"], ["continue", "Sigma(2,3,5)", "-k", "3.5", "-d", "10", "--phases", "lawrence-rozansky"], "changes"),
    ("continue", "--N", None, ["continue", "T(2,3)", "--couplings", "10,10", "--N", "3"], "renamed:--group"),
    ("continue", "--json", ["continue", "Sigma(2,3,5)", "-k", "3.5", "-d", "10"], ["continue", "Sigma(2,3,5)", "-k", "3.5", "-d", "10", "--json"], "changes"),
    # plot (data only, --json, except where the file is the point)
    ("plot", "--output", ["plot", "zeros", "T(2,3)", "--json"], ["plot", "zeros", "T(2,3)", "--json", "-o", "{tmp}/z.png"], "changes"),
    ("plot", "--json", ["plot", "zeros", "T(2,3)", "-o", "{tmp}/z.png"], ["plot", "zeros", "T(2,3)", "-o", "{tmp}/z.png", "--json"], "changes"),
    ("plot", "--re", ["plot", "level-plane", "Sigma(2,3,5)", "--json", "--n", "2"], ["plot", "level-plane", "Sigma(2,3,5)", "--json", "--n", "2", "--re", "4,6"], "changes"),
    ("plot", "--re", None, ["plot", "zeros", "T(2,3)", "--json", "--re", "0,1"], "refused"),
    ("plot", "--im", ["plot", "level-plane", "Sigma(2,3,5)", "--json", "--n", "2"], ["plot", "level-plane", "Sigma(2,3,5)", "--json", "--n", "2", "--im", "0,1"], "changes"),
    ("plot", "--im", None, ["plot", "asymptotics", "L(5,1)", "--json", "--im", "0,1"], "refused"),
    ("plot", "--n", ["plot", "level-plane", "Sigma(2,3,5)", "--json", "--n", "2"], ["plot", "level-plane", "Sigma(2,3,5)", "--json", "--n", "3"], "changes"),
    ("plot", "--n", None, ["plot", "zeros", "T(2,3)", "--json", "--n", "3"], "refused"),
    ("plot", "--progress", ["plot", "level-plane", "Sigma(2,3,5)", "--json", "--n", "2"], ["plot", "level-plane", "Sigma(2,3,5)", "--json", "--n", "2", "--progress"], "changes"),
    ("plot", "--progress", None, ["plot", "zeros", "T(2,3)", "--json", "--progress"], "refused"),
    ("plot", "--kmax", ["plot", "asymptotics", "L(5,1)", "--json", "--kmax", "6"], ["plot", "asymptotics", "L(5,1)", "--json", "--kmax", "8"], "changes"),
    ("plot", "--kmax", ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3"], ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "4"], "changes"),
    ("plot", "--kmax", None, ["plot", "zeros", "T(2,3)", "--json", "--kmax", "4"], "refused"),
    ("plot", "--color", ["plot", "zeros", "T(2,3)", "--json"], ["plot", "zeros", "T(2,3)", "--json", "-c", "3"], "changes"),
    ("plot", "--color", ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3"], ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3", "-c", "3"], "changes"),
    ("plot", "--color", None, ["plot", "asymptotics", "L(5,1)", "--json", "-c", "3"], "refused"),
    ("plot", "--rep", ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3"], ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3", "-r", "[2]"], "changes"),
    ("plot", "--rep", None, ["plot", "zeros", "T(2,3)", "--json", "-r", "[2]"], "refused"),
    ("plot", "--group", ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3"], ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3", "-g", "SU(3)"], "changes"),
    ("plot", "--group", None, ["plot", "zeros", "T(2,3)", "--json", "-g", "SU(3)"], "refused"),
    ("plot", "--group", ["plot", "level-plane", "L(5,1)", "--json", "--n", "2"], ["plot", "level-plane", "L(5,1)", "--json", "--n", "2", "-g", "SU(3)"], "changes"),
    ("plot", "--framing", ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3"], ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3", "-f", "1"], "changes"),
    ("plot", "--framing", None, ["plot", "zeros", "T(2,3)", "--json", "-f", "1"], "refused"),
    ("plot", "--normalized", ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3"], ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3", "--normalized"], "changes"),
    ("plot", "--normalized", None, ["plot", "zeros", "T(2,3)", "--json", "--normalized"], "refused"),
    ("plot", "--unnormalized", ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3"], ["plot", "wilson-level", "T(2,3)", "--json", "--kmax", "3", "--unnormalized"], "same"),
    ("plot", "--unnormalized", None, ["plot", "zeros", "T(2,3)", "--json", "--unnormalized"], "refused:--normalized"),
    ("plot", "--out", None, ["plot", "zeros", "T(2,3)", "--out", "{tmp}/z.png"], "renamed:--output"),
    # grid (the effect is read back from the store: see _grid_effect)
    ("grid run", "--knots", ["T(2,3)"], ["T(2,5)"], "grid"),
    ("grid run", "--max-pq", ["--max-pq", "6"], ["--max-pq", "10"], "grid"),
    ("grid run", "--links", ["--max-pq", "6"], ["--max-pq", "6", "--links"], "grid"),
    ("grid run", "--links", None, ["grid", "run", "--knots", "T(2,3)", "--links"], "refused"),
    ("grid run", "--group", ["T(2,3)"], ["T(2,3)", "-g", "SU(3)"], "grid"),
    ("grid run", "--rep", ["T(2,3)"], ["T(2,3)", "-r", "[2]"], "grid"),
    ("grid run", "--color", ["T(2,3)", "-r", "[2]"], ["T(2,3)", "-c", "3"], "grid-same"),
    ("grid run", "--color", ["T(2,3)"], ["T(2,3)", "-c", "3"], "grid"),
    ("grid run", "--level", ["T(2,3)"], ["T(2,3)", "-k", "generic,2"], "grid"),
    ("grid run", "--quantity", ["T(2,3)"], ["T(2,3)", "--quantity", "homfly"], "grid"),
    ("grid run", "--normalized", ["T(2,3)"], ["T(2,3)", "--normalized"], "grid"),
    ("grid run", "--unnormalized", ["T(2,3)"], ["T(2,3)", "--unnormalized"], "grid-same"),
    ("grid run", "--framing", ["T(2,3)"], ["T(2,3)", "-f", "1"], "grid"),
    ("grid run", "--framing", None, ["grid", "run", "--knots", "T(2,3)", "--quantity", "homfly", "-f", "1"], "refused"),
    ("grid run", "--digits", ["T(2,3)", "-k", "2"], ["T(2,3)", "-k", "2", "-d", "10"], "grid"),
    ("grid run", "--store", ["T(2,3)"], ["T(2,3)"], "grid-store"),
    ("grid run", "--workers", ["T(2,3)"], ["T(2,3)", "-w", "1"], "grid-same"),
    ("grid run", "--scheduler", None, ["grid", "run", "--knots", "T(2,3)", "--scheduler", "tcp://127.0.0.1:9", "--store", "{tmp}/s.sqlite"], "refused:scheduler"),
    ("grid run", "--progress", ["T(2,3)"], ["T(2,3)", "--progress"], "grid-stderr"),
    ("grid run", "--json", ["T(2,3)"], ["T(2,3)", "--json"], "grid-output"),
    ("grid run", "--reps", None, ["grid", "run", "--knots", "T(2,3)", "--reps", "[1]"], "renamed:--rep"),
    ("grid run", "--levels", None, ["grid", "run", "--knots", "T(2,3)", "--levels", "generic"], "renamed:--level"),
    ("grid run", "--dps", None, ["grid", "run", "--knots", "T(2,3)", "--dps", "20"], "renamed:--digits"),
    ("grid resume", "--store", None, ["grid", "resume", "--store", "{tmp}/nope.sqlite"], "refused:--store"),
    ("grid resume", "--workers", None, None, "resume"),
    ("grid resume", "--scheduler", None, None, "resume"),
    ("grid resume", "--progress", None, None, "resume"),
    ("grid resume", "--json", None, None, "resume"),
    ("grid export", "--store", None, None, "export"),
    ("grid export", "--format", None, None, "export"),
    ("grid export", "--output", None, None, "export"),
    ("grid export", "--json", None, None, "export"),
    ("grid export", "--out", None, ["grid", "export", "--out", "x.csv"], "renamed:--output"),
    ("grid status", "--store", None, ["grid", "status", "--store", "{tmp}/nope.sqlite"], "refused:--store"),
    ("grid status", "--json", None, None, "export"),
]


def test_every_option_of_every_command_is_in_the_table():
    have = {(c, o) for c, o, *_ in CASES}
    for path, cmd in _commands():
        for p in _options(cmd) + _options(cmd, hidden=True):
            for o in [x for x in p.opts if x.startswith("--")] + list(p.secondary_opts):
                if o in ("--no-progress", "--knots-only") or o.startswith("--no-"):
                    continue
                assert (" ".join(path), o) in have, (" ".join(path), o)


def _refused(code, out, name):
    lines = [ln for ln in out.strip().splitlines() if ln.strip()]
    return code == 2 and lines[-1].startswith("error:") and name in lines[-1] and "Traceback" not in out


def _grid_effect(extra, tmp, name):
    store = str(tmp / f"{name}.sqlite")
    args = ["grid", "run", "--workers", "0", "--no-progress", "--store", store]
    if extra and re.fullmatch(r"T\(\d+,\d+\)", extra[0]):
        args += ["--knots", extra[0]] + extra[1:]
    else:
        args += list(extra)
    if "--progress" in args:
        args.remove("--no-progress")
    r = runner.invoke(app, args)
    assert r.exit_code == 0, (args, r.output)
    rows = json.loads(runner.invoke(app, ["grid", "export", "--store", store, "--format", "json"]).stdout)
    for row in rows:
        for k in ("store", "created", "computed_at", "seconds", "version", "time"):
            row.pop(k, None)
    return rows, r.output


@pytest.mark.parametrize("command,option,base,args,expect", CASES, ids=[f"{c}:{o}:{e}" for c, o, _, _, e in CASES])
def test_option_is_honoured_or_refused(command, option, base, args, expect, tmp_path):
    (tmp_path / "p.txt").write_text("t^2 + t^4 - t^5 + t^6 - t^7\n")
    if expect.startswith(("refused", "renamed")):
        code, out = _run(args, tmp_path)
        name = option if ":" not in expect else expect.split(":", 1)[1]
        assert _refused(code, out, name), (args, code, out)
        return
    if expect in ("resume", "export"):
        db = str(tmp_path / "g.sqlite")
        assert runner.invoke(app, ["grid", "run", "--knots", "T(2,3)", "-k", "generic,2", "--workers", "0",
                                   "--no-progress", "--store", db]).exit_code == 0
        if expect == "resume":
            extra = {"--workers": ["-w", "1"], "--progress": ["--progress"], "--json": ["--json"],
                     "--scheduler": ["--scheduler", "tcp://127.0.0.1:9"]}[option]
            import sqlite3

            def drop_rows():               # leave the grid unfinished, so that resume has work to do
                with sqlite3.connect(db) as con:
                    con.execute("DELETE FROM rows")

            drop_rows()
            r0 = runner.invoke(app, ["grid", "resume", "--store", db, "--no-progress", "-w", "0"])
            drop_rows()
            r1 = runner.invoke(app, ["grid", "resume", "--store", db, "--no-progress", "-w", "0"] + extra)
            if option == "--scheduler":     # the scheduler is used: unreachable is an error naming it
                assert r1.exit_code == 2 and "error:" in r1.output and "tcp://127.0.0.1:9" in r1.output
            elif option == "--workers":     # workers change how, not what: the same rows are stored
                assert r0.exit_code == 0 and r1.exit_code == 0, r1.output
                assert "2 computed" in r0.output and "2 computed" in r1.output, (r0.output, r1.output)
            else:
                assert r0.exit_code == 0 and r1.exit_code == 0 and r0.output != r1.output, (option, r1.output)
            return
        if command == "grid status":
            a = runner.invoke(app, ["grid", "status", "--store", db])
            b = runner.invoke(app, ["grid", "status", "--store", db, "--json"])
            assert a.exit_code == b.exit_code == 0 and json.loads(b.stdout)["rows"] == 2 and a.output != b.output
            return
        a = runner.invoke(app, ["grid", "export", "--store", db])
        extra = {"--store": ["--store", str(tmp_path / "other.sqlite")], "--format": ["--format", "latex"],
                 "--output": ["-o", str(tmp_path / "out.csv")], "--json": ["--json"]}[option]
        if option == "--store":
            assert runner.invoke(app, ["grid", "run", "--knots", "T(2,5)", "--workers", "0", "--no-progress",
                                       "--store", str(tmp_path / "other.sqlite")]).exit_code == 0
        b = runner.invoke(app, ["grid", "export", "--store", db] + extra if option != "--store" else ["grid", "export"] + extra)
        assert a.exit_code == 0 and b.exit_code == 0, b.output
        if option == "--output":
            assert (tmp_path / "out.csv").read_text() == a.stdout
        else:
            assert a.stdout != b.stdout
        return
    if expect.startswith("grid"):
        rows0, out0 = _grid_effect(base, tmp_path, "a")
        rows1, out1 = _grid_effect(args, tmp_path, "b")
        if expect == "grid":
            assert rows0 != rows1, (base, args)
        elif expect == "grid-same":
            assert [r.get("exact") for r in rows0] == [r.get("exact") for r in rows1], (base, args)
        elif expect == "grid-store":
            assert os.path.exists(tmp_path / "a.sqlite") and os.path.exists(tmp_path / "b.sqlite")
        elif expect == "grid-stderr":
            assert "#" in out1 and "#" not in out0
        elif expect == "grid-output":
            assert out0 != out1 and json.loads(out1)
        return
    c0, out0 = _run(base, tmp_path)
    c1, out1 = _run(args, tmp_path)
    ok = (0, 1) if command == "match" else (0,)
    assert c0 in ok and c1 in ok, (base, out0, args, out1)
    if expect == "changes":
        assert out0 != out1, (base, args)
    elif expect == "same":
        assert out0 == out1, (base, args)
    elif expect == "same-exact":
        assert json.loads(out0)["exact"] == json.loads(out1)["exact"]
    elif expect == "same-numeric":
        assert json.loads(out0)["numeric"] == json.loads(out1)["numeric"]
    else:  # pragma: no cover
        raise AssertionError(expect)


# ------------------------------------------------------------------ item 7: stores
def test_resume_of_a_missing_store_does_not_create_it(tmp_path):
    f = tmp_path / "nope.sqlite"
    r = runner.invoke(app, ["grid", "resume", "--store", str(f)])
    assert r.exit_code == 2 and "error:" in r.output and "--store" in r.output
    assert not f.exists()


def test_a_failed_run_leaves_no_store(tmp_path):
    f = tmp_path / "s.sqlite"
    r = runner.invoke(app, ["grid", "run", "--knots", "T(2,3)", "--scheduler", "tcp://127.0.0.1:9", "--store", str(f)])
    assert r.exit_code == 2
    assert not any(tmp_path.iterdir()), list(tmp_path.iterdir())


# ------------------------------------------------------------------ start-up
def test_a_command_does_not_load_what_it_does_not_use():
    """``poly`` loads neither typer's pydantic coercion, nor rich's help, nor the finite-level
    machinery; ``--version`` loads no command line at all."""
    import subprocess
    import sys

    code = ("import sys; sys.argv = ['knotobs', 'poly', 'T(2,3)', '--json']\n"
            "from knotobs.__main__ import main\n"
            "try:\n    main()\nexcept SystemExit:\n    pass\n"
            "bad = [m for m in ('pydantic', 'rich.markdown', 'sympy', 'matplotlib', 'knotobs.evaluation.modular',"
            " 'knotobs.evaluation.surgery', 'knotobs.tables.compare') if m in sys.modules]\n"
            "sys.stderr.write(repr(bad))")
    r = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True)
    assert r.returncode == 0 and r.stderr.strip() == "[]", r.stderr
    code = ("import sys; sys.argv = ['knotobs', '--version']\nfrom knotobs.__main__ import main\nmain()\n"
            "sys.stderr.write(repr([m for m in ('typer', 'numpy', 'flint') if m in sys.modules]))")
    r = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True)
    assert r.stdout.startswith("knotobs ") and r.stderr.strip() == "[]", r.stderr


def test_plain_option_values_are_still_checked():
    r = runner.invoke(app, ["loop", "T(2,3)", "-k", "x"])
    assert r.exit_code == 2 and "'x' is not a valid integer" in r.output and "--level" in r.output
    r = runner.invoke(app, ["loop", "T(2,3)", "-k", "3", "-d", "12", "--json"])
    assert r.exit_code == 0 and json.loads(r.stdout)["numeric"]["digits"] == 12
