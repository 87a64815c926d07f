"""Validation of the arguments of the public representation functions (private).

Examples
--------
>>> as_group_arg("4mm").order
8
"""

from tensym.errors import InvalidArgumentError, InvalidGroupError, InvalidOptionError
from tensym.reps.space import Space

__all__ = ["as_group_arg", "as_space_arg", "check_option", "register_space_names"]

# Resolvers of names (e.g. catalog property names) to spaces, registered by the
# layers above (tensym.tensors registers the property catalog); reps itself
# never imports them.
_NAME_RESOLVERS = []


def register_space_names(resolver):
    """Register ``resolver(name) -> Space or None`` for string arguments of the space functions."""
    if resolver not in _NAME_RESOLVERS:
        _NAME_RESOLVERS.append(resolver)


def as_group_arg(group, name="group"):
    """A group object from a group or its symbol (tensym.groups.as_group)."""
    from tensym.groups import as_group

    try:
        return as_group(group)
    except InvalidGroupError as exc:
        raise InvalidGroupError(f"{name}: {exc}") from exc


def as_space_arg(obj, name="space"):
    """A Space from a Space or an object with ``as_space()`` (TensorSpec, catalog property)."""
    if isinstance(obj, Space):
        return obj
    if isinstance(obj, str):
        for resolve in _NAME_RESOLVERS:
            found = resolve(obj)
            if found is not None:
                return found
    conv = getattr(obj, "as_space", None)
    if callable(conv):
        sp_ = conv()
        if isinstance(sp_, Space):
            return sp_
    spec = getattr(obj, "spec", None)  # a catalog Property carries its TensorSpec
    if spec is not None and callable(getattr(spec, "as_space", None)):
        return spec.as_space()
    raise InvalidArgumentError(
        f"{name}: expected a representation space (tensym.harmonics(l), tensym.polynomials(n), an irrep "
        f"product, a TensorSpec or a catalog property), got {type(obj).__name__} {obj!r}"
    )


def check_option(name, value, allowed):
    """Raise InvalidOptionError unless ``value`` is one of ``allowed``."""
    if value not in allowed:
        raise InvalidOptionError(f"{name}={value!r} is not one of {', '.join(repr(a) for a in allowed)}")
    return value
