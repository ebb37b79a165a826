"""Convention profiles: every result says which variables, framing, normalisation and chirality it uses."""

from __future__ import annotations

from dataclasses import asdict, dataclass, field

__all__ = ["Profile", "UNNORMALISED", "NORMALISED"]

UNNORMALISED = "unnormalized (unknot = dim_q, i.e. normalized by Z(S^3))"
NORMALISED = "normalized (unknot = 1)"


@dataclass(frozen=True)
class Profile:
    """The conventions a polynomial is written in.

    Attributes
    ----------
    variables : tuple of str
        Variables of the printed polynomial, e.g. ``("q",)``, ``("t",)``, ``("a", "z")``.
    variable_map : str
        How they relate to the quantum-group variable ``q = exp(2 pi i/(k+N))``,
        e.g. ``"t = q^-1"`` or ``"a = q^(N/2), z = q^(1/2) - q^(-1/2)"``.
    framing : tuple of int
        Framing of each component relative to its Seifert framing.
    framing_note : str
        How the framing was chosen (``"zero (Seifert) framing"``, ``"fiber framing P*Q"``, ...).
    normalisation : str
    chirality : str
        ``"as given"`` or ``"mirror image of the input"``.
    skein : str
        The skein relation or defining convention, when there is one.
    """

    variables: tuple[str, ...]
    variable_map: str
    framing: tuple[int, ...]
    framing_note: str
    normalisation: str
    chirality: str = "as given"
    skein: str = ""
    notes: tuple[str, ...] = field(default_factory=tuple)

    def to_dict(self) -> dict:
        d = asdict(self)
        d["variables"] = list(self.variables)
        d["framing"] = list(self.framing)
        d["notes"] = list(self.notes)
        return d

    def describe(self) -> str:
        """One line per convention, for text output."""
        lines = [
            f"variables:     {', '.join(self.variables)}   ({self.variable_map})",
            f"framing:       {list(self.framing)}   ({self.framing_note})",
            f"normalization: {self.normalisation}",
            f"chirality:     {self.chirality}",
        ]
        if self.skein:
            lines.append(f"convention:    {self.skein}")
        lines.extend(f"note:          {n}" for n in self.notes)
        return "\n".join(lines)
