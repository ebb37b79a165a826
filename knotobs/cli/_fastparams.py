"""Fast coercion of plain ``str``/``int``/``float`` command-line values.

typer (0.29) coerces every option value through a pydantic ``TypeAdapter``; importing
pydantic and building the adapters costs about 0.1 s of CPU on every command, more than
many of the computations.  Every option of knotobs is a plain ``str``, ``int``, ``float``
or ``bool``, so :func:`install` gives those a direct conversion (same errors: an invalid
value is a ``BadParameter`` naming the option) and leaves every other annotation to typer.
If typer's internals differ from what is expected, nothing is changed.

>>> install()
True
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

__all__ = ["install"]

_INSTALLED = False


def install() -> bool:
    """Install the fast path (idempotent); ``False`` when typer's internals are not as expected."""
    global _INSTALLED
    if _INSTALLED:
        return True
    try:
        from typer import _coercion, core
        from typer._click.exceptions import BadParameter

        base = _coercion.RuntimeParam
        original = core._TyperParameter.get_runtime_param
    except (ImportError, AttributeError):  # pragma: no cover - another typer version
        return False

    _NAMES = {int: "integer", float: "number"}
    _BOOLS = {"true": True, "1": True, "yes": True, "y": True, "on": True,
              "false": False, "0": False, "no": False, "n": False, "off": False}

    @dataclass(frozen=True)
    class PlainRuntimeParam(base):  # type: ignore[misc, valid-type]
        """``str``, ``int`` and ``float`` values converted directly."""

        def _coerce_value(self, value: Any, param, ctx) -> Any:
            kind = self.annotation
            if kind is str:
                return value if isinstance(value, str) else str(value)
            if kind is bool:
                if isinstance(value, bool):
                    return value
                word = str(value).strip().lower()
                if word in _BOOLS:
                    return _BOOLS[word]
                raise BadParameter(f"{value!r} is not a valid boolean", ctx=ctx, param=param)
            if isinstance(value, kind) and not isinstance(value, bool):
                return value
            try:
                return kind(str(value).strip())
            except ValueError:
                raise BadParameter(f"{value!r} is not a valid {_NAMES[kind]}", ctx=ctx, param=param) from None

    def get_runtime_param(self):
        if getattr(self, "_runtime_param", None) is None:
            td = getattr(self, "type_descriptor", None)
            plain = (td is not None and td.annotation in (str, int, float, bool) and getattr(td, "file_annotation", None) is None
                     and not getattr(td, "is_choice", False) and getattr(td.parameter_info, "parser", None) is None
                     and getattr(td.parameter_info, "click_type", None) is None
                     and self.nargs == 1 and not self.multiple)
            if plain:
                self._runtime_param = PlainRuntimeParam(annotation=td.annotation, parameter_info=td.parameter_info)
                return self._runtime_param
        return original(self)

    core._TyperParameter.get_runtime_param = get_runtime_param
    _INSTALLED = True
    return True
