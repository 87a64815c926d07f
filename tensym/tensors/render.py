"""Text and LaTeX of a TensorForm, for its methods (the work is done in tensym.output).

The tensors layer stays below output: these functions go through the
:mod:`tensym.display` hook that tensym.output installs, and never import it.

Examples
--------
>>> import tensym
>>> from tensym.groups.catalog import catalog_group
>>> from tensym.tensors.form import tensor_form
>>> print(form_text(tensor_form("pyroelectric", catalog_group("6"))).splitlines()[2])
1 independent: p3
"""

__all__ = ["form_text", "form_latex"]


def form_text(form):
    """Readable text of a TensorForm (see :func:`tensym.output.forms.form_text`).

    Examples
    --------
    >>> from tensym.groups.catalog import catalog_group
    >>> from tensym.tensors.form import tensor_form
    >>> form_text(tensor_form("pyroelectric", catalog_group("1"))).splitlines()[0]
    'pyroelectric coefficients p_i'
    """
    from tensym.display import show

    return show(form, "text")


def form_latex(form, *, standalone=False):
    """Math-mode LaTeX of a TensorForm, or a document (see :func:`tensym.output.forms.form_latex`).

    Examples
    --------
    >>> from tensym.groups.catalog import catalog_group
    >>> from tensym.tensors.form import tensor_form
    >>> form_latex(tensor_form("pyroelectric", catalog_group("-1")))
    '\\\\begin{gathered}\\n\\\\bigl[p_{i}\\\\bigr] = \\\\begin{pmatrix}\\n0 \\\\\\\\\\n0 \\\\\\\\\\n0\\n\\\\end{pmatrix}\\n\\\\end{gathered}'
    """
    from tensym.display import show

    return show(form, "latex", standalone=standalone)
