"""LaTeX spellings of group symbols, irrep labels and plain words.

Hermann-Mauguin symbols are stored in ASCII with the overbar written as a
leading minus (``-42m``, ``m-3m``) and ``inf`` for the infinity sign; the
Schoenflies symbols as ``D6h``, ``C3i``, ``C∞v``.  These kernels turn them
into math-mode LaTeX: ``\\bar{4}2m``, ``D_{6h}``, ``C_{\\infty v}``.

Examples
--------
>>> from tensym.output.symbols import hm_latex, schoenflies_latex
>>> hm_latex("-42m"), hm_latex("m-3m"), hm_latex("inf/mm")
('\\\\bar{4}2m', 'm\\\\bar{3}m', '\\\\infty/mm')
>>> schoenflies_latex("D6h"), schoenflies_latex("C∞v"), schoenflies_latex("Oh")
('D_{6h}', 'C_{\\\\infty v}', 'O_{h}')
"""

import re

__all__ = ["hm_latex", "schoenflies_latex", "text_latex", "mulliken_latex"]

_TEXT_SPECIALS = {
    "\\": r"\textbackslash{}",
    "&": r"\&",
    "%": r"\%",
    "$": r"\$",
    "#": r"\#",
    "_": r"\_",
    "{": r"\{",
    "}": r"\}",
    "~": r"\textasciitilde{}",
    "^": r"\textasciicircum{}",
    "<": r"\textless{}",
    ">": r"\textgreater{}",
    "∞": r"$\infty$",
    "°": r"$^\circ$",
}


def text_latex(words):
    """Escape plain words for LaTeX text mode (no math).

    Parameters
    ----------
    words : str
        Any text, e.g. a setting description ``'3-folds along <111>'``.

    Returns
    -------
    str
        The same words with the LaTeX special characters escaped.

    Examples
    --------
    >>> text_latex("3-folds along <111>, 50% & more_x")
    '3-folds along \\\\textless{}111\\\\textgreater{}, 50\\\\% \\\\& more\\\\_x'
    """
    return "".join(_TEXT_SPECIALS.get(ch, ch) for ch in str(words))


def hm_latex(symbol):
    """Math-mode LaTeX of an ASCII Hermann-Mauguin symbol.

    A minus before a digit becomes an overbar, ``inf`` (or ``∞``) becomes
    ``\\infty``, spaces (full symbols such as ``4/m -3 2/m``) become thin spaces.

    Parameters
    ----------
    symbol : str
        Short or full Hermann-Mauguin symbol, ASCII style.

    Returns
    -------
    str

    Examples
    --------
    >>> hm_latex("4/m -3 2/m")
    '4/m\\\\,\\\\bar{3}\\\\,2/m'
    >>> hm_latex("-6m2"), hm_latex("SO(3)")
    ('\\\\bar{6}m2', '\\\\mathrm{SO}(3)')
    """
    s = str(symbol).strip().replace("∞", "inf")
    if s in ("SO(3)", "O(3)"):
        return "\\mathrm{" + s[:-3] + "}(3)"
    out = []
    i = 0
    while i < len(s):
        ch = s[i]
        if s.startswith("inf", i):
            i += 3
            out.append(r"\infty " if i < len(s) and s[i].isalpha() else r"\infty")
            continue
        if ch == "-" and i + 1 < len(s) and s[i + 1].isdigit():
            out.append(r"\bar{" + s[i + 1] + "}")
            i += 2
            continue
        if ch == " ":
            out.append(r"\,")
            i += 1
            continue
        out.append(ch)
        i += 1
    return "".join(out)


_SCH = re.compile(r"^([A-Za-z])(.*)$")


def schoenflies_latex(symbol):
    """Math-mode LaTeX of a Schoenflies symbol: the letter, the rest as subscript.

    Magnetic groups: ``G(H)`` (black-and-white, H the unitary subgroup) and
    ``G1'`` (grey) keep their parentheses and the ``1'``.

    Parameters
    ----------
    symbol : str
        E.g. ``'D3d'``, ``'C∞h'``, ``'Kh'``, ``'T'``, ``'D3d(D3)'``, ``"C4v1'"``.

    Returns
    -------
    str

    Examples
    --------
    >>> schoenflies_latex("C3i"), schoenflies_latex("T")
    ('C_{3i}', 'T')
    >>> schoenflies_latex("D3d(D3)"), schoenflies_latex("C4v1'")
    ('D_{3d}(D_{3})', "C_{4v}1'")
    """
    s = str(symbol).strip()
    m = re.match(r"^(.*)\((.*)\)$", s)
    if m:
        return schoenflies_latex(m.group(1)) + "(" + schoenflies_latex(m.group(2)) + ")"
    if s.endswith("1'") and len(s) > 2:
        return schoenflies_latex(s[:-2]) + "1'"
    m = _SCH.match(s)
    if not m or not m.group(2):
        return s
    rest = re.sub(r"inf([A-Za-z]?)", lambda t: r"\infty" + (" " + t.group(1) if t.group(1) else ""),
                  m.group(2).replace("∞", "inf"))
    return f"{m.group(1)}_{{{rest}}}"


_MULLIKEN = re.compile(r"^([A-Za-z]+)(.*)$")


def mulliken_latex(label):
    """Math-mode LaTeX of an irrep label: subscripts and primes kept apart.

    ``A1g`` -> ``A_{1g}``, ``E''`` -> ``E''``, ``T2u`` -> ``T_{2u}``,
    ``E1'`` -> ``E_{1}'``, ``1E`` / ``2E`` (split complex pairs) -> ``{}^{1}E``.

    Parameters
    ----------
    label : str

    Returns
    -------
    str

    Examples
    --------
    >>> mulliken_latex("A1g"), mulliken_latex("E''"), mulliken_latex("2Eu")
    ('A_{1g}', "E''", '{}^{2}E_{u}')
    """
    s = str(label).strip()
    pre = ""
    m = re.match(r"^(\d+)(.*)$", s)
    if m:
        pre, s = "{}^{" + m.group(1) + "}", m.group(2)
    primes = ""
    while s.endswith("'"):
        primes += "'"
        s = s[:-1]
    m = _MULLIKEN.match(s)
    if not m:
        return pre + s + primes
    head, sub = m.group(1), m.group(2)
    # a head of several letters (e.g. "Eg" written as one word) keeps its first letter
    if len(head) > 1:
        head, sub = head[0], head[1:] + sub
    body = head + (f"_{{{sub}}}" if sub else "")
    return pre + body + primes
