"""Flat SL(2,C) connections on Seifert manifolds over S^2: enumeration, Chern–Simons values, torsion."""
