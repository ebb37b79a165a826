"""The reduced superpolynomial ``P(a, q, t)`` of torus knots (refined Chern–Simons).

The refined (t-deformed) Chern–Simons invariant of a torus knot replaces the Schur
functions of the Rosso–Jones formula by Macdonald polynomials (M. Aganagic & S. Shakirov,
arXiv:1105.5117 and arXiv:1202.2489; I. Cherednik, arXiv:1111.6195).  knotobs evaluates it through the elliptic-Hall /
Hilbert-scheme description of E. Gorsky & A. Negut (J. Math. Pures Appl. 104 (2015) 403–435,
arXiv:1304.3328): the refined invariant of ``T(m, n)`` is the generating function of the hook
pairings ``<Q_{m,n}(-1)^n, s_(n-d, 1^d)>``, the ``a``-grading being ``d``.  Routes for ``[1]``:
the closed sum for ``Q_{nk+1,n}(-1)^n = nabla^k e_n`` (:mod:`knotobs.refined.nabla`, knots
``T(n, nk+1)``) and the operator recursion of :mod:`knotobs.refined.hall` (every torus knot).
Symmetric colours ``[r]``: the colour ``h_r[X/(1-q)]`` in the vertical generators, mapped to the
non-primitive ``Q_{km,kn}`` (:mod:`knotobs.refined.colored_hall`), and the same algebra on the Fock
space of Macdonald polynomials (:mod:`knotobs.refined.fock`); the grading map of ``[1]`` is kept.

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
``2g = (m - 1)(n - 1)`` twice the Seifert genus (DGR's normalisation of positive torus knots).
The mirror image has ``P(a^-1, q^-1, t^-1)`` (duality of the homology).

>>> superpolynomial("T(2,3)").exact_string()
'a^2*q^-2 + a^2*q^2*t^2 + a^4*t^3'
"""

from __future__ import annotations

from math import gcd

from knotobs.errors import InvalidKnotError, InvalidRepresentationError, KnotobsError
from knotobs.evaluation.profiles import Profile
from knotobs.fibrations.torus import parse_knot
from knotobs.polynomials.multivariate import LaurentM
from knotobs.refined.colored_hall import symmetric_hall_check, symmetric_hall_pairings
from knotobs.refined.fock import fock_check, fock_pairings
from knotobs.refined.hall import hall_hook_pairings
from knotobs.refined.nabla import hook_pairings
from knotobs.refined.result import SuperpolynomialResult
from knotobs.representations.partitions import as_partition

__all__ = ["superpolynomial", "torus_family", "ROUTES", "SuperpolynomialMismatchError"]

ROUTES = ("auto", "nabla", "elliptic-hall", "macdonald", "both")


class SuperpolynomialMismatchError(KnotobsError, ArithmeticError):
    """The two routes disagreed (a bug; please report it with the knot)."""

_VARS = ("a", "q", "t")

VARIABLE_MAP = (
    "Dunfield-Gukov-Rasmussen grading: P(a, q, t=-1) = HOMFLY-PT with a_DGR = a^-1, "
    "q_DGR = q^(1/2) of the HOMFLY-PT profile; P(a=q^2, q, t) >= reduced Khovanov"
)


VARIABLE_MAP_SYMMETRIC = (
    "Dunfield-Gukov-Rasmussen grading of the fundamental colour, kept for every [r]: from the Macdonald "
    "variables (P_mu(q_M, t_M), A = t_M^N) q_M = q^-2 t^-2, t_M = q^-2, A = -a^-2 t^-1, then the monomial putting "
    "the lowest a- and then q-term at a^(2gr) q^(-2gr) t^0; P(a, q, t=-1) = [r]-coloured HOMFLY-PT with "
    "a_DGR = a^-1, q_DGR = q^(-1/2) of the HOMFLY-PT profile"
)


def torus_family(P: int, Q: int) -> tuple[int, int] | None:
    """``(n, k)`` with ``{P, Q} = {n, n k + 1}`` (the family of the nabla route), else ``None``.

    >>> torus_family(3, 4), torus_family(7, 2), torus_family(3, 5)
    ((3, 1), (2, 3), None)
    """
    for n, m in ((P, Q), (Q, P)):
        if n >= 2 and m % n == 1:
            return n, (m - 1) // n
    return None


def _to_dgr(F: dict, two_g: int) -> LaurentM:
    raw: dict[tuple, int] = {}
    for (i, j, d), c in F.items():
        # q_M -> q^-2 t^-2, t_M -> q^2, z -> a^-2 t^-1
        key = (-2 * d, -2 * i + 2 * j, -2 * i - d)
        raw[key] = raw.get(key, 0) + c
    a_low = min(e[0] for e in raw)
    q_low = min(e[1] for e in raw if e[0] == a_low)
    t_low = min(e[2] for e in raw if e[0] == a_low and e[1] == q_low)
    return LaurentM(_VARS, raw).shift((two_g - a_low, -two_g - q_low, -t_low))


def _route_values(P: int, Q: int, route: str) -> tuple[LaurentM, str, dict]:
    two_g = (P - 1) * (Q - 1)
    fam = torus_family(P, Q)
    n, m = min(P, Q), max(P, Q)
    if route == "auto":
        route = "nabla" if fam else "elliptic-hall"
    if route == "both" and fam is None:           # outside T(n, nk+1): the two operator routes
        return _symmetric_route_values(P, Q, 1, "both")
    if route == "nabla" and fam is None:
        raise InvalidKnotError(
            f"the nabla route covers torus knots T(n, nk+1) only; T({P},{Q}) is not of that form "
            "(use route 'elliptic-hall', 'macdonald', 'both' or 'auto')"
        )
    values = {}
    if route in ("nabla", "both"):
        values["nabla"] = _to_dgr(hook_pairings(*fam), two_g)
    if route in ("elliptic-hall", "both"):
        values["elliptic-hall"] = _to_dgr(hall_hook_pairings(m, n), two_g)
    if route == "macdonald":
        values["macdonald"] = _to_dgr(fock_pairings(m, n, 1), two_g)
    if route == "both":
        if values["nabla"] != values["elliptic-hall"]:
            raise SuperpolynomialMismatchError(f"nabla and elliptic-Hall routes disagree for T({P},{Q})")
        return values["nabla"], "both (nabla and elliptic-Hall agree)", values
    return values[route], route, values


def _symmetric_route_values(P: int, Q: int, r: int, route: str) -> tuple[LaurentM, str, dict]:
    """The colour ``[r]``: elliptic Hall on ``H~`` and the Macdonald Fock space (``[1]`` outside ``T(n, nk+1)``)."""
    if route == "nabla":
        raise InvalidKnotError(
            f"the nabla route is the fundamental colour [1] only; for [{r}] choose "
            "'elliptic-hall', 'macdonald', 'both' or 'auto'"
        )
    n, m = min(P, Q), max(P, Q)
    two_g = (P - 1) * (Q - 1)
    if route == "auto":
        route = "macdonald"
    wanted = ("elliptic-hall", "macdonald") if route == "both" else (route,)
    # both estimates before either route starts
    for name in wanted:
        (symmetric_hall_check if name == "elliptic-hall" else fock_check)(m, n, r, f"T({P},{Q})")
    values = {}
    for name in wanted:
        F = symmetric_hall_pairings(m, n, r) if name == "elliptic-hall" else fock_pairings(m, n, r)
        values[name] = _to_dgr(F, two_g * r)
    if route == "both":
        if values["elliptic-hall"] != values["macdonald"]:
            raise SuperpolynomialMismatchError(
                f"elliptic-Hall and Macdonald (Fock space) routes disagree for T({P},{Q}) coloured [{r}]")
        return values["macdonald"], "both (elliptic-Hall and Macdonald Fock space agree)", values
    return values[route], route, values


def superpolynomial(knot, rep=(1,), *, mirror: bool = False, route: str = "auto") -> SuperpolynomialResult:
    """The reduced superpolynomial ``P(a, q, t)`` of a torus knot, fundamental or symmetric colour ``[r]``.

    Parameters
    ----------
    knot : str or TorusLink
        ``"T(2,5)"``, ``"T(3,4)"``, ``"T(2,-3)"`` (mirror), ...
    rep : partition
        The colour: the fundamental ``[1]`` or a symmetric ``[r]`` (one row, ``r >= 1``).
    mirror : bool
        Take the mirror image of the knot.
    route : {"auto", "nabla", "elliptic-hall", "macdonald", "both"}
        ``nabla``: the closed sum over partitions (knots ``T(n, nk+1)``, colour ``[1]``);
        ``elliptic-hall``: the operators ``Q_{m,n}`` on modified Macdonald polynomials (every torus
        knot, every ``[r]``); ``macdonald``: the same algebra on the Fock space of Macdonald
        polynomials with the principal specialisation (every torus knot, every ``[r]``); ``both``
        computes two and checks that they agree (``nabla`` and ``elliptic-hall`` for ``[1]`` on
        ``T(n, nk+1)``, otherwise ``elliptic-hall`` and ``macdonald``); ``auto`` takes ``nabla`` where
        it applies, else ``elliptic-hall`` for ``[1]`` and ``macdonald`` for ``[r]``.

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
    >>> superpolynomial("T(2,3)", [2], route="both").num_terms()
    9

    References
    ----------
    E. Gorsky, A. Negut, J. Math. Pures Appl. 104 (2015); N. Dunfield, S. Gukov, J. Rasmussen,
    Experiment. Math. 15 (2006); M. Aganagic, S. Shakirov, arXiv:1105.5117; CONVENTIONS §17.
    """
    if route not in ROUTES:
        raise InvalidKnotError(f"unknown route {route!r}: choose one of {', '.join(ROUTES)}")
    k_obj = parse_knot(knot)
    lam = as_partition(rep)
    if len(lam) != 1 or lam[0] < 1:
        raise InvalidRepresentationError(
            f"superpolynomial: colour {list(lam)} is not implemented; the fundamental [1] and the "
            "symmetric colours [r] (one row, r >= 1) are"
        )
    r = lam[0]
    if not k_obj.is_knot:
        raise InvalidKnotError(
            f"superpolynomial: {k_obj} is a link of {k_obj.components} components; give a torus knot"
        )
    mirrored = (k_obj.chirality < 0) != bool(mirror)
    values: dict = {}
    if k_obj.is_unknot:
        value, used = LaurentM(_VARS, {(0, 0, 0): 1}), "unknot"
    elif r == 1:
        value, used, values = _route_values(k_obj.P, k_obj.Q, route)
    else:
        value, used, values = _symmetric_route_values(k_obj.P, k_obj.Q, r, route)
    if mirrored:
        inv = {v: {v: -1} for v in _VARS}
        value = value.substitute_monomials(inv)
        values = {k: v.substitute_monomials(inv) for k, v in values.items()}
    chir = "as given" if not mirror else "mirror image of the input"
    notes = [("hook pairings of a symmetric function in the modified Macdonald basis "
              "(nabla^k e_n, or Q_{m,n}(-1)^n of the elliptic Hall algebra)") if r == 1 else
             (f"colour [{r}] = h_{r}[X/(1-q)] in the vertical generators Q_(0,k) of the elliptic Hall "
              "algebra, mapped to Q_(km,kn) (Gorsky-Negut), reduced by the unknot")]
    if len(values) > 1:
        notes += [f"route {name}: {val.to_string()}" for name, val in values.items()]
    profile = Profile(
        variables=_VARS,
        variable_map=VARIABLE_MAP if r == 1 else VARIABLE_MAP_SYMMETRIC,
        framing=(0,),
        framing_note="reduced invariant (framing-independent)",
        normalisation=("reduced (unknot = 1); lowest term a^(2g) q^(-2g) t^0 for positive torus knots" if r == 1
                       else f"reduced (unknot = 1); lowest term a^(2g r) q^(-2g r) t^0 for positive torus knots, r = {r}"),
        chirality=chir,
        skein="",
        notes=tuple(notes),
    )
    return SuperpolynomialResult(
        quantity="superpolynomial", knot=str(k_obj), group="refined U(N), generic N",
        colours=((r,),), value=value, profile=profile,
        route=used, inputs={"knot": str(knot), "rep": [r], "mirror": bool(mirror), "route": route},
    )
