"""The reduced superpolynomial ``P(a, q, t)`` of torus knots (refined Chern–Simons).

The refined (t-deformed) Chern–Simons invariant of a torus knot replaces the Schur
functions of the Rosso–Jones formula by Macdonald polynomials (M. Aganagic & S. Shakirov,
arXiv:1105.5117 and arXiv:1202.2489; I. Cherednik, arXiv:1111.6195).  For the knots
``T(n, nk + 1)`` (and their mirrors) knotobs evaluates it through the elliptic-Hall /
Hilbert-scheme description of E. Gorsky & A. Negut (J. Math. Pures Appl. 104 (2015) 403–435,
arXiv:1304.3328): the refined invariant is the generating function of the hook pairings
``<nabla^k e_n, s_(n-d, 1^d)>`` (:mod:`knotobs.refined.nabla`), the ``a``-grading being ``d``.

Variables and normalisation (CONVENTIONS §17, docs/refined.md): the grading of
N. Dunfield, S. Gukov & J. Rasmussen (Experiment. Math. 15 (2006) 129–159), in which the
coefficients are non-negative integers and

* ``P(a, q, t = -1)`` is the normalised HOMFLY-PT polynomial with
  ``a_DGR = a^-1`` and ``q_DGR = q^(1/2)`` of knotobs's convention (CONVENTIONS §3), i.e.
  ``a_DGR^-1 P(L+) - a_DGR P(L-) = (q_DGR - q_DGR^-1) P(L0)``;
* ``P(a = q^2, q, t)`` is the Poincaré polynomial of reduced Khovanov homology when the
  spectral sequence collapses (``T(2, 2k+1)``), and otherwise exceeds it by terms divisible
  by ``1 + t`` with non-negative coefficients.

The map from the Macdonald variables is ``q_M = q^-2 t^-2``, ``t_M = q^2``,
``z = a^-2 t^-1`` (``F_{n,k}`` is symmetric in ``q_M, t_M``), followed by the monomial
that puts the term of lowest ``a``- and then lowest ``q``-degree at ``a^(2g) q^(-2g) t^0``,
``2g = (n - 1) n k`` the Seifert genus (DGR's normalisation of positive torus knots).
The mirror image has ``P(a^-1, q^-1, t^-1)`` (duality of the homology).

>>> superpolynomial("T(2,3)").exact_string()
'a^2*q^-2 + a^2*q^2*t^2 + a^4*t^3'
"""

from __future__ import annotations

from knotobs.errors import InvalidKnotError, InvalidRepresentationError
from knotobs.evaluation.profiles import Profile
from knotobs.fibrations.torus import parse_knot
from knotobs.polynomials.multivariate import LaurentM
from knotobs.refined.nabla import hook_pairings
from knotobs.refined.result import SuperpolynomialResult
from knotobs.representations.partitions import as_partition

__all__ = ["superpolynomial", "torus_family"]

_VARS = ("a", "q", "t")

VARIABLE_MAP = (
    "Dunfield-Gukov-Rasmussen grading: P(a, q, t=-1) = HOMFLY-PT with a_DGR = a^-1, "
    "q_DGR = q^(1/2) of the HOMFLY-PT profile; P(a=q^2, q, t) >= reduced Khovanov"
)


def torus_family(P: int, Q: int) -> tuple[int, int]:
    """``(n, k)`` with ``{P, Q} = {n, n k + 1}``, or an error naming the supported knots.

    >>> torus_family(3, 4), torus_family(7, 2)
    ((3, 1), (2, 3))
    """
    for n, m in ((P, Q), (Q, P)):
        if n >= 2 and m % n == 1:
            return n, (m - 1) // n
    raise InvalidKnotError(
        f"the superpolynomial is implemented for torus knots T(n, nk+1) (e.g. T(2,2k+1), T(n,n+1), "
        f"T(3,7)); T({P},{Q}) is not of that form"
    )


def _dgr(n: int, k: int) -> LaurentM:
    F = hook_pairings(n, k)
    raw: dict[tuple, int] = {}
    for (i, j, d), c in F.items():
        # q_M -> q^-2 t^-2, t_M -> q^2, z -> a^-2 t^-1
        key = (-2 * d, -2 * i + 2 * j, -2 * i - d)
        raw[key] = raw.get(key, 0) + c
    a_low = min(e[0] for e in raw)
    q_low = min(e[1] for e in raw if e[0] == a_low)
    t_low = min(e[2] for e in raw if e[0] == a_low and e[1] == q_low)
    two_g = (n - 1) * n * k
    return LaurentM(_VARS, raw).shift((two_g - a_low, -two_g - q_low, -t_low))


def superpolynomial(knot, rep=(1,), *, mirror: bool = False) -> SuperpolynomialResult:
    """The reduced superpolynomial ``P(a, q, t)`` of a torus knot ``T(n, nk+1)`` or its mirror.

    Parameters
    ----------
    knot : str or TorusLink
        ``"T(2,5)"``, ``"T(3,4)"``, ``"T(2,-3)"`` (mirror), ...
    rep : partition
        The colour; only the fundamental ``[1]`` is implemented.
    mirror : bool
        Take the mirror image of the knot.

    Returns
    -------
    SuperpolynomialResult
        Exact polynomial in ``(a, q, t)`` with non-negative coefficients and its profile.

    Examples
    --------
    >>> r = superpolynomial("T(2,5)")
    >>> r.exact_string()
    'a^4*q^-4 + a^4*t^2 + a^4*q^4*t^4 + a^6*q^-2*t^3 + a^6*q^2*t^5'
    >>> r.homfly_specialization().to_string()        # t = -1
    'a^4*q^-4 + a^4 + a^4*q^4 - a^6*q^-2 - a^6*q^2'

    References
    ----------
    E. Gorsky, A. Negut, J. Math. Pures Appl. 104 (2015); N. Dunfield, S. Gukov, J. Rasmussen,
    Experiment. Math. 15 (2006); M. Aganagic, S. Shakirov, arXiv:1105.5117.
    """
    k_obj = parse_knot(knot)
    lam = as_partition(rep)
    if lam != (1,):
        raise InvalidRepresentationError(
            f"superpolynomial: colour {list(lam)} is not implemented; only the fundamental [1]"
        )
    if not k_obj.is_knot:
        raise InvalidKnotError(
            f"superpolynomial: {k_obj} is a link of {k_obj.components} components; give a torus knot"
        )
    mirrored = (k_obj.chirality < 0) != bool(mirror)
    if k_obj.is_unknot:
        value = LaurentM(_VARS, {(0, 0, 0): 1})
        n = k = 0
    else:
        n, k = torus_family(k_obj.P, k_obj.Q)
        value = _dgr(n, k)
        if mirrored:
            value = value.substitute_monomials({v: {v: -1} for v in _VARS})
    chir = "as given" if not mirror else "mirror image of the input"
    profile = Profile(
        variables=_VARS,
        variable_map=VARIABLE_MAP,
        framing=(0,),
        framing_note="reduced invariant (framing-independent)",
        normalisation="reduced (unknot = 1); lowest term a^(2g) q^(-2g) t^0 for positive torus knots",
        chirality=chir,
        skein="",
        notes=(f"from the hook pairings of nabla^{k} e_{n} (modified Macdonald basis)",) if n else (),
    )
    return SuperpolynomialResult(
        quantity="superpolynomial", knot=str(k_obj), group="refined U(N), generic N",
        colours=((1,),), value=value, profile=profile,
        route="macdonald-nabla", inputs={"knot": str(knot), "rep": [1], "mirror": bool(mirror)},
    )
