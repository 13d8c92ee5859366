"""The exceptions of hydrograde, one per core error kind.

Every exception derives from :class:`HydrogradeError`; those caused by a bad value also
derive from :class:`ValueError`. Each carries the core's message and its structured
fields: ``kind`` (the core's kind name), ``parameter`` (the argument at fault, when one
is), ``value`` (the value given, when a number) and ``index`` (the flat index of the
failing element of an array, when one).
"""

from __future__ import annotations

from typing import ClassVar, Dict, Optional, Type


class HydrogradeError(Exception):
    """Base class of every error raised by hydrograde."""

    kind: ClassVar[str] = ""

    def __init__(
        self,
        message: str,
        *,
        parameter: Optional[str] = None,
        value: Optional[float] = None,
        index: Optional[int] = None,
    ) -> None:
        super().__init__(message)
        self.parameter = parameter
        self.value = value
        self.index = index

    @property
    def message(self) -> str:
        """The core's message: the parameter, its value and the rule it broke."""
        return str(self.args[0]) if self.args else ""


class NotFiniteError(HydrogradeError, ValueError):
    """A number that must be finite was NaN or infinite."""

    kind = "not_finite"


class OutOfRangeError(HydrogradeError, ValueError):
    """A finite number outside the range the calculation accepts."""

    kind = "out_of_range"


class UnknownNameError(HydrogradeError, ValueError):
    """A name (correlation, fitting, material, size, unit…) that is not known."""

    kind = "unknown_name"


class InvalidInputError(HydrogradeError, ValueError):
    """Input malformed as a whole: an empty line, shapes that do not broadcast…"""

    kind = "invalid"


class NoSolutionError(HydrogradeError):
    """The question has no answer (curves that do not cross, a head no flow meets…)."""

    kind = "no_solution"


# Shown and pickled as hydrograde.<Name>, where users import them from.
for _cls in (
    HydrogradeError, NotFiniteError, OutOfRangeError, UnknownNameError,
    InvalidInputError, NoSolutionError,
):
    _cls.__module__ = "hydrograde"
del _cls

BY_KIND: Dict[str, Type[HydrogradeError]] = {
    cls.kind: cls
    for cls in (
        NotFiniteError,
        OutOfRangeError,
        UnknownNameError,
        InvalidInputError,
        NoSolutionError,
    )
}
