"""Output: tensym results as text, LaTeX, Markdown and JSON documents.

Public functions:

* :func:`render` -- one result in one format (``text``, ``latex``, ``markdown``, ``json``);
* :func:`latex_document` -- a complete LaTeX document of several results;
* :func:`as_record` -- a JSON-ready dict of a result.

Every ``latex()`` method of a tensym result gives math-mode content (as
``sympy.latex`` does): place it inside ``\\[ ... \\]`` or an ``equation``
environment of a document that loads amsmath; ``latex(standalone=True)`` gives
a complete document that pdflatex compiles as it is.

Examples
--------
>>> from tensym.output import render, FORMATS
>>> FORMATS
('text', 'latex', 'markdown', 'json')
"""

from tensym.output.dispatch import FORMATS, Captioned, as_record, register_renderer, render
from tensym.output.document import latex_document
from tensym.output.table import Table
from tensym import display as _display

_display.install(render)  # the core's results render through this hook, never by importing output

__all__ = ["render", "latex_document", "as_record", "register_renderer", "FORMATS", "Table", "Captioned"]
