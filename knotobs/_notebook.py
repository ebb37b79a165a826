"""Notebook support shared by result types: a short repr, ``_repr_latex_``, ``to_sympy``, ``evaluate``.

A result class derives from :class:`NotebookMixin` (and its dataclass is declared with
``repr=False``) and keeps its own ``to_json``.  The mixin reads the conventional fields:

* ``numeric`` (an mpmath number) and ``digits`` — a numeric value;
* ``connections`` — a table of flat connections (``kind``, ``cs``, ``multiplicity``, ``K_power``);
* ``target``/``computed``/``equal`` — a comparison of polynomials;
* ``describe()`` or ``text()`` — the text form, used for the LaTeX fallback.

Examples
--------
>>> from dataclasses import dataclass
>>> import mpmath
>>> @dataclass(repr=False)
... class V(NotebookMixin):
...     numeric: object
...     digits: int = 10
...     def to_json(self):
...         return {"quantity": "demo"}
>>> v = V(mpmath.mpc(1, 2))
>>> v
<V demo: (1.0 + 2.0j)>
>>> v.to_sympy()
1.0 + 2.0*I
>>> v._repr_latex_()
'$1.0 + 2.0 i$'
"""

from __future__ import annotations

__all__ = ["NotebookMixin"]


def _esc(text: str) -> str:
    table = {"&": r"\&", "%": r"\%", "$": r"\$", "#": r"\#", "_": r"\_", "{": r"\{", "}": r"\}",
             "~": r"\textasciitilde{}", "^": r"\textasciicircum{}", "\\": r"\textbackslash{}"}
    return "".join(table.get(ch, ch) for ch in str(text))


class NotebookMixin:
    """Short repr, LaTeX, sympy and numeric forms from a result's conventional fields."""

    # ------------------------------------------------------------ repr
    def _label(self) -> str:
        try:
            js = self.to_json()
        except Exception:   # a half-built object: fall back to the class name only
            js = {}
        for key in ("quantity", "kind"):
            if isinstance(js.get(key), str):
                what = js[key]
                break
        else:
            what = ""
        for key in ("knot", "space"):
            if js.get(key):
                what += f" of {js[key]}"
                break
        return what.strip()

    def __repr__(self) -> str:
        import mpmath

        name = type(self).__name__
        label = self._label()
        head = f"<{name} {label}" if label else f"<{name}"
        if hasattr(self, "numeric"):
            return f"{head}: {mpmath.nstr(self.numeric, min(getattr(self, 'digits', 15), 12))}>"
        if hasattr(self, "connections"):
            return f"{head}: {len(self.connections)} classes>"
        if hasattr(self, "equal"):
            return f"{head}: {'equal' if self.equal else 'not equal'}>"
        return head + ">"

    # ------------------------------------------------------------ sympy / numbers
    def to_sympy(self):
        """A sympy form: the number (numeric values), the list of CS invariants (flat tables),
        or the target polynomial (comparisons)."""
        import sympy

        if hasattr(self, "numeric"):
            d = getattr(self, "digits", 15)
            re, im = sympy.Float(str(self.numeric.real), d), sympy.Float(str(getattr(self.numeric, "imag", 0)), d)
            return re if im == 0 else re + sympy.I * im
        if hasattr(self, "connections"):
            return [sympy.Rational(c.cs.numerator, c.cs.denominator) for c in self.connections]
        if hasattr(self, "target"):
            return sympy.sympify(str(self.target).replace("^", "**"))
        raise TypeError(f"{type(self).__name__} has no sympy form")

    def evaluate(self, dps=None):
        """The numeric value (at its stated digits)."""
        from knotobs.errors import PrecisionError

        if not hasattr(self, "numeric"):
            raise TypeError(f"{type(self).__name__} has no numeric value")
        if dps is not None and dps > getattr(self, "digits", dps):
            raise PrecisionError(f"only {self.digits} digits were computed: recompute with digits={dps}")
        return self.numeric

    # ------------------------------------------------------------ LaTeX
    def _repr_latex_(self) -> str:
        import mpmath

        if hasattr(self, "numeric"):
            z = self.numeric
            d = min(getattr(self, "digits", 15), 15)
            re, im = mpmath.nstr(z.real, d), mpmath.nstr(abs(getattr(z, "imag", 0)), d)
            if getattr(z, "imag", 0) == 0:
                return f"${re}$"
            return f"${re} {'-' if z.imag < 0 else '+'} {im} i$"
        if hasattr(self, "connections"):
            rows = [r"\begin{array}{lrrr}", r"\text{kind} & \text{CS mod 1} & \text{mult} & K^{p} \\ \hline"]
            for c in self.connections:
                cs = c.cs
                cs_tex = str(cs.numerator) if cs.denominator == 1 else rf"\frac{{{cs.numerator}}}{{{cs.denominator}}}"
                mult = getattr(c, "multiplicity", 1)
                rows.append(rf"\text{{{c.kind}}} & {cs_tex} & {mult} & {c.K_power} \\")
            rows.append(r"\end{array}")
            return "$" + "\n".join(rows) + "$"
        if hasattr(self, "equal"):
            from knotobs.output.latex import latex_comparison

            return latex_comparison(self)
        text = self.describe() if hasattr(self, "describe") else self.text() if hasattr(self, "text") else repr(self)
        return r"\begin{verbatim}" + "\n" + text + "\n" + r"\end{verbatim}"
