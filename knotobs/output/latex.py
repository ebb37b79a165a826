"""Tabular and LaTeX renderings: polynomials, comparisons, and tables of stored rows.

Polynomials are typeset by a small exact printer (rational exponents as ``\\frac``);
a result's own ``_repr_latex_`` uses sympy's printer;
:func:`terminal_table` draws the same tables for a terminal with ``rich`` when it
is installed (it comes with typer) and as aligned plain text otherwise.
"""

from __future__ import annotations

import io
import json
from typing import Iterable, Sequence

from knotobs.polynomials._format import format_terms

__all__ = ["latex_polynomial", "mpoly_latex", "latex_result", "latex_comparison", "latex_table", "terminal_table",
           "grid_table_rows", "GRID_HEADERS", "plain_to_latex", "latex_longtable"]

_LATEX_SPECIAL = {"&": r"\&", "%": r"\%", "$": r"\$", "#": r"\#", "_": r"\_", "{": r"\{", "}": r"\}",
                  "~": r"\textasciitilde{}", "^": r"\textasciicircum{}", "\\": r"\textbackslash{}"}


def _esc(text: str) -> str:
    return "".join(_LATEX_SPECIAL.get(ch, ch) for ch in str(text))


def _exp_tex(e) -> str:
    if e.denominator == 1:
        return str(e.numerator)
    sign = "-" if e < 0 else ""
    return f"{sign}\\frac{{{abs(e.numerator)}}}{{{e.denominator}}}"


def mpoly_latex(p) -> str:
    """LaTeX of an :class:`~knotobs.tables.sparse.MPoly` (terms in the order of its plain text).

    >>> from knotobs.tables.polyparse import parse_polynomial
    >>> mpoly_latex(parse_polynomial("2*t^(1/2) - t^-3 + 1"))
    '-t^{-3} + 1 + 2 t^{\\\\frac{1}{2}}'
    """
    if p.is_zero():
        return "0"
    keys = list(p.terms)
    if len(p.variables) > 1:
        keys.sort(key=lambda k: tuple(-x for x in k[:-1]) + k[-1:])
    else:
        keys.sort()

    def tex_coeff(a) -> str:
        return str(a) if a.denominator == 1 else f"\\frac{{{a.numerator}}}{{{a.denominator}}}"

    def mono(k) -> str:
        return " ".join(v if e == 1 else f"{v}^{{{_exp_tex(e)}}}" for v, e in zip(p.variables, k) if e != 0)

    return format_terms((((mono(k),), p.terms[k]) for k in keys), joiner=" ", coeff=tex_coeff)


def latex_polynomial(text: str, variables: Sequence[str] | None = None) -> str:
    """LaTeX of a polynomial given in plain algebraic text (``^`` or ``**`` for powers).

    The text is read by knotobs' own safe parser, never evaluated.

    Examples
    --------
    >>> latex_polynomial("t + t^3 - t^4")
    't + t^{3} - t^{4}'
    >>> latex_polynomial("q**(1/2) - q**-1")
    '-q^{-1} + q^{\\\\frac{1}{2}}'

    References
    ----------
    L. Lamport, *LaTeX: A Document Preparation System*, 2nd ed., Addison-Wesley (1994) (math mode).
    """
    from knotobs.tables.polyparse import parse_polynomial

    return mpoly_latex(parse_polynomial(text.replace("**", "^"), variables))


def latex_result(result) -> str:
    """Display-math LaTeX of a :class:`~knotobs.evaluation.result.PolynomialResult` with its profile.

    >>> from knotobs import jones
    >>> print(latex_result(jones("T(2,3)")).splitlines()[0])
    % jones of T(2,3), SU(2); variables t (t = q^-1); normalized (unknot = 1); framing [0]
    """
    import sympy

    prof = result.profile
    head = (f"% {result.quantity} of {result.knot}, {result.group}; variables {', '.join(prof.variables)}"
            f" ({prof.variable_map}); {prof.normalisation}; framing {list(prof.framing)}")
    return head + "\n\\[\n  " + sympy.latex(result.to_sympy()) + "\n\\]"


def latex_comparison(comparison) -> str:
    """A short LaTeX paragraph stating the outcome of a comparison.

    >>> from knotobs.tables.compare import compare
    >>> "equal" in latex_comparison(compare("T(2,3)", "t + t^3 - t^4"))
    True
    """
    tgt = latex_polynomial(comparison.target)
    if comparison.equal:
        return (f"The {_esc(comparison.invariant)} invariant of ${_esc(comparison.knot)}$ is equal to\n"
                f"\\[ {tgt} \\]\nunder the convention map: {_esc(comparison.map.describe())}.")
    return (f"The {_esc(comparison.invariant)} invariant of ${_esc(comparison.knot)}$ is not equal to\n"
            f"\\[ {tgt} \\]\nunder any convention map tried; closest: "
            f"{_esc(comparison.closest.describe()) if comparison.closest else 'none'}.")


def latex_table(headers: Sequence[str], rows: Iterable[Sequence[str]], caption: str | None = None,
                math_columns: Sequence[int] = ()) -> str:
    """A ``tabular`` (in a ``table`` float when ``caption`` is given).

    Cells in ``math_columns`` are plain-text polynomials and are typeset as math.

    >>> print(latex_table(["knot", "V"], [["T(2,3)", "t + t^3 - t^4"]], math_columns=[1]))
    \\begin{tabular}{ll}
    \\hline
    knot & V \\\\
    \\hline
    T(2,3) & $t + t^{3} - t^{4}$ \\\\
    \\hline
    \\end{tabular}
    """
    headers = list(headers)
    lines = [f"\\begin{{tabular}}{{{'l' * len(headers)}}}", "\\hline", " & ".join(_esc(h) for h in headers) + " \\\\", "\\hline"]
    for r in rows:
        cells = []
        for i, cell in enumerate(r):
            if i in math_columns and cell not in (None, ""):
                try:
                    cells.append(f"${latex_polynomial(str(cell))}$")
                    continue
                except Exception:
                    pass
            cells.append(_esc("" if cell is None else cell))
        lines.append(" & ".join(cells) + " \\\\")
    lines += ["\\hline", "\\end{tabular}"]
    out = "\n".join(lines)
    if caption:
        out = "\\begin{table}[ht]\n\\centering\n" + out + f"\n\\caption{{{_esc(caption)}}}\n\\end{{table}}"
    return out


#: Columns of a table of grid rows.
GRID_HEADERS = ("knot", "group", "color", "level", "framing", "exact", "numeric")


def grid_table_rows(rows: Iterable[dict]) -> list[list[str]]:
    """Cells (:data:`GRID_HEADERS`) for stored grid rows."""
    out = []
    for r in rows:
        doc = json.loads(r["document"])
        out.append([r["knot"], doc["group"], json.dumps(doc["representation"][0]),
                    "generic q" if r["level"] is None else str(r["level"]), json.dumps(doc["framing"]),
                    doc["exact"].replace("**", "^"), r["numeric"] or ""])
    return out


def terminal_table(headers: Sequence[str], rows: Sequence[Sequence[str]], title: str | None = None,
                   max_width: int = 60) -> str:
    """A table for the terminal (``rich`` if available, aligned text otherwise).

    >>> print(terminal_table(["a", "b"], [["1", "22"]], title=None).splitlines()[0].strip()[:1] in "┏a+")
    True
    """
    def clip(s: str) -> str:
        s = "" if s is None else str(s)
        return s if len(s) <= max_width else s[: max_width - 3] + "..."

    try:
        from rich.console import Console
        from rich.table import Table
    except ImportError:  # pragma: no cover - rich comes with typer
        cols = [list(map(clip, c)) for c in zip(headers, *rows)] if rows else [[h] for h in headers]
        widths = [max(len(x) for x in c) for c in cols]
        lines = ["  ".join(h.ljust(w) for h, w in zip(headers, widths))]
        lines.append("  ".join("-" * w for w in widths))
        for r in rows:
            lines.append("  ".join(clip(x).ljust(w) for x, w in zip(r, widths)))
        return ((title + "\n") if title else "") + "\n".join(lines)
    table = Table(title=title)
    for h in headers:
        table.add_column(h)
    for r in rows:
        table.add_row(*[clip(x) for x in r])
    buf = io.StringIO()
    Console(file=buf, width=200, force_terminal=False, color_system=None).print(table)
    return buf.getvalue().rstrip("\n")


_TERM_SPLIT = None


def plain_to_latex(text: str) -> str:
    """LaTeX of a polynomial in the plain notation knotobs prints, term by term in one pass.

    The terms keep their printed order; no algebra is done (compare :func:`latex_polynomial`,
    which parses), so the cost is linear in the length.  Text that is not in the printed
    notation is escaped and set as text.

    >>> plain_to_latex("-q**-4 + q**-3 + q**(1/2)")
    '-q^{-4} + q^{-3} + q^{\\\\frac{1}{2}}'
    >>> plain_to_latex("2*a^-2 + a^-2*z^2 - (1/2)*a^-4")
    '2 a^{-2} + a^{-2} z^{2} - \\\\frac{1}{2} a^{-4}'
    """
    import re

    global _TERM_SPLIT
    if _TERM_SPLIT is None:
        _TERM_SPLIT = (re.compile(r" ([+-]) "), re.compile(r"^([A-Za-z]\w*)(?:\^(?:\((-?\d+)/(\d+)\)|(-?\d+)))?$"),
                       re.compile(r"^\(?(\d+)(?:/(\d+))?\)?$"))
    split, factor_re, coeff_re = _TERM_SPLIT
    s = text.strip().replace("**", "^")
    if not s:
        return ""
    sign0 = ""
    if s.startswith("-"):
        sign0, s = "-", s[1:]
    pieces = split.split(s)
    out = [sign0]
    for k, piece in enumerate(pieces):
        if k % 2 == 1:
            out.append(f" {piece} ")
            continue
        factors = []
        for f in piece.split("*"):
            m = factor_re.match(f)
            if m:
                v, num, den, e = m.groups()
                if num is not None:
                    n = int(num)
                    factors.append(f"{v}^{{{'-' if n < 0 else ''}\\frac{{{abs(n)}}}{{{den}}}}}")
                elif e is not None:
                    factors.append(f"{v}^{{{e}}}")
                else:
                    factors.append(v)
                continue
            c = coeff_re.match(f)
            if c:
                factors.append(c.group(1) if c.group(2) is None else f"\\frac{{{c.group(1)}}}{{{c.group(2)}}}")
                continue
            return "\\text{" + _esc(text) + "}"
        out.append(" ".join(factors))
    return "".join(out)


def latex_longtable(headers: Sequence[str], rows: Iterable[Sequence[str]], caption: str | None = None,
                    math_columns: Sequence[int] = (), wide_column: int | None = None) -> str:
    """A multi-page ``longtable`` (package ``longtable``); cells in ``math_columns`` are polynomials.

    The ``wide_column`` is a paragraph column, so long polynomials break across lines (TeX
    breaks inline math after ``+`` and ``-``); the header repeats on every page.  Linear in
    the size of the table.

    >>> tex = latex_longtable(["knot", "V"], [["T(2,3)", "t + t^3 - t^4"]], math_columns=[1], wide_column=1)
    >>> print(tex.splitlines()[1])
    \\begin{longtable}{lp{0.62\\textwidth}}
    >>> "$t + t^{3} - t^{4}$ \\\\\\\\" in tex
    True
    """
    headers = list(headers)
    spec = "".join("p{0.62\\textwidth}" if i == wide_column else "l" for i in range(len(headers)))
    head = " & ".join(_esc(h) for h in headers) + " \\\\"
    lines = ["% needs \\usepackage{longtable}", f"\\begin{{longtable}}{{{spec}}}"]
    if caption:
        lines.append(f"\\caption{{{_esc(caption)}}}\\\\")
    lines += ["\\hline", head, "\\hline", "\\endfirsthead",
              f"\\multicolumn{{{len(headers)}}}{{l}}{{\\emph{{(continued)}}}}\\\\", "\\hline", head, "\\hline", "\\endhead",
              "\\hline", "\\endfoot"]
    math = set(math_columns)
    for r in rows:
        cells = []
        for i, cell in enumerate(r):
            if i in math and cell not in (None, ""):
                cells.append(f"${plain_to_latex(str(cell))}$")
            else:
                cells.append(_esc("" if cell is None else cell))
        lines.append(" & ".join(cells) + " \\\\")
    lines.append("\\end{longtable}")
    return "\n".join(lines)
