"""Resurgence of the trivial-connection series of Seifert manifolds: Borel plane, singularities, Stokes constants, resummation."""
