"""Exceptions raised by tensym.

Every error tensym raises derives from :class:`TensymError`, and each subclass
also derives from the built-in exception it refines, so ``except ValueError``
keeps working for callers that do not know tensym.

Examples
--------
>>> from tensym.errors import UnknownGroupError, TensymError
>>> issubclass(UnknownGroupError, KeyError) and issubclass(UnknownGroupError, TensymError)
True
"""

__all__ = [
    "TensymError",
    "UnknownGroupError",
    "UnknownPropertyError",
    "InvalidOperationError",
    "GroupClosureError",
    "InvalidSpecError",
    "InvalidOptionError",
    "DataError",
    "RankLimitError",
    "MemoryLimitError",
    "InvalidGroupError",
]


class TensymError(Exception):
    """Base class of every error tensym raises."""


class UnknownGroupError(TensymError, KeyError):
    """A group symbol that names no group tensym knows.

    The message lists the nearest valid symbols.
    """

    def __str__(self):  # KeyError would otherwise quote the message
        return str(self.args[0]) if self.args else ""


class UnknownPropertyError(TensymError, KeyError):
    """A property name that is not in the catalog (the message lists the nearest)."""

    def __str__(self):
        return str(self.args[0]) if self.args else ""


class InvalidOperationError(TensymError, ValueError):
    """A symmetry operation that is malformed or not orthogonal."""


class GroupClosureError(TensymError, ValueError):
    """Generators that do not close to a finite group below the size limit."""


class InvalidSpecError(TensymError, ValueError):
    """A malformed or inconsistent tensor specification."""


class InvalidOptionError(TensymError, ValueError):
    """A keyword option outside its documented closed set."""


class DataError(TensymError, ValueError):
    """Numeric tensor data of the wrong shape, with NaN/inf, or inconsistent."""


class RankLimitError(TensymError, ValueError):
    """A tensor rank beyond the limit tensym supports."""


class MemoryLimitError(RankLimitError, MemoryError):
    """A request refused before allocating because its estimated memory passes the limit.

    The message gives the estimate and the limit (``tensym.tensors.spec.MEMORY_LIMIT``).
    It is also a :class:`RankLimitError` (the usual cause is a high rank) and a
    ``MemoryError``.
    """


class InvalidGroupError(TensymError, TypeError):
    """An object given where a point group (or its symbol) is expected."""


class UnknownIrrepError(TensymError, KeyError):
    """An irrep label that the group does not have (the message lists the nearest labels)."""

    def __str__(self):
        return str(self.args[0]) if self.args else ""


class RepresentationError(TensymError, ValueError):
    """An object that does not belong to the space or group it is used with."""


class InvalidArgumentError(TensymError, TypeError):
    """An argument of the wrong type (the message says what is accepted)."""
