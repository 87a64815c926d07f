"""The hook through which the outer output layer renders the core's results.

The exact core (groups, reps, tensors) and the data layer never import
:mod:`tensym.output`.  Their result types call :func:`show` from ``__str__``,
``latex()`` and ``_repr_latex_``; ``tensym.output`` installs the renderer with
:func:`install` when it is imported, which ``import tensym`` always does.

Examples
--------
>>> import tensym
>>> from tensym.display import show
>>> show(tensym.decompose(tensym.harmonics(1), "C3v"), "text")
'A1 + E  (group 3m, dimension 3)'
"""

from tensym.errors import InvalidOptionError

__all__ = ["show", "install", "FORMATS", "Displayed"]

#: Formats a renderer must accept.
FORMATS = ("text", "latex", "markdown", "json")

_RENDERER = []


def install(renderer):
    """Install ``renderer(result, format=..., **options)`` (called by tensym.output)."""
    _RENDERER[:] = [renderer]


def show(result, fmt, **options):
    """Render ``result`` in format ``fmt`` through the installed renderer.

    Raises
    ------
    InvalidOptionError
        For a format outside :data:`FORMATS`, or when no renderer is installed.
    """
    if fmt not in FORMATS:
        raise InvalidOptionError(f"format {fmt!r} is not one of {', '.join(FORMATS)}")
    if not _RENDERER:
        raise InvalidOptionError("no renderer installed: rendering lives in tensym.output (import tensym)")
    return _RENDERER[0](result, format=fmt, **options)


class Displayed:
    """Mixin: ``markdown()``, ``latex()`` and the notebook display of a result, through :func:`show`."""

    def markdown(self):
        """Markdown summary (rendered by tensym.output through :mod:`tensym.display`)."""
        return show(self, "markdown")

    def latex(self, *, standalone=False):
        """Math-mode LaTeX (amsmath); a complete document with ``standalone=True``."""
        return show(self, "latex", standalone=standalone)

    def _repr_latex_(self):
        return "$$" + self.latex() + "$$"
