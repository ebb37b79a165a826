"""Notebook forms of results: linear-time plain text and LaTeX, sympy expressions, number conversion.

* :func:`laurent_text`, :func:`laurent_latex` — a Laurent polynomial in one variable, terms in
  ascending powers (the order of the text output), built in one pass;
* :func:`az_latex` — the ``(a, z)`` / ``(a, q)`` forms of HOMFLY-PT, highest ``a`` first;
* :func:`cyclotomic_latex`, :func:`cyclotomic_sympy` — exact finite-level values
  ``sqrt(r) * sum c_j zeta_n^j`` in ``zeta_n = exp(2 pi i/n)``;
* :func:`to_mpmath` — a Python, mpmath or sympy number as an mpmath number.

Examples
--------
>>> from knotobs.polynomials.laurent import Laurent
>>> p = Laurent.from_terms({-4: -1, -3: 1, -1: 1})
>>> laurent_text(p, "q"), laurent_latex(p, "q")
('-q^-4 + q^-3 + q^-1', '-q^{-4} + q^{-3} + q^{-1}')

References
----------
L. Lamport, *LaTeX: A Document Preparation System*, 2nd ed., Addison-Wesley (1994) (math mode).
"""

from __future__ import annotations

from fractions import Fraction
from math import gcd
from typing import Iterable

__all__ = ["laurent_items", "laurent_text", "laurent_latex", "az_latex", "cyclotomic_latex",
           "cyclotomic_sympy", "to_mpmath", "short"]


def laurent_items(p) -> Iterable[tuple[int, int, int]]:
    """``(numerator, denominator, coefficient)`` of each nonzero term, ascending exponents."""
    c = p.canonical()
    raw = getattr(c, "_p", None)
    if raw is None or not hasattr(c, "_s") or not hasattr(c, "_d"):   # another representation
        for e, a in c.terms().items():
            yield e.numerator, e.denominator, int(a)
        return
    s, d = int(c._s), int(c._d)
    step = 1
    if hasattr(raw, "deflation") and raw.degree() > 64:
        raw, step = raw.deflation()       # p(y) = r(y^step): skip the zeros between exponents
        step = int(step)
    for i, a in enumerate(raw.coeffs()):
        if a:
            n = s + i * step
            g = gcd(n, d)
            yield n // g, d // g, int(a)


def _join(parts: list[tuple[bool, str]]) -> str:
    if not parts:
        return "0"
    out = [("-" if parts[0][0] else "") + parts[0][1]]
    out.extend((" - " if neg else " + ") + body for neg, body in parts[1:])
    return "".join(out)


def laurent_text(p, var: str) -> str:
    """Plain text, ascending powers, equal to ``p.to_string(var)`` (one pass, no Fractions)."""
    parts = []
    for n, d, a in laurent_items(p):
        if n == 0:
            mono = ""
        elif d == 1:
            mono = var if n == 1 else f"{var}^{n}"
        else:
            mono = f"{var}^({n}/{d})"
        b = abs(a)
        body = mono if (mono and b == 1) else (f"{b}*{mono}" if mono else str(b))
        parts.append((a < 0, body))
    return _join(parts)


def _tex_exp(n: int, d: int) -> str:
    if d == 1:
        return str(n)
    return f"{'-' if n < 0 else ''}\\frac{{{abs(n)}}}{{{d}}}"


def _tex_coeff(a) -> str:
    a = Fraction(a)
    return str(a.numerator) if a.denominator == 1 else f"\\frac{{{a.numerator}}}{{{a.denominator}}}"


def laurent_latex(p, var: str, break_every: int = 0) -> str:
    """LaTeX, ascending powers (the text order); optional ``\\\\`` line break every ``break_every`` terms."""
    parts = []
    for n, d, a in laurent_items(p):
        mono = "" if n == 0 else (var if (n == 1 and d == 1) else f"{var}^{{{_tex_exp(n, d)}}}")
        b = abs(a)
        body = mono if (mono and b == 1) else (f"{b} {mono}" if mono else str(b))
        parts.append((a < 0, body))
    return _join_broken(parts, break_every)


def _join_broken(parts, break_every: int) -> str:
    if not break_every or len(parts) <= break_every:
        return _join(parts)
    lines = []
    for i in range(0, len(parts), break_every):
        chunk = parts[i:i + break_every]
        s = _join(chunk)
        if i and not chunk[0][0]:
            s = "+ " + s
        elif i:
            s = "- " + s[1:]
        lines.append(s)
    return " \\\\\n& ".join(lines)


def az_latex(terms: dict, avar: str, zvar: str) -> str:
    """LaTeX of ``{(i, j): c}`` (``c a^i z^j``), highest ``a`` power first as in the text output."""
    parts = []
    for i, j in sorted(terms, key=lambda ij: (-ij[0], ij[1])):
        c = terms[(i, j)]
        fs = []
        for v, e in ((avar, i), (zvar, j)):
            e = Fraction(e)
            if e == 0:
                continue
            fs.append(v if e == 1 else f"{v}^{{{_tex_exp(e.numerator, e.denominator)}}}")
        mono = " ".join(fs)
        b = abs(c)
        body = mono if (mono and b == 1) else (f"{_tex_coeff(b)} {mono}" if mono else _tex_coeff(b))
        parts.append((c < 0, body))
    return _join(parts)


def _cyc_parts(value):
    """``(radicand, conductor, [(j, c_j)])`` of a Cyclotomic or CyclotomicSurd, the terms of its
    printed form (:meth:`~knotobs.polynomials.cyclotomic.Cyclotomic.sparse_exponents`)."""
    coeff = getattr(value, "coefficient", value)
    radicand = Fraction(getattr(value, "radicand", 1))
    n = coeff.field.n
    items = [(j, Fraction(int(c.p), int(c.q))) for j, c in enumerate(coeff.sparse_exponents()) if c != 0]
    return radicand, n, items


def cyclotomic_latex(value) -> str:
    """LaTeX of ``sqrt(r) (sum c_j zeta_n^j)``, ascending ``j`` as in the text output.

    >>> from knotobs.polynomials.cyclotomic import CyclotomicField, CyclotomicSurd
    >>> F = CyclotomicField(5)
    >>> cyclotomic_latex(CyclotomicSurd(F.zeta(1) * 2 - 1, 3))
    '\\\\sqrt{3} \\\\left(-1 + 2 \\\\zeta_{5}\\\\right)'
    """
    r, n, items = _cyc_parts(value)
    parts = []
    for j, c in items:
        mono = "" if j == 0 else (f"\\zeta_{{{n}}}" if j == 1 else f"\\zeta_{{{n}}}^{{{j}}}")
        b = abs(c)
        body = mono if (mono and b == 1) else (f"{_tex_coeff(b)} {mono}" if mono else _tex_coeff(b))
        parts.append((c < 0, body))
    body = _join(parts)
    if r == 1:
        return body
    rt = f"\\sqrt{{{r.numerator}}}" if r.denominator == 1 else f"\\sqrt{{{_tex_coeff(r)}}}"
    return f"{rt} \\left({body}\\right)" if len(parts) > 1 else f"{rt} \\, {body}" if body not in ("1",) else rt


def cyclotomic_sympy(value):
    """An exact sympy expression in ``exp(2 pi i/n)`` (no free symbols).

    >>> from knotobs.polynomials.cyclotomic import CyclotomicField
    >>> import sympy
    >>> e = cyclotomic_sympy(CyclotomicField(4).zeta(1))
    >>> e, e.free_symbols
    (I, set())
    """
    import sympy

    r, n, items = _cyc_parts(value)
    zeta = sympy.exp(2 * sympy.pi * sympy.I / n)
    expr = sympy.Add(*[sympy.Rational(c.numerator, c.denominator) * zeta ** j for j, c in items])
    if r != 1:
        expr = sympy.sqrt(sympy.Rational(r.numerator, r.denominator)) * expr
    return expr


def to_mpmath(x, dps: int = 30):
    """A Python, mpmath or sympy number (exact or not) as an mpmath number at ``dps`` digits.

    >>> import sympy, mpmath
    >>> to_mpmath(sympy.Rational(1, 2)), to_mpmath(2), to_mpmath(mpmath.mpf(3))
    (mpf('0.5'), mpf('2.0'), mpf('3.0'))
    """
    from knotobs.numerics import working_precision

    with working_precision(dps + 10):
        return _to_mpmath(x, dps)


def _to_mpmath(x, dps: int):
    import mpmath

    from knotobs.errors import ParseError

    if isinstance(x, bool):
        raise ParseError(f"cannot evaluate at {x!r}: give a number")
    if isinstance(x, (int, float, complex, Fraction, mpmath.mpf, mpmath.mpc)):
        if isinstance(x, Fraction):
            return mpmath.mpf(x.numerator) / x.denominator
        return mpmath.mpmathify(x)
    try:
        import sympy
    except ImportError:  # pragma: no cover
        sympy = None
    if sympy is not None and isinstance(x, sympy.Basic):
        if x.free_symbols:
            raise ParseError(f"cannot evaluate at {x}: it has free symbols {sorted(map(str, x.free_symbols))}")
        v = sympy.N(x, dps + 10)
        re, im = v.as_real_imag()
        re, im = mpmath.mpf(str(sympy.N(re, dps + 10))), mpmath.mpf(str(sympy.N(im, dps + 10)))
        return re if im == 0 else mpmath.mpc(re, im)
    if isinstance(x, str):
        try:
            return mpmath.mpmathify(x.replace("i", "j"))
        except (ValueError, TypeError):
            raise ParseError(f"cannot read the number {x!r}") from None
    raise ParseError(f"cannot evaluate at {x!r} ({type(x).__name__}): give a Python, mpmath or sympy number")


def short(text: str, width: int = 60) -> str:
    """``text`` cut to ``width`` characters with an ellipsis."""
    return text if len(text) <= width else text[: width - 3] + "..."
