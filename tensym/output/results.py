"""Renderers for the result types of the reps and data layers.

Each block registers a result type only when its module exists in this
installation of tensym, so that output/ never depends on a layer that is not
there.

Examples
--------
>>> from tensym.output.results import register_all
>>> register_all(lambda cls, **kw: cls)
"""

__all__ = ["register_all"]


def register_all(register):
    """Register the renderers of every reps/data result type that exists.

    Parameters
    ----------
    register : callable
        ``register(cls, text=..., latex=..., markdown=..., record=..., heading=..., after=...)``
        (normally :func:`tensym.output.dispatch.register_renderer`).

    Returns
    -------
    None
    """
    return None
