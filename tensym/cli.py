"""The ``tensym`` command line (also ``python -m tensym``).

Subcommands print tensym results in the format asked for with ``--format``
(``text``, ``latex``, ``markdown``, ``json``; ``--standalone`` makes the LaTeX a
complete document).  ``--output FILE`` (``-o``) writes to a file instead of
standard output: the file is written whole or not at all (a temporary file in
the same folder, renamed when complete), and an existing file is replaced only
with ``--force``.  Warnings raised while a command runs (a numeric overflow,
say) are printed once each as one line, ``tensym COMMAND: warning: ...``.

Exit status
-----------
0
    Done; for ``check``, the data are consistent with the group.
2
    Bad input or usage (also a file that cannot be read or written, a number
    out of range, input too large or too deeply nested, a numerical failure
    on extreme data): one line on standard error that says what was wrong and
    what is accepted, never a traceback.  Long inputs are cut to 40
    characters and '...' in messages.
3
    ``check`` found the data inconsistent with the group, or ``identify``
    found no class within the tolerance; the report is printed as usual, so
    that scripts can act on the status (``tensym check c.csv m-3m || ...``).
    ``frame`` has no verdict: it always reports the best rotation and its
    residual.
70
    Internal error (an exception tensym did not expect, i.e. a bug): one line
    with the exception type and message and a request to report it; set the
    environment variable ``TENSYM_TRACEBACK=1`` to see the traceback.
130
    Interrupted (Ctrl-C).

Run ``tensym --help`` or ``tensym COMMAND --help`` for the details and examples.

Examples
--------
>>> from tensym.cli import main
>>> main(["form", "6mm", "pyroelectric"])
pyroelectric coefficients p_i
point group 6mm (C6v), setting: 6-fold along z, mirror normals x and y (and their 60-degree images)
1 independent: p3
<BLANKLINE>
      1
  1   .
  2   .
  3  p3
0
"""

import argparse
import os
import re
import sys
import warnings

from tensym.errors import TensymError

__all__ = ["main", "build_parser", "TOUR_GROUPS", "TOUR_PROPERTIES", "EXIT_OK", "EXIT_BAD_INPUT",
           "EXIT_INCONSISTENT", "EXIT_INTERNAL", "EXIT_INTERRUPTED", "MAX_UP_TO"]

#: Groups of ``tensym tour``: a poled ceramic, the quartz class, the lithium
#: niobate class, a tetragonal perovskite class and a cubic piezoelectric class.
TOUR_GROUPS = ("6mm", "32", "3m", "4mm", "-43m")
#: Properties of ``tensym tour``.
TOUR_PROPERTIES = ("elastic_stiffness", "piezoelectric_d")

_FORMATS = ("text", "latex", "markdown", "json")

#: Largest ``--up-to`` weight of ``characters`` and ``correlate`` for continuous groups
#: (101 irreps of O(3) up to l = 50 are already a long table; a larger weight is refused).
MAX_UP_TO = 50
_DEFAULT_UP_TO = 4


def _up_to(text):
    """argparse type of --up-to: a whole number from 0 to MAX_UP_TO."""
    try:
        n = int(text.strip())
    except ValueError:
        raise argparse.ArgumentTypeError(f"must be a whole number from 0 to {MAX_UP_TO}, got {_cut(text)!r}") from None
    if not 0 <= n <= MAX_UP_TO:
        raise argparse.ArgumentTypeError(f"must be from 0 to {MAX_UP_TO} (weights of the irreps shown), got {n}"
                                         if abs(n) < 10**12 else f"must be from 0 to {MAX_UP_TO}, got {_cut(text)}")
    return n

_MAIN_HELP = """\
Exact symmetry algebra of crystal property tensors: reduced forms in any point
group, character tables and decompositions, and checks of tensor data.
Run 'tensym COMMAND --help' for the options and examples of a command.
"""

_MAIN_EPILOG = """\
examples:
  tensym tour
  tensym groups --which settings
  tensym form 6mm piezoelectric_d elastic_stiffness
  tensym form 4/m --rank 2 --sym=-ji --axial
  tensym form 32 elastic_compliance --format latex --standalone -o s32.tex

exit status:
  0    done (check: the data are consistent with the group)
  2    bad input or usage: one line on stderr says what and what is accepted
  3    check: the data are inconsistent; identify: no class fits (the report is printed)
  70   internal error: one line naming it; please report it (TENSYM_TRACEBACK=1 shows the traceback)
  130  interrupted
"""


class _Parser(argparse.ArgumentParser):
    """An ArgumentParser whose errors are one line on stderr and exit status 2.

    Subcommand parsers read options and positionals in any order
    (``tensym split 6mm --harmonic 2 elastic_stiffness``).
    """

    intermixed = True
    _inside = False

    def parse_known_args(self, args=None, namespace=None):
        if self.intermixed and not self._inside:
            self._inside = True
            try:
                return self.parse_known_intermixed_args(args, namespace)
            finally:
                self._inside = False
        return super().parse_known_args(args, namespace)

    def error(self, message):
        _say(self.prog, f"{message} (see '{self.prog} --help')")
        self.exit(2)


class _MainParser(_Parser):
    """The top parser: its help lists the commands in one column, then the examples."""

    intermixed = False
    commands = ()

    def format_help(self):
        lines = [self.format_usage().rstrip(), "", self.description.rstrip(), "", "commands:"]
        width = max(len(n) for n, _ in self.commands)
        lines += [f"  {n.ljust(width)}  {h}" for n, h in self.commands]
        lines += ["", "options:", "  -h, --help  show this help and exit", "", self.epilog.rstrip()]
        return "\n".join(lines) + "\n"


def _add_format(p, *, latex=True):
    fmts = _FORMATS if latex else ("text", "markdown", "json")
    p.add_argument("--format", "-f", default="text", choices=fmts, metavar="FORMAT",
                   help="output format: " + ", ".join(fmts) + " (default: text)")
    if latex:
        p.add_argument("--standalone", action="store_true",
                       help="with --format latex: print a complete LaTeX document instead of math-mode content")
    p.add_argument("--output", "-o", metavar="FILE",
                   help="write to FILE instead of standard output (never a partial file; an existing FILE "
                        "needs --force)")
    p.add_argument("--force", action="store_true", help="with --output: replace FILE if it exists")


# --- rendering ---------------------------------------------------------------------
def _emit(results, args, *, title=None):
    """Text of a list of results in the chosen format."""
    from tensym.output import as_record, latex_document, render

    fmt = args.format
    if getattr(args, "standalone", False) and fmt != "latex":
        raise _UsageError("--standalone needs --format latex")
    if fmt == "json":
        import json

        recs = [as_record(r) for r in results]
        return json.dumps(recs if len(recs) != 1 or getattr(args, "_json_list", False) else recs[0],
                          indent=2, ensure_ascii=False)
    if fmt == "latex" and getattr(args, "standalone", False):
        return latex_document(results, title=title).rstrip("\n")
    texts = [render(r, format=fmt) for r in results]
    if fmt != "text":
        return "\n\n".join(texts)
    out = texts[:1]
    for prev, t in zip(texts, texts[1:]):  # one-line results stay together; blocks get blank lines
        out.append(("\n" if "\n" not in prev and "\n" not in t else "\n\n\n") + t)
    return "".join(out)


class _UsageError(Exception):
    """A combination of options that argparse cannot check by itself."""


# --- commands -------------------------------------------------------------------------
def _cmd_tour(args):
    from tensym.groups import point_group
    from tensym.tensors import tensor_form

    groups = [g.strip() for g in args.groups] if args.groups else list(TOUR_GROUPS)
    forms = [tensor_form(p, point_group(g)) for g in groups for p in TOUR_PROPERTIES]
    return _emit(forms, args, title="Reduced elastic and piezoelectric forms")


def _cmd_groups(args):
    from tensym.output.listings import group_table

    if not args.symbols:
        return _emit([group_table(which=args.which)], args)
    from tensym.output.listings import operations_table

    return _emit([operations_table(s.strip()) for s in args.symbols], args)


def _cmd_properties(args):
    from tensym.output.listings import property_table

    return _emit([property_table()], args)


def _group_lists():
    from tensym.output.listings import GROUP_LISTS

    try:
        import tensym.groups.magnetic  # noqa: F401 - the magnetic list exists only with that module
    except ImportError:  # pragma: no cover
        return tuple(w for w in GROUP_LISTS if w != "magnetic")
    return GROUP_LISTS


def _split_syms(values):
    out = []
    for v in values or ():
        out.extend(x.strip() for x in v.split(",") if x.strip())
    return out


def _cmd_form(args):
    from tensym.groups import point_group
    from tensym.tensors import TensorSpec, tensor_form

    group = point_group(args.group.strip())
    whats = list(args.properties)
    spec = _spec_from(args)
    if spec is not None:
        whats.append(spec)
    if not whats:
        raise _UsageError("name at least one property ('tensym properties' lists them) or give --rank")
    forms = []
    for w in whats:
        letter = args.letter if isinstance(w, TensorSpec) else None
        forms.append(tensor_form(w, group, symbol=letter))
    args._json_list = True
    return _emit(forms, args)


# --- parser ---------------------------------------------------------------------------------
def build_parser():
    """The argparse parser of the ``tensym`` command.

    Returns
    -------
    argparse.ArgumentParser
        Its subparsers set ``handler`` (a function of the parsed arguments
        returning the text to print).

    Examples
    --------
    >>> p = build_parser()
    >>> args = p.parse_args(["form", "6mm", "elastic_stiffness", "--format", "json"])
    >>> args.group, args.properties, args.format
    ('6mm', ['elastic_stiffness'], 'json')
    """
    parser = _MainParser(
        prog="tensym",
        description=_MAIN_HELP,
        epilog=_MAIN_EPILOG,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    sub = parser.add_subparsers(dest="command", metavar="COMMAND", parser_class=_Parser)
    raw = argparse.RawDescriptionHelpFormatter

    p = sub.add_parser("tour", help="reduced elastic and piezoelectric forms for a few groups",
                       formatter_class=raw,
                       description="Print the reduced elastic stiffness c_IJ and piezoelectric d_iJ of a few "
                                   "groups\n(default: " + ", ".join(TOUR_GROUPS) + ").",
                       epilog="examples:\n  tensym tour\n  tensym tour --groups 622 -6m2\n"
                              "  tensym tour --format latex --standalone > tour.tex\n")
    p.add_argument("--groups", nargs="+", metavar="GROUP", help="groups to show instead of the defaults")
    _add_format(p)
    p.set_defaults(handler=_cmd_tour)

    p = sub.add_parser("groups", help="list the named point groups, or the operations of some",
                       formatter_class=raw,
                       description="Without symbols: a table of named groups with their Schoenflies and full "
                                   "symbols,\norder, crystal system and setting.  With symbols: the operations "
                                   "of each group\nas coordinate triplets with their geometric meaning.",
                       epilog="examples:\n  tensym groups\n  tensym groups --which settings\n"
                              "  tensym groups --which continuous --format markdown\n  tensym groups --which magnetic\n"
                              "  tensym groups -3m D2d \"4'/m'm'm\"\n")
    p.add_argument("symbols", nargs="*", metavar="SYMBOL",
                   help="groups whose operations to list (Hermann-Mauguin or Schoenflies symbols)")
    p.add_argument("--which", default="crystallographic",
                   choices=_group_lists(),
                   help="which groups to list (default: the 32 classes in their default settings)")
    _add_format(p)
    p.set_defaults(handler=_cmd_groups)

    p = sub.add_parser("properties", help="list the property catalog", formatter_class=raw,
                       description="The named properties: symbol with Voigt indices, rank, intrinsic index "
                                   "symmetry,\nparity and number of components without symmetry.",
                       epilog="examples:\n  tensym properties\n  tensym properties --format json\n")
    _add_format(p)
    p.set_defaults(handler=_cmd_properties)

    p = sub.add_parser(
        "form", help="reduced form of properties, or of a tensor spec, in a group", formatter_class=raw,
        description="The symmetry-reduced form of one or more catalog properties in a group: the Voigt\n"
                    "matrix with the independent constants and the relations between components.\n"
                    "Instead of (or besides) a property, describe a tensor with --rank, --sym, --axial\n"
                    "and --time-odd.",
        epilog="examples:\n"
               "  tensym form 6mm piezoelectric_d elastic_stiffness\n"
               "  tensym form C3v second_harmonic second_harmonic_kleinman\n"
               "  tensym form 4/m --rank 2 --sym=-ji --axial --letter G\n"
               "  tensym form m-3m --rank 4 --sym jikl,ijlk,klij --format json\n"
               "  tensym form 32 elastic_compliance --format latex --standalone > s32.tex\n"
               "note: write an antisymmetry as --sym=-ji (or --sym -ji; both are read).\n")
    p.add_argument("group", metavar="GROUP", help="point-group symbol (e.g. 6mm, C6v, -4m2, inf/mm, SO(3))")
    p.add_argument("properties", nargs="*", metavar="PROPERTY", help="catalog names ('tensym properties')")
    _add_spec_options(p)
    p.add_argument("--letter", help="letter of the spec's components (default T)")
    _add_format(p)
    p.set_defaults(handler=_cmd_form)

    _add_capability_commands(sub, raw)
    parser.commands = tuple((a.dest, a.help) for a in sub._choices_actions)
    return parser


def _add_capability_commands(sub, raw):
    """Subcommands over the reps and data layers, added where those functions exist."""
    import tensym

    if hasattr(tensym, "character_table"):
        p = sub.add_parser(
            "characters", help="character table of a group", formatter_class=raw,
            description="The exact character table of a point group: classes as columns, irreps (Mulliken\n"
                        "labels) as rows.  Continuous groups give their irreps up to a weight.",
            epilog="examples:\n  tensym characters 4mm\n  tensym characters C3 --real\n"
                   "  tensym characters Dinfh --up-to 2\n  tensym characters -43m --format latex\n")
        p.add_argument("group", metavar="GROUP", help="point-group symbol")
        p.add_argument("--real", action="store_true",
                       help="combine complex-conjugate pairs into their real two-dimensional forms")
        p.add_argument("--up-to", type=_up_to, default=None, metavar="N",
                       help=f"continuous groups: show irreps up to this weight, 0 to {MAX_UP_TO} (default 4)")
        _add_format(p)
        p.set_defaults(handler=_cmd_characters)
    if hasattr(tensym, "decompose"):
        p = sub.add_parser(
            "split", help="decomposition of property tensors, harmonics or polynomials into irreps",
            formatter_class=raw,
            description="How a space splits into the irreps of a group: catalog properties, a tensor spec\n"
                        "(--rank, --sym, --axial, --time-odd), the 2l+1 harmonics of angular momentum l\n"
                        "(--harmonic), or the polynomials of a degree (--degree).  --basis adds the\n"
                        "symmetry-adapted functions (harmonics and polynomials).",
            epilog="examples:\n  tensym split m-3m elastic_stiffness piezoelectric_d\n"
                   "  tensym split -3m --harmonic 2 --basis\n  tensym split O(3) --degree 3\n"
                   "  tensym split 6mm --rank 2 --sym=-ji --axial --format json\n")
        p.add_argument("group", metavar="GROUP", help="point-group symbol")
        p.add_argument("properties", nargs="*", metavar="PROPERTY", help="catalog names ('tensym properties')")
        p.add_argument("--harmonic", type=int, metavar="L", help="the real spherical harmonics of degree l")
        p.add_argument("--parity", choices=("g", "u"),
                       help="with --harmonic: parity under inversion (default (-1)^l, as for orbitals)")
        p.add_argument("--degree", type=int, metavar="N", help="homogeneous polynomials in x, y, z of degree N")
        _add_spec_options(p)
        p.add_argument("--basis", action="store_true",
                       help="also give the symmetry-adapted functions (with --harmonic or --degree)")
        p.add_argument("--complex", action="store_true",
                       help="keep complex-conjugate irrep pairs apart (default: their real forms)")
        _add_format(p)
        p.set_defaults(handler=_cmd_split)
    if hasattr(tensym, "correlate"):
        p = sub.add_parser(
            "correlate", help="how the irreps of a group split in a subgroup", formatter_class=raw,
            description="The correlation table from a group to a subgroup: each irrep of the group\n"
                        "decomposed into irreps of the subgroup (in the subgroup's own setting).",
            epilog="examples:\n  tensym correlate m-3m 4/mmm\n  tensym correlate O(3) -3m --up-to 3\n")
        p.add_argument("group", metavar="GROUP", help="the group")
        p.add_argument("subgroup", metavar="SUBGROUP", help="a subgroup (symbol)")
        p.add_argument("--up-to", type=_up_to, default=None, metavar="N",
                       help=f"continuous groups: irreps up to this weight, 0 to {MAX_UP_TO} (default 4)")
        _add_format(p)
        p.set_defaults(handler=_cmd_correlate)
    if hasattr(tensym, "check_tensor") and hasattr(tensym, "read_tensor"):
        data_note = ("data files: CSV (the Voigt matrix, or 'component,value[,uncertainty]' lines; '# property:'\n"
                     "and '# units:' comments) or JSON; see tensym.read_tensor.\n")
        p = sub.add_parser(
            "check", help="check a tensor data file against a group", formatter_class=raw,
            description="Fit the symmetric form of a group to measured or computed tensor data: constants,\n"
                        "forbidden components, broken relations, residual and a verdict.\n" + data_note,
            epilog="examples:\n  tensym check stiffness.csv m-3m\n"
                   "  tensym check d.json 6mm --tol 0.05 --format markdown\n"
                   "  tensym check c.csv 6/mmm --property elastic_stiffness --units GPa\n"
                   "  tensym check c.csv m-3m -o report.md --format markdown || echo \"not cubic\"\n"
                   "exit status: 0 consistent, 3 inconsistent (the report is printed either way), 2 bad input.\n")
        p.add_argument("file", metavar="FILE", help="data file (.csv or .json)")
        p.add_argument("group", metavar="GROUP", help="point-group symbol")
        _add_data_options(p)
        p.add_argument("--tol-kind", choices=("relative", "absolute"), default="relative",
                       help="tol bounds the relative Frobenius residual (default) or the largest deviation "
                            "in data units")
        p.add_argument("--alpha", type=float, default=0.05,
                       help="significance level of the chi-square test, with uncertainties (default 0.05)")
        _add_format(p)
        p.set_defaults(handler=_cmd_check)
    if hasattr(tensym, "orient"):
        p = sub.add_parser(
            "frame", help="rotation that brings tensor data into a group's standard setting",
            formatter_class=raw,
            description="Search all rotations for the one that brings the data closest to the symmetric\n"
                        "form of the group in its standard setting.\n",
            epilog="examples:\n  tensym frame stiffness.csv m-3m\n  tensym frame c.json 6/mmm --format json\n"
                   "exit status: 0 with the best rotation and its residual (no verdict: judge the residual, or\n"
                   "run 'tensym check' on the rotated data), 2 bad input.\n")
        p.add_argument("file", metavar="FILE", help="data file (.csv or .json)")
        p.add_argument("group", metavar="GROUP", help="point-group symbol")
        p.add_argument("--property", metavar="NAME", help="property of the data, if the file does not say")
        p.add_argument("--units", metavar="UNITS", help="unit label of the data, if the file does not say")
        _add_format(p)
        p.set_defaults(handler=_cmd_frame)
    if hasattr(tensym, "find_symmetry"):
        p = sub.add_parser(
            "identify", help="highest symmetry a tensor data file shows, in any frame", formatter_class=raw,
            description="Try every symmetry class of the property, each in its best orientation, and list\n"
                        "those within the tolerance, highest symmetry first.\n",
            epilog="examples:\n  tensym identify stiffness.csv\n  tensym identify eps.csv --tol 0.002\n"
                   "exit status: 0 when a class fits within the tolerance, 3 when none does, 2 bad input.\n")
        p.add_argument("file", metavar="FILE", help="data file (.csv or .json)")
        p.add_argument("--property", metavar="NAME", help="property of the data, if the file does not say")
        p.add_argument("--units", metavar="UNITS", help="unit label of the data, if the file does not say")
        p.add_argument("--tol", type=float, default=0.01,
                       help="relative tolerance on the Frobenius residual fraction (default 0.01)")
        _add_format(p)
        p.set_defaults(handler=_cmd_identify)


def _add_spec_options(p):
    p.add_argument("--rank", type=int, help="rank of a tensor given by its spec")
    p.add_argument("--sym", action="append", metavar="PERM",
                   help="an index order the tensor equals, e.g. ji or jikl; a leading '-' for antisymmetry; "
                        "repeat or separate by commas")
    p.add_argument("--axial", action="store_true", help="the spec is axial (transforms with det(R) R)")
    p.add_argument("--time-odd", action="store_true", help="the spec changes sign under time reversal")


def _add_data_options(p):
    p.add_argument("--property", metavar="NAME", help="property of the data, if the file does not say")
    p.add_argument("--units", metavar="UNITS", help="unit label of the data, if the file does not say")
    p.add_argument("--tol", type=float, default=0.01,
                   help="tolerance of the verdict (default 0.01, relative)")


def _spec_from(args):
    from tensym.tensors import TensorSpec

    flags = args.sym or args.axial or args.time_odd or getattr(args, "letter", None)
    if args.rank is None and flags:
        raise _UsageError("--sym, --axial, --time-odd and --letter describe a spec: give --rank too")
    if args.rank is None:
        return None
    return TensorSpec(args.rank, _split_syms(args.sym), axial=args.axial, time_odd=args.time_odd)


def _cmd_characters(args):
    import tensym

    group = tensym.point_group(args.group.strip())
    _finite_up_to(args, group)
    table = (tensym.character_table(group, up_to=_DEFAULT_UP_TO if args.up_to is None else args.up_to)
             if group.is_continuous else tensym.character_table(group))
    if args.real and not group.is_continuous:
        from tensym.output.results import _RealView

        return _emit([_RealView(table)], args)
    return _emit([table], args)


def _cmd_split(args):
    import tensym
    from tensym.output.forms import spec_words

    group = tensym.point_group(args.group.strip())
    spaces = []
    for name in args.properties:
        spaces.append((tensym.get_property(name).title, name))
    spec = _spec_from(args)
    if spec is not None:
        spaces.append((spec_words(spec), spec.as_space()))
    if args.parity and args.harmonic is None:
        raise _UsageError("--parity goes with --harmonic")
    functions = []
    if args.harmonic is not None:
        parity = args.parity
        h = tensym.harmonics(args.harmonic, parity) if parity else tensym.harmonics(args.harmonic)
        spaces.append((f"harmonics of degree l = {args.harmonic}" + (f" ({parity})" if parity else ""), h))
        functions.append(h)
    if args.degree is not None:
        q = tensym.polynomials(args.degree)
        spaces.append((f"polynomials of degree {args.degree}", q))
        functions.append(q)
    if not spaces:
        raise _UsageError("name a property, or give --rank, --harmonic or --degree")
    if args.basis and not functions:
        raise _UsageError("--basis needs --harmonic or --degree")
    real = not args.complex
    from tensym.output import Captioned

    results = [Captioned(label, tensym.decompose(space, group, real=real)) for label, space in spaces]
    if args.basis:  # a basis names its space itself
        results += [tensym.symmetry_adapted(f, group, real=real) for f in functions]
    args._json_list = True
    return _emit(results, args, title=f"Decompositions in {group.symbol or args.group}")


def _cmd_correlate(args):
    import tensym

    group = tensym.point_group(args.group.strip())
    _finite_up_to(args, group)
    up_to = _DEFAULT_UP_TO if args.up_to is None else args.up_to
    return _emit([tensym.correlate(group, args.subgroup.strip(), up_to=up_to)], args)


def _finite_up_to(args, group):
    if args.up_to is not None and not group.is_continuous:
        raise _UsageError(f"--up-to goes with a continuous group (such as SO(3), O(3), Cinfv, Dinfh); "
                          f"{_cut(args.group.strip())} is finite and shows all its irreps")


def _read(args):
    import tensym

    return tensym.read_tensor(args.file, args.property, units=args.units)


def _cmd_check(args):
    import tensym

    data = _read(args)
    report = tensym.check_tensor(data, group=tensym.point_group(args.group.strip()), tol=args.tol,
                                 tol_kind=args.tol_kind, alpha=args.alpha)
    if not report.passes:
        args._status = EXIT_INCONSISTENT
    return _emit([report], args)


def _cmd_frame(args):
    import tensym

    data = _read(args)
    return _emit([tensym.orient(data, group=tensym.point_group(args.group.strip()))], args)


def _cmd_identify(args):
    import tensym

    data = _read(args)
    found = tensym.find_symmetry(data, tol=args.tol)
    if found.best is None:
        args._status = EXIT_INCONSISTENT
    return _emit([found], args)


def _cut(text, n=40):
    """``text`` cut to ``n`` characters and '...' (user input echoed in messages)."""
    text = str(text)
    return text if len(text) <= n else text[:n] + "..."


def _cut_path(path, n=40):
    """A file name for messages: long paths keep their last ``n`` characters."""
    path = str(path)
    return path if len(path) <= n else "..." + path[-n:]


_DASH_DIGIT = re.compile(r"^-[0-9]")


def _protect_dashes(argv):
    """Let values that begin with '-' through argparse, which would take them for options.

    ``--sym -ji`` becomes ``--sym=-ji``; a group symbol such as ``-42m`` or
    ``-3m`` gets a leading blank (argparse reads a word with a blank as a
    value; the handlers strip it).
    """
    out = []
    i = 0
    while i < len(argv):
        a = argv[i]
        if a == "--sym" and i + 1 < len(argv) and argv[i + 1].startswith("-") and not argv[i + 1].startswith("--"):
            out.append(f"--sym={argv[i + 1]}")
            i += 2
            continue
        out.append(" " + a if _DASH_DIGIT.match(a) else a)
        i += 1
    return out


#: Exit statuses of the command line (see the module notes).
EXIT_OK, EXIT_BAD_INPUT, EXIT_INCONSISTENT, EXIT_INTERNAL, EXIT_INTERRUPTED = 0, 2, 3, 70, 130

#: Known failures of bad or extreme input that escape as builtin exceptions: (class, what the user is told).
_INPUT_FAILURES = (
    (UnicodeError, "text that is not valid in its encoding"),
    (OverflowError, "a number too large to compute with"),
    (RecursionError, "input nested too deeply or too large to process"),
    (MemoryError, "not enough memory for this request (try a smaller rank, degree or --up-to)"),
)


def _input_failure(exc):
    """The user's explanation of a known builtin failure of bad input, or None."""
    for cls, what in _INPUT_FAILURES:
        if isinstance(exc, cls):
            return what
    if type(exc).__name__ == "LinAlgError":  # numpy.linalg.LinAlgError, without importing numpy here
        return "a numerical failure (the data may be extreme in magnitude or ill-conditioned)"
    return None


_LONG_WORD = re.compile(r"\S{61,}")  # the library cuts echoed input to 40 + '...'; this is the net


def _tidy(message):
    """One line; a word (a run without blanks) over 60 characters cut to 40 characters and '...'."""
    text = " ".join(str(message).split("\n")).strip()
    text = _LONG_WORD.sub(lambda m: m.group(0)[:40] + "...", text)
    return text if len(text) <= 600 else text[:600] + "..."


def _say(prog, message):
    """Print ``prog: message`` as one line on stderr, whatever the terminal's encoding."""
    line = f"{prog}: {_tidy(message)}\n"
    try:
        sys.stderr.write(line)
    except UnicodeEncodeError:
        enc = getattr(sys.stderr, "encoding", None) or "ascii"
        sys.stderr.write(line.encode(enc, "backslashreplace").decode(enc))
    sys.stderr.flush()


def main(argv=None):
    """Run the ``tensym`` command line; return the exit status.

    Parameters
    ----------
    argv : list of str, optional
        The arguments after the program name (default: ``sys.argv[1:]``).

    Returns
    -------
    int
        0 on success; 2 on bad input (one line on stderr, no traceback);
        3 when ``tensym check`` finds the data inconsistent with the group
        (the report is printed as usual); 70 for an internal error (one line
        naming the exception, asking for a report; ``TENSYM_TRACEBACK=1``
        prints the traceback); 130 when interrupted.

    Examples
    --------
    >>> main(["form", "6mmm", "pyroelectric"])
    2
    """
    argv = list(sys.argv[1:] if argv is None else argv)
    try:
        return _main(argv)
    except KeyboardInterrupt:
        _say("tensym", "interrupted")
        return EXIT_INTERRUPTED


def _main(argv):
    parser = build_parser()
    if not argv:
        parser.print_help()
        return EXIT_OK
    try:
        args = parser.parse_args(_protect_dashes(argv))
    except SystemExit as exc:  # argparse: --help (0) or a usage error (2)
        return int(exc.code or 0)
    if args.command is None:
        parser.print_help()
        return EXIT_OK
    prog = f"tensym {args.command}"
    out_path = getattr(args, "output", None)
    if out_path == "-":
        out_path = None
    if getattr(args, "force", False) and out_path is None:
        _say(prog, f"--force goes with --output FILE (see '{prog} --help')")
        return EXIT_BAD_INPUT
    if out_path is not None and not args.force and os.path.lexists(out_path):
        _say(prog, f"{_cut_path(out_path)} exists already; add --force to replace it")
        return EXIT_BAD_INPUT
    try:
        with warnings.catch_warnings():
            seen = set()

            def one_line_warning(message, category, *_args, **_kw):  # no source lines from deep inside
                text = f"warning: {message} ({category.__name__})"
                if text not in seen:
                    seen.add(text)
                    _say(prog, text)

            warnings.showwarning = one_line_warning
            text = args.handler(args)
    except TensymError as exc:
        _say(prog, exc)
        return EXIT_BAD_INPUT
    except _UsageError as exc:
        _say(prog, f"{exc} (see '{prog} --help')")
        return EXIT_BAD_INPUT
    except OSError as exc:
        _say(prog, f"{exc.strerror or exc}: {_cut_path(exc.filename)}" if exc.filename else exc)
        return EXIT_BAD_INPUT
    except Exception as exc:  # noqa: BLE001 - sorted below: known input failures, or a bug to report
        what = _input_failure(exc)
        if what is not None:
            _say(prog, f"{what} ({type(exc).__name__}: {exc})")
            return EXIT_BAD_INPUT
        if os.environ.get("TENSYM_TRACEBACK"):
            raise
        _say(prog, f"internal error, {type(exc).__name__}: {exc}; this is a bug in tensym: please report it "
                   "with the command line (TENSYM_TRACEBACK=1 shows the traceback)")
        return EXIT_INTERNAL
    status = getattr(args, "_status", EXIT_OK)
    if out_path is not None:
        from tensym.data.io import write_text_atomic

        try:
            write_text_atomic(out_path, text + "\n", overwrite=args.force)
        except TensymError:  # the file appeared while the command ran
            _say(prog, f"{_cut_path(out_path)} exists already; add --force to replace it")
            return EXIT_BAD_INPUT
        except OSError as exc:
            _say(prog, f"cannot write {_cut_path(out_path)}: {exc.strerror or exc}")
            return EXIT_BAD_INPUT
        return status
    try:
        sys.stdout.write(text + "\n")
        sys.stdout.flush()
    except BrokenPipeError:  # e.g. piped into head
        return status
    except UnicodeEncodeError as exc:
        bad = exc.object[exc.start:exc.end]
        _say(prog, f"standard output cannot show {bad!r} (encoding {exc.encoding}); set PYTHONIOENCODING=utf-8 "
                   "or write to a file with --output FILE")
        return EXIT_BAD_INPUT
    return status


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
