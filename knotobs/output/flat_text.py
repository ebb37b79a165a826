"""Text form of the table of flat SL(2,C) connections (:mod:`knotobs.flat.table`)."""

from __future__ import annotations

import mpmath

__all__ = ["flat_sl2c_text"]


def flat_sl2c_text(table) -> str:
    """Human-readable table: one line per connection.

    >>> from knotobs.flat.table import flat_sl2c_connections
    >>> print(flat_sl2c_text(flat_sl2c_connections("Sigma(2,3,5)")).splitlines()[0])
    flat SL(2,C) connections on Sigma(2,3,5) = M(0; -1; (2,1), (3,1), (5,1))   (|H_1| = 1)
    """
    c = table.counts()
    w = max(20, table.digits + 6)       # the torsion column holds every requested digit
    lines = [f"flat SL(2,C) connections on {table.space} = {table.normal_form}   (|H_1| = {table.h1_order})",
             f"irreducible: {c['irreducible']} ({c['irreducible_SU(2)']} SU(2), {c['irreducible_SL(2,R)']} SL(2,R),"
             f" {c['irreducible'] - c['irreducible_SU(2)'] - c['irreducible_SL(2,R)']} components of positive dimension);"
             f" abelian (with trivial): {c['abelian_including_trivial']}",
             f"{'kind':<12} {'real form':<18} {'rho(h)':>8} {'cs mod 1':>12} {'dim':>4} {'torsion':>{w}}  rotation numbers (abelian: angles theta_j)"]
    for r in table.rows:
        ch = r.character
        tau = "" if r.torsion is None else mpmath.nstr(r.torsion, table.digits)
        rh = f"{ch.eps:+d}" if ch.kind == "irreducible" else f"s={ch.h_angle}" if ch.h_angle else "1"
        lines.append(f"{ch.kind:<12} {ch.real_form:<18} {rh:>8} {str(ch.cs):>12} {ch.dimension:>4} {tau:>{w}}  "
                     f"{tuple(ch.rotation) if ch.kind == 'irreducible' else 'angles ' + ', '.join(str(t) for t in ch.rotation)}")
    lines.extend(f"note: {n}" for n in table.notes)
    return "\n".join(lines)
