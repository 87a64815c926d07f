"""Whole LaTeX documents made of tensym results.

Every result's ``latex()`` gives math-mode content (like ``sympy.latex``);
:func:`latex_document` puts each one, under a text heading, in a display of
an ``article`` document that needs only amsmath, geometry (margins) and
longtable (tables that break across pages), all part of every LaTeX
installation, so that ``pdflatex`` compiles it as it is.

Examples
--------
>>> from tensym.output.document import latex_document
>>> from tensym.output.table import Table
>>> doc = latex_document([Table(title="t", columns=("a",), rows=(("1",),))], title="Notes")
>>> doc.splitlines()[0], "\\\\section*{Notes}" in doc, doc.rstrip().endswith("\\\\end{document}")
('\\\\documentclass[11pt]{article}', True, True)
"""

from tensym.errors import InvalidOptionError
from tensym.output.symbols import text_latex

__all__ = ["latex_document", "LATEX_PREAMBLE", "LATEX_END"]

LATEX_PREAMBLE = (
    "\\documentclass[11pt]{article}\n"
    "\\usepackage{amsmath}\n"
    "\\usepackage[margin=2cm]{geometry}\n"
    "\\usepackage{longtable}\n"
    "\\setcounter{MaxMatrixCols}{20}\n"
    "\\begin{document}\n"
)
LATEX_END = "\\end{document}\n"


def latex_document(results, *, title=None):
    """A complete LaTeX document (amsmath) showing one or more results.

    Parameters
    ----------
    results : sequence
        tensym results (tensor forms, tables, character tables, decompositions,
        correlation tables, symmetry-adapted bases, check reports, batch
        checks, orientations, symmetry findings) and plain strings, which
        become paragraphs of text (LaTeX special characters escaped).
    title : str, optional
        A heading at the top (``\\section*``).

    Returns
    -------
    str
        The document, ending with ``\\end{document}`` and a newline.

    Raises
    ------
    InvalidOptionError
        If ``results`` is empty or an item is not a result tensym renders.

    Examples
    --------
    >>> import tensym
    >>> from tensym.groups.catalog import catalog_group
    >>> from tensym.tensors.form import tensor_form
    >>> doc = latex_document([tensor_form("pyroelectric", catalog_group("mm2")), "Only p3 survives."])
    >>> "\\\\begin{pmatrix}" in doc and "Only p3 survives." in doc
    True
    """
    from tensym.output.dispatch import latex_block

    if isinstance(results, str) or not hasattr(results, "__iter__"):
        results = [results]
    results = list(results)
    if not results:
        raise InvalidOptionError("latex_document needs at least one result or paragraph")
    body = []
    if title:
        body.append(f"\\section*{{{text_latex(title)}}}")
    for r in results:
        if isinstance(r, str):
            body.append(text_latex(r))
        else:
            body.append(latex_block(r))
    return LATEX_PREAMBLE + "\n\n\\medskip\n".join(body) + "\n" + LATEX_END
