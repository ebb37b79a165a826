"""The Kauffman polynomial ``F(a, z)`` of torus knots and links.

Computed from the generic-N SO(N) invariant of the vector representation
(:func:`knotobs.evaluation.dubrovnik.dubrovnik_torus`, the Dubrovnik polynomial ``D`` in
``a = q^((N-1)/2)``, ``z = q^(1/2) - q^(-1/2)``, zero framing, unknot = 1) by the classical change of
variables (W. B. R. Lickorish, *An Introduction to Knot Theory*, Springer GTM 175 (1997), ch. 15–16;
L. Kauffman, Trans. Amer. Math. Soc. 318 (1990) 417–471):

    F(a, z) = (-1)^(c-1) [a^(-2 lk) D](a -> -i a, z -> i z),

with ``c`` the number of components and ``lk`` the total linking number (the writhe normalisation
``F = a^(-writhe) Lambda`` counts the crossings between components, the zero framing does not).  The
coefficients stay integers (``j + k`` has a fixed parity for ``a^j z^k``).  ``F`` is the polynomial
as tabulated in the open dataset ``database-knotinfo`` (CONVENTIONS §8), which the tests check for
every torus knot and link there, as are the relation to the Jones polynomial
``V(t) = F(a = -t^(-3/4), z = t^(1/4) + t^(-1/4))`` (CONVENTIONS §8; Kauffman (1990)) and the
specialisations to SO(N), N = 4..9 (the Cartan engine's two routes).
"""

from __future__ import annotations

from knotobs.errors import InvalidRepresentationError
from knotobs.evaluation.dubrovnik import dubrovnik_torus
from knotobs.evaluation.profiles import NORMALISED, Profile
from knotobs.evaluation.result import PolynomialResult
from knotobs.fibrations.torus import parse_knot
from knotobs.guard import require, seconds_for
from knotobs.polynomials.bivariate import Laurent2

__all__ = ["kauffman", "dubrovnik", "dubrovnik_to_kauffman"]

_MAP = "F(a, z) = (-1)^(c-1) [a^(-2 lk) D](a -> -i a, z -> i z); D = SO(N) invariant at a = q^((N-1)/2), z = q^(1/2) - q^(-1/2)"


def dubrovnik_to_kauffman(D: Laurent2, components: int, linking: int) -> dict[tuple[int, int], int]:
    """``{(j, k): c}`` of ``F = sum c a^j z^k`` from the Dubrovnik form ``D`` (see the module text).

    >>> from knotobs.fibrations.torus import TorusLink
    >>> F = dubrovnik_to_kauffman(dubrovnik_torus(TorusLink(2, 3)), 1, 0)
    >>> sorted(F.items())
    [((-5, 1), 1), ((-4, 0), -1), ((-4, 2), 1), ((-3, 1), 1), ((-2, 0), -2), ((-2, 2), 1)]
    """
    out = {}
    sign0 = -1 if (components - 1) % 2 else 1
    for (j, k), c in D.to_az().items():
        j2 = j - 2 * linking
        # (-i)^j2 i^k = (-1)^j2 i^(j2 + k); j2 + k is even
        e = j2 + k
        if e % 2:  # pragma: no cover - would contradict the parity of the Kauffman polynomial
            raise ArithmeticError(f"odd total degree a^{j2} z^{k} in the Dubrovnik polynomial")
        sign = (-1 if j2 % 2 else 1) * (-1 if (e // 2) % 2 else 1)
        out[(j2, k)] = sign0 * sign * c
    return {key: v for key, v in out.items() if v}


def _estimate(k) -> None:
    m = min(k.P, k.Q) * k.components
    require(f"Kauffman polynomial of {k} (universal Adams operation on {m} boxes)",
            seconds=seconds_for(40 * m ** 4 * max(k.P, k.Q), "python"), accepted="use a smaller torus knot")


def dubrovnik(knot, mirror: bool = False) -> PolynomialResult:
    """The SO(N) invariant of the vector representation for generic N (Dubrovnik polynomial).

    ``a = q^((N-1)/2)``, ``z = q^(1/2) - q^(-1/2)``, zero framing, unknot = 1.

    >>> dubrovnik("T(2,3)").exact_string()
    '2*a^-2 + a^-2*z^2 + a^-3*z - a^-4 - a^-4*z^2 - a^-5*z'
    """
    k0 = parse_knot(knot)
    k = k0.mirror() if mirror else k0
    _estimate(k)
    D = dubrovnik_torus(k)
    prof = Profile(
        variables=("a", "z"), variable_map="a = q^((N-1)/2), z = q^(1/2) - q^(-1/2) (SO(N), vector representation)",
        framing=(0,) * k.components, framing_note="zero (Seifert) framing on every component",
        normalisation=NORMALISED + " (unknot = (a - a^-1)/z + 1 before normalising)",
        chirality="mirror image of the input" if mirror else "as given",
        skein="Lambda(L+) - Lambda(L-) = z (Lambda(L0) - Lambda(Linf)) for the framed invariant, a positive kink"
              " multiplies by a; D = Lambda with every component zero-framed",
    )
    return PolynomialResult("dubrovnik", str(k0), "SO(N), generic N", ((1,),) * k.components, D, prof,
                            "rosso-jones (generic N, universal orthogonal characters)",
                            {"knot": str(k0), "mirror": mirror})


def _from_az(az: dict[tuple[int, int], int]) -> Laurent2:
    """``sum c a^j z^k`` as a :class:`Laurent2` in ``(a, s)``, ``z = s - 1/s`` (a ``z^kmin`` prefactor kept)."""
    from knotobs.polynomials.bivariate import z_power

    kmin = min((k for _, k in az), default=0)
    lo = min(kmin, 0)
    coeffs: dict = {}
    for (j, k), c in az.items():
        t = z_power(k - lo) * c
        coeffs[j] = coeffs[j] + t if j in coeffs else t
    return Laurent2(coeffs, zpow=lo)


def kauffman(knot, mirror: bool = False, rep=(1,)) -> PolynomialResult:
    """Kauffman polynomial ``F(a, z)`` of a torus knot or link (as tabulated in database-knotinfo).

    Parameters
    ----------
    knot : str or TorusLink
    mirror : bool
        The mirror image.
    rep : only the vector representation ``[1]`` (the Kauffman polynomial is its invariant).

    Examples
    --------
    >>> kauffman("T(2,3)").exact_string()
    '-2*a^-2 + a^-2*z^2 + a^-3*z - a^-4 + a^-4*z^2 + a^-5*z'

    References
    ----------
    L. Kauffman, Trans. Amer. Math. Soc. 318 (1990) 417–471; Lickorish (1997) ch. 15–16;
    Rosso–Jones (1993); CONVENTIONS §8; docs/groups.md (§14).
    """
    from knotobs.representations.partitions import as_partition

    if as_partition(rep if not isinstance(rep, str) else rep) != (1,):
        raise InvalidRepresentationError(
            f"the Kauffman polynomial is the invariant of the vector representation [1]; got {rep!r}"
            " (coloured SO(N) values: knotobs loop --group 'SO(N)' --rep ...)")
    d = dubrovnik(knot, mirror)
    k = parse_knot(knot)
    k = k.mirror() if mirror else k
    c = k.components
    lk = k.linking_number * c * (c - 1) // 2
    az = dubrovnik_to_kauffman(d.value, c, lk)
    val = _from_az(az)
    assert val.to_az() == az
    prof = Profile(
        variables=("a", "z"), variable_map=_MAP,
        framing=(0,) * c,
        framing_note="framing-independent: F = a^(-writhe) Lambda (writhe including the crossings between components)",
        normalisation="F(unknot) = 1",
        chirality="mirror image of the input" if mirror else "as given",
        skein="Lambda(L+) + Lambda(L-) = z (Lambda(L0) + Lambda(Linf)), positive kink = a Lambda; V(t) = F(-t^(-3/4), t^(1/4) + t^(-1/4))",
    )
    return PolynomialResult("kauffman", d.knot, "SO(N), generic N", d.colours, val, prof, d.route,
                            {"knot": d.knot, "mirror": mirror})
