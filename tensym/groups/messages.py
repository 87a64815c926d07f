"""Small helpers for error messages (private).

Examples
--------
>>> echo("x" * 50)
"'xxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxx...'"
>>> echo([1, 2])
'[1, 2]'
"""

__all__ = ["echo", "MAX_ECHO"]

#: Characters of a user's value that a message repeats; longer values are cut with '...'.
MAX_ECHO = 40


def echo(value):
    """``repr`` of a user's value for a message: a string cut to MAX_ECHO characters (plus '...'), else its repr cut."""
    if isinstance(value, str):
        return repr(value if len(value) <= MAX_ECHO else value[:MAX_ECHO] + "...")
    try:
        r = repr(value)
    except Exception:  # a broken __repr__ must not hide the real error
        r = f"<{type(value).__name__} object>"
    return r if len(r) <= MAX_ECHO + 2 else r[:MAX_ECHO] + "..."
