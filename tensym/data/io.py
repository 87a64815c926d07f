"""Tensor data files: :func:`read_tensor` and :func:`write_tensor` (CSV and JSON formats of tensym).

CSV, matrix form
----------------
The Voigt array as rows of numbers (6 rows of 6 for a stiffness, 3 rows of 6
for d, 3 rows of 3 for a rank-2 property), separated by commas, semicolons,
tabs or spaces.  Lines starting with ``#`` are comments; ``# key: value``
comments set metadata (keys ``property``, ``units``, ``source``).  A comment
line ``# uncertainty`` starts a second block of the same shape with the
standard uncertainties::

    # property: elastic_stiffness
    # units: GPa
    166, 64, 64, 0, 0, 0
    ...
    # uncertainty
    1, 1, 1, 1, 1, 1
    ...

CSV, long form
--------------
A header line ``component,value`` or ``component,value,uncertainty``, then one
component per line.  A component is its Voigt label, with or without the
property's letter (``c11``, ``11``, ``d31``, ``123`` for C_123), or its
Cartesian indices, 1-based, one digit per index (``1111``, ``2323``,
``311``); a Voigt label has one digit per Voigt group, Cartesian indices one
per tensor index, so the two cannot be confused.  Entries that the index
symmetry makes equal may be listed several times (``c12`` and ``c21``) and must
agree.

Partial data: a component the file does not list is *unknown*, never zero.
The reader gives it the value NaN (and NaN uncertainty), the marker of an
unknown component in :class:`tensym.TensorData`; where the data layer does not
take unknown components, reading stops with an error that lists the missing
ones.  To say that a component is zero, list it with the value 0
(``c14,0``; in JSON ``"c14": 0``).  The same holds for a JSON ``values``
object of components.

JSON
----
One object (keys in any order)::

    {"format": "tensym-data/1",
     "property": "piezoelectric_d",
     "units": "pC/N",
     "layout": "voigt",                    # or "full" or "components" (optional: told by shape)
     "values": [[...], [...], [...]],      # or {"d15": 68.0, "d22": 21.0, ...} for components
     "uncertainty": [[...], ...],          # optional, same shape (or a dict of components)
     "covariance": {"labels": ["d15", ...], "matrix": [[...]]},   # optional instead
     "source": "..."}                       # optional

``covariance`` lists the labels of its rows and columns, in any order; they
must be every distinct component exactly once (see ``tensym.component_labels``).
Numbers are JSON numbers: ``true``/``false``, ``null``, strings (``"2"``) and
the non-standard ``NaN``/``Infinity`` are refused with their position
(``values[0][2]``, ``values['c11']``), as are numbers beyond the 64-bit float
range (``1e999``, a 400-digit integer), a key given twice in one object (JSON
readers would silently keep the last) and absurdly deep nesting.

Text and numbers (both formats)
-------------------------------
Files are UTF-8; a leading byte-order mark (as spreadsheet programs write) is
ignored, and a file in another encoding is refused with the line of its first
non-UTF-8 byte.  The decimal separator is the point: a decimal comma (``1,5``
in a file separated by semicolons, tabs or blanks, or quoted in a long-form
line) is refused with a message that says so.  A metadata key given twice with
different values (two ``# property:`` lines) is refused, naming both lines.
Every error is a :class:`tensym.errors.DataError` whose message starts with the
file name (and the line, where there is one); echoed input is cut to 40
characters.

Writing
-------
:func:`write_tensor` writes the whole file or nothing: the text goes to a
temporary file in the same folder, is synced to disk and renamed onto the
target (:func:`write_text_atomic`).

Examples
--------
>>> import os, tempfile
>>> import numpy as np
>>> from tensym.data.dataset import tensor_data
>>> d = tensor_data(np.diag([2.0, 2.0, 3.0]), "dielectric_permittivity", units="1")
>>> path = os.path.join(tempfile.mkdtemp(), "eps.csv")
>>> write_tensor(d, path)
>>> print(open(path).read().strip())
# tensym data: dielectric_permittivity
# property: dielectric_permittivity
# units: 1
2, 0, 0
0, 2, 0
0, 0, 3
>>> read_tensor(path).voigt.tolist()
[[2.0, 0.0, 0.0], [0.0, 2.0, 0.0], [0.0, 0.0, 3.0]]
"""

import csv
import errno
import json
import os
import re

import numpy as np

from tensym.data.dataset import LAYOUTS, TensorData, tensor_data
from tensym.data.model import layout as _layout
from tensym.errors import DataError, InvalidOptionError, UnknownPropertyError
from tensym.tensors.form import as_property

__all__ = ["read_tensor", "write_tensor", "write_text_atomic", "data_record", "FORMAT_TAG", "FILE_FORMATS"]

#: The value of the "format" key of tensym's JSON data files.
FORMAT_TAG = "tensym-data/1"
#: Accepted values of the ``format`` option.
FILE_FORMATS = ("auto", "csv", "json")
_SPLIT = re.compile(r"[,;\t ]+")
_META_KEYS = ("property", "units", "source")
_UNC_WORDS = ("uncertainty", "uncertainties", "sigma", "standard uncertainty", "standard uncertainties")


def _cut(text, n=40):
    """``text`` cut to ``n`` characters and '...' (for echoing user input in messages)."""
    text = str(text)
    return text if len(text) <= n else text[:n] + "..."


def _cut_path(path, n=40):
    """A path for messages: a long one keeps its last ``n`` characters (the file name)."""
    path = str(path)
    return path if len(path) <= n else "..." + path[-n:]


def _fmt(v):
    return repr(float(v)) if float(v) != int(v) or abs(v) >= 1e15 else str(int(v))


def data_record(data):
    """The JSON-ready dict of a TensorData in the tensym data format."""
    lay = data.layout
    known = ~np.isnan(np.asarray(data.components, dtype=np.float64))
    if not known.all():  # partial data: an object of the known components (unknown ones left out)
        rec = {"format": FORMAT_TAG, "property": data.property.name, "units": data.units, "layout": "components",
               "values": {lab: float(v) for lab, v, k in zip(lay.labels, data.components, known) if k}}
        if data.covariance is not None:
            cov = np.asarray(data.covariance)
            if np.count_nonzero(np.nan_to_num(cov - np.diag(np.diag(cov)))):
                raise DataError("partial data with a full covariance cannot be written: the covariance "
                                "needs every component")
            rec["uncertainty"] = {lab: float(v) for lab, v, k in zip(lay.labels, data.sigma, known) if k}
        rec["source"] = data.source
        return rec
    rec = {"format": FORMAT_TAG, "property": data.property.name, "units": data.units, "layout": "voigt",
           "values": data.voigt.tolist()}
    if data.covariance is not None:
        cov = np.asarray(data.covariance)
        if np.count_nonzero(cov - np.diag(np.diag(cov))) == 0:
            rec["uncertainty"] = data.sigma_voigt.tolist()
        else:
            rec["covariance"] = {"labels": list(lay.labels), "matrix": cov.tolist()}
    rec["source"] = data.source
    return rec


def write_tensor(data, path, *, format="auto", overwrite=True):
    """Write a TensorData to a CSV or JSON file in tensym's formats (see the module notes).

    Parameters
    ----------
    data : TensorData
    path : str or os.PathLike
    format : {'auto', 'csv', 'json'}
        'auto' follows the extension ('.json' is JSON, anything else CSV).
    overwrite : bool, keyword-only
        Replace an existing file (default True); with False an existing file is an error.

    Notes
    -----
    The write is atomic (see :func:`write_text_atomic`): a failed write (disk
    full, no permission) leaves the old file, if any, untouched and no partial
    or temporary file behind.

    Raises
    ------
    DataError
        If ``data`` is not a TensorData, a full covariance is to go to CSV, or
        the file exists and ``overwrite`` is False.
    InvalidOptionError
        For a format outside the set, or an ``overwrite`` that is not a bool.
    OSError
        If the file cannot be written (its ``filename`` is ``path``).

    Examples
    --------
    >>> import os, tempfile
    >>> import numpy as np
    >>> d = tensor_data(np.array([0.0, 0.0, -4.5]), "pyroelectric", units="uC/(m^2 K)")
    >>> path = os.path.join(tempfile.mkdtemp(), "p.json")
    >>> write_tensor(d, path)
    >>> json.load(open(path))["values"]
    [0.0, 0.0, -4.5]
    """
    if not isinstance(data, TensorData):
        raise DataError(f"write_tensor needs a TensorData (tensym.tensor_data), got {type(data).__name__}")
    fmt = _format_of(path, format)
    if fmt == "json":
        text = json.dumps(data_record(data), indent=2) + "\n"
    else:
        text = _csv_text(data)
    write_text_atomic(path, text, overwrite=overwrite)


def write_text_atomic(path, text, *, overwrite=True):
    """Write ``text`` (UTF-8) to ``path`` so that the file is either the old one or the whole new one.

    The text goes to a temporary file in the same folder (``.NAME.XXXXXXXX.tmp``),
    which is flushed and synced to disk, then renamed onto ``path`` in one step
    (``os.replace``; with ``overwrite=False``, ``os.link``, which fails when
    ``path`` exists).  A failure at any point (disk full, permissions, an
    interrupted write) removes the temporary file and leaves ``path`` as it was.
    A replaced file keeps its permission bits; a new one gets the usual ones
    (0666 less the umask).  A ``path`` that is a symbolic link stays a link:
    the file it points to is the one replaced.

    Parameters
    ----------
    path : str or os.PathLike
    text : str
    overwrite : bool, keyword-only
        Replace an existing file (default); with False an existing file is an error.

    Raises
    ------
    DataError
        With ``overwrite=False`` when ``path`` exists (the message says to remove
        it or allow overwriting).
    OSError
        When the folder cannot be written (its ``filename`` is ``path``, not the
        temporary file).

    Examples
    --------
    >>> import os, tempfile
    >>> path = os.path.join(tempfile.mkdtemp(), "note.txt")
    >>> write_text_atomic(path, "first" + chr(10))
    >>> write_text_atomic(path, "second" + chr(10), overwrite=False)
    Traceback (most recent call last):
    ...
    tensym.errors.DataError: note.txt exists already; remove it, or allow overwriting (overwrite=True, or --force on the command line)
    >>> open(path).read().strip(), sorted(os.listdir(os.path.dirname(path)))
    ('first', ['note.txt'])
    """
    if not isinstance(overwrite, bool):
        raise InvalidOptionError(f"overwrite must be True or False, got {_cut(repr(overwrite))}")
    target = os.fspath(path)
    shown = target
    if os.path.islink(target):  # write through a symbolic link: the link stays, its file is replaced
        target = os.path.realpath(target)
    folder = os.path.dirname(os.path.abspath(target))
    base = os.path.basename(target)
    if not overwrite and os.path.lexists(target):
        raise DataError(_exists_message(target))
    data = text.encode("utf-8")
    tmp = None
    try:
        fd, tmp = _open_temp(folder, base)
        with os.fdopen(fd, "wb") as fh:
            fh.write(data)
            fh.flush()
            os.fsync(fh.fileno())
        if os.path.exists(target):
            try:
                os.chmod(tmp, os.stat(target).st_mode & 0o7777)
            except OSError:
                pass
        if overwrite:
            os.replace(tmp, target)
        else:
            try:
                os.link(tmp, target)  # fails if the target appeared meanwhile: no file is ever clobbered
            except FileExistsError:
                raise DataError(_exists_message(target)) from None
            except OSError:  # no hard links on this file system: check, then rename
                if os.path.lexists(target):
                    raise DataError(_exists_message(target)) from None
                os.replace(tmp, target)
            else:
                os.unlink(tmp)
        tmp = None
        _sync_folder(folder)
    except OSError as exc:
        raise _retarget(exc, shown) from exc
    finally:
        if tmp is not None:
            try:
                os.unlink(tmp)
            except OSError:
                pass


def _exists_message(target):
    return (f"{_cut(os.path.basename(target))} exists already; remove it, or allow overwriting "
            "(overwrite=True, or --force on the command line)")


def _open_temp(folder, base):
    """A new file ``.BASE.XXXXXXXX.tmp`` in ``folder``, created exclusively with mode 0666 less the umask."""
    for _ in range(100):
        name = os.path.join(folder, f".{base[:80]}.{os.urandom(4).hex()}.tmp")
        try:
            return os.open(name, os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_BINARY", 0), 0o666), name
        except FileExistsError:
            continue
    raise FileExistsError(errno.EEXIST, "no free temporary name", os.path.join(folder, base))  # pragma: no cover


def _sync_folder(folder):
    """Make the rename durable where the system allows it (best effort)."""
    try:
        fd = os.open(folder, os.O_RDONLY)
    except OSError:
        return
    try:
        os.fsync(fd)
    except OSError:
        pass
    finally:
        os.close(fd)


def _retarget(exc, target):
    """The same OSError, naming the target file instead of the temporary one."""
    if exc.errno is None:
        return exc
    return type(exc)(exc.errno, exc.strerror, target)


def _csv_text(data):
    lay = data.layout
    head = [f"# tensym data: {data.property.name}", f"# property: {data.property.name}"]
    if data.units:
        head.append(f"# units: {data.units}")
    cov = None if data.covariance is None else np.asarray(data.covariance)
    if cov is not None and np.count_nonzero(np.nan_to_num(cov - np.diag(np.diag(cov)))):
        raise DataError("a full covariance cannot be written to CSV; write JSON (format='json')")
    v = data.voigt
    known = ~np.isnan(np.asarray(data.components, dtype=np.float64))
    if v.ndim <= 2 and known.all():
        mat = v.reshape(v.shape[0], -1) if v.ndim else v.reshape(1, 1)
        rows = [", ".join(_fmt(a) for a in row) for row in mat]
        if cov is not None:
            s = data.sigma_voigt.reshape(mat.shape)
            rows.append("# uncertainty")
            rows += [", ".join(_fmt(a) for a in row) for row in s]
    else:
        rows = ["component,value" + (",uncertainty" if cov is not None else "")]
        sig = data.sigma
        for c, lab in enumerate(lay.labels):
            if not known[c]:  # unknown: left out (module notes, "Partial data")
                continue
            rows.append(f"{lab},{_fmt(data.components[c])}" + (f",{_fmt(sig[c])}" if sig is not None else ""))
    return "\n".join(head + rows) + "\n"


def _format_of(path, format):
    if format not in FILE_FORMATS:
        raise InvalidOptionError(f"format={format!r} is not one of {', '.join(FILE_FORMATS)}")
    if format != "auto":
        return format
    return "json" if str(os.fspath(path)).lower().endswith(".json") else "csv"


def read_tensor(path, what=None, *, format="auto", units=None, symmetry_tol=1e-8):
    """Read tensor data from a CSV or JSON file (formats in the module notes).

    Parameters
    ----------
    path : str or os.PathLike
    what : str, Property or TensorSpec, optional
        The property; needed when the file does not name it, and must agree when it does.
    format : {'auto', 'csv', 'json'}
        'auto' follows the extension ('.json' is JSON, anything else CSV).
    units : str, optional
        Unit label; must agree with the file's when both are given.
    symmetry_tol : float
        As in :func:`tensym.tensor_data`.

    Returns
    -------
    TensorData
        With ``source`` set to the file name.

    Raises
    ------
    DataError
        For a missing or unreadable file, a file that is not UTF-8, a
        malformed line or entry (with its line number or JSON position: no
        decimal commas, JSON numbers only, within the float range), two
        metadata lines that disagree, a long-form table with no components,
        components left unknown where the data layer needs them all, a
        property or units that disagree with the file, and every check of
        :func:`tensym.tensor_data` (each message starts with the file name).
    UnknownPropertyError
        For a property name (in the file or in ``what``) not in the catalog.
    InvalidOptionError
        For a format outside the set.

    Examples
    --------
    >>> import os, tempfile
    >>> path = os.path.join(tempfile.mkdtemp(), "p.csv")
    >>> lines = ["# units: uC/(m^2 K)", "component,value", "p3,-4.5", "p1,0", "p2,0"]
    >>> _ = open(path, "w").write(chr(10).join(lines))
    >>> d = read_tensor(path, "pyroelectric")
    >>> d["p3"], d.units, d.source
    (-4.5, 'uC/(m^2 K)', 'p.csv')

    ``p1,0`` and ``p2,0`` say that those components are zero; without them
    they would be unknown (module notes, "Partial data").
    """
    fmt = _format_of(path, format)
    try:
        with open(path, "rb") as fh:
            raw = fh.read()
    except OSError as exc:
        raise DataError(f"cannot read {_cut_path(os.fspath(path))!r}: {exc.strerror or exc}") from exc
    name = _cut(os.path.basename(os.fspath(path)))
    text = _decode(raw, name)
    if not text.strip():
        raise DataError(f"{name} is empty")
    if fmt == "json":
        obj = _parse_json(text, name)
        return _from_json(obj, what, units, symmetry_tol, name)
    return _from_csv(text, what, units, symmetry_tol, name)


def _decode(raw, name):
    """The text of a UTF-8 file (a leading byte-order mark is dropped)."""
    try:
        return raw.decode("utf-8-sig")
    except UnicodeDecodeError as exc:
        line = raw.count(b"\n", 0, exc.start) + 1
        col = exc.start - (raw.rfind(b"\n", 0, exc.start) + 1) + 1
        byte = raw[exc.start:exc.start + 1].hex()
        raise DataError(f"{name}, line {line}: not UTF-8 text (byte 0x{byte} at column {col}); "
                        "save the file as UTF-8") from None


class _BadNumber:
    """A JSON number or constant that is no finite float, kept to be reported with its position."""

    def __init__(self, text, why):
        self.text, self.why = text, why


def _json_float(text):
    v = float(text)
    return _BadNumber(text, "is too large for a 64-bit float (the largest is about 1.8e308)") if np.isinf(v) else v


def _json_int(text):
    digits = len(text.lstrip("+-"))
    if digits > 309:
        return _BadNumber(text, f"is an integer of {digits} digits, too large for a 64-bit float")
    v = int(text)
    try:
        float(v)
    except OverflowError:
        return _BadNumber(text, "is too large for a 64-bit float (the largest is about 1.8e308)")
    return v


def _json_constant(text):
    return _BadNumber(text, "is not a JSON number (JSON has no NaN or Infinity; to leave a component unknown, "
                            "give the values as an object of components and leave it out)")


def _parse_json(text, name):
    try:
        return json.loads(text, parse_float=_json_float, parse_int=_json_int, parse_constant=_json_constant,
                          object_pairs_hook=lambda pairs: _json_object(pairs, name))
    except json.JSONDecodeError as exc:
        raise DataError(f"{name}: not valid JSON (line {exc.lineno}: {exc.msg})") from None
    except RecursionError:
        raise DataError(f"{name}: the JSON is nested too deeply to be tensor data (a tensym data file "
                        "nests its values at most a few levels)") from None


def _json_object(pairs, name):
    """A JSON object as a dict; a key given twice is an error (JSON parsers would keep the last silently)."""
    obj = {}
    for key, value in pairs:
        if key in obj:
            raise DataError(f"{name}: the key {_cut(key)!r} appears twice in one JSON object; keep one")
        obj[key] = value
    return obj


def _json_array(value, name, where, depth=0):
    """Nested lists of JSON numbers as nested lists of floats; anything else is an error naming its position."""
    if isinstance(value, list):
        if depth >= 8:
            raise DataError(f"{name}: {where} nests lists more than 8 deep; tensor data are at most rank 8")
        return [_json_array(v, name, f"{where}[{i}]", depth + 1) for i, v in enumerate(value)]
    return _json_number(value, name, where)


def _json_number(value, name, where):
    if isinstance(value, _BadNumber):
        raise DataError(f"{name}: {where} = {_cut(value.text)} {value.why}")
    if isinstance(value, bool):
        raise DataError(f"{name}: {where} is {str(value).lower()}, not a number")
    if value is None:
        raise DataError(f"{name}: {where} is null, not a number (to leave a component unknown, give the values "
                        "as an object of components and leave it out)")
    if isinstance(value, str):
        why = ("decimal commas are not accepted: write the decimal point, without quotes" if
               _DECIMAL_COMMA.match(value.strip()) else "write numbers without quotes")
        raise DataError(f"{name}: {where} is the string {_cut(value)!r}, not a number ({why})")
    if isinstance(value, dict):
        raise DataError(f"{name}: {where} is an object, not a number")
    return float(value)


def _merge(meta_value, arg, key, name):
    if arg is None:
        return meta_value
    if meta_value is None:
        return arg
    a = as_property(arg).name if key == "property" else arg
    if str(meta_value).strip() != str(a).strip():
        raise DataError(f"{name} gives {key} {_cut(meta_value)!r} but {_cut(a)!r} was asked for")
    return arg


_DECIMAL_COMMA = re.compile(r"^[+-]?\d*,\d+(?:[eE][+-]?\d+)?$")
_NOT_FINITE_WORDS = ("nan", "+nan", "-nan", "inf", "+inf", "-inf", "infinity", "+infinity", "-infinity")


def _decimal_comma_error(name, lineno, token):
    return DataError(f"{name}, line {lineno}: {_cut(token)!r} has a decimal comma; decimal commas are not "
                     "accepted: write the decimal point ('1.5', not '1,5')")


def _numbers(line, lineno, name):
    """The numbers of a line of the matrix form (separators: commas, semicolons, tabs, blanks)."""
    words = [w for w in re.split(r"[;\t ]+", line.strip()) if w]
    if len(words) > 1 or ";" in line or "\t" in line:  # another separator than commas: a comma is a decimal one
        for w in words:
            if _DECIMAL_COMMA.match(w):
                raise _decimal_comma_error(name, lineno, w)
    return [_number(p, lineno, name) for p in _SPLIT.split(line.strip()) if p]


def _number(token, lineno, name):
    try:
        v = float(token)
    except ValueError:
        if _DECIMAL_COMMA.match(token.strip()):
            raise _decimal_comma_error(name, lineno, token.strip()) from None
        raise DataError(f"{name}, line {lineno}: {_cut(token)!r} is not a number") from None
    if np.isinf(v) and token.strip().lower() not in _NOT_FINITE_WORDS:
        raise DataError(f"{name}, line {lineno}: {_cut(token)} is too large for a 64-bit float "
                        "(the largest is about 1.8e308)")
    return v


def _from_csv(text, what, units, tol, name):
    meta, meta_line = {}, {}
    blocks = [[]]
    header = None
    rows = []
    for lineno, raw in enumerate(text.splitlines(), 1):
        line = raw.strip()
        if not line:
            continue
        if line.startswith("#"):
            body = line.lstrip("#").strip()
            if body.lower() in _UNC_WORDS:
                blocks.append([])
                continue
            m = re.match(r"([A-Za-z_ ]+):\s*(.*)$", body)
            if m and m.group(1).strip().lower() in _META_KEYS:
                key, value = m.group(1).strip().lower(), m.group(2).strip()
                if key in meta and meta[key] != value:
                    raise DataError(f"{name}: line {meta_line[key]} gives {key} {_cut(meta[key])!r} but line "
                                    f"{lineno} gives {_cut(value)!r}; keep one of the two lines")
                meta[key] = value
                meta_line.setdefault(key, lineno)
            continue
        if header is None and not blocks[0] and _looks_like_header(line):
            header = [h.strip().lower() for h in line.split(",")]
            continue
        if header is not None:
            rows.append((lineno, line))
        else:
            blocks[-1].append((lineno, _numbers(line, lineno, name)))
    prop_arg = _merge(meta.get("property"), what, "property", name)
    if prop_arg is None:
        raise DataError(f"{name} does not say which property it holds; pass what=... (--property NAME on the "
                        "command line) or add a line '# property: NAME'")
    prop = _file_property(prop_arg, what, name)
    u = _merge(meta.get("units"), units, "units", name)
    source = meta.get("source", name)
    if header is not None:
        return _long_form(header, rows, prop, u, tol, name, source)
    if len(blocks) > 2:
        raise DataError(f"{name}: more than one '# uncertainty' block")
    values = _matrix(blocks[0], name, "values")
    sigma = _matrix(blocks[1], name, "uncertainties") if len(blocks) == 2 else None
    lay = _layout(prop)
    vs = lay.voigt_shape
    if len(vs) > 2:
        raise DataError(f"{name}: {prop.name} has Voigt shape {vs}; write it in long form "
                        "(header 'component,value') or JSON")
    if len(vs) < 2:  # a vector (one row or one column) or a scalar
        values = values.reshape(vs) if values.size == int(np.prod(vs)) else values
        if sigma is not None and sigma.size == int(np.prod(vs)):
            sigma = sigma.reshape(vs)
    return _tensor_data(name, values, prop, sigma=sigma, units=u, layout="voigt", symmetry_tol=tol, source=source)


def _looks_like_header(line):
    first = line.split(",")[0].strip().lower()
    return first in ("component", "label", "index", "indices")


def _matrix(block, name, what):
    if not block:
        raise DataError(f"{name}: no {what} found")
    widths = {len(r) for _, r in block}
    if len(widths) != 1:
        lineno = next(n for n, r in block if len(r) != len(block[0][1]))
        raise DataError(f"{name}, line {lineno}: rows of the {what} have different lengths "
                        f"({', '.join(str(w) for w in sorted(widths))} numbers)")
    return np.array([r for _, r in block], dtype=np.float64)


def _component_index(text, prop, lay):
    """(component, factor) of a component label or Cartesian index string; None if invalid."""
    t = text.strip()
    if t.startswith(prop.symbol) and t[len(prop.symbol):].isdigit():
        t = t[len(prop.symbol):]
    if not t.isdigit():
        return None
    digits = [int(ch) for ch in t]
    ngroups = len(prop.voigt_groups)
    if len(digits) == ngroups:
        dims = lay.voigt_shape
        if any(not 1 <= d <= n for d, n in zip(digits, dims)):
            return None
        flat = int(np.ravel_multi_index(tuple(d - 1 for d in digits), dims))
        c, s = int(lay.voigt_comp[flat]), int(lay.voigt_sign[flat])
        return (c, s, 1.0) if c >= 0 else ("zero", 0, 1.0)
    if len(digits) == lay.rank:
        if any(not 1 <= d <= 3 for d in digits):
            return None
        flat = int(np.ravel_multi_index(tuple(d - 1 for d in digits), (3,) * lay.rank))
        c, s = int(lay.flat_comp[flat]), int(lay.flat_sign[flat])
        return (c, s, float(lay.flat_factor[flat])) if c >= 0 else ("zero", 0, 1.0)
    return None


def _long_form(header, rows, prop, units, tol, name, source):
    lay = _layout(prop)
    if header[:2] != ["component", "value"] or len(header) > 3 or (len(header) == 3 and header[2] not in (
            "uncertainty", "sigma")):
        raise DataError(f"{name}: the long-form header must be 'component,value' or "
                        f"'component,value,uncertainty', got {_cut(','.join(header))!r}")
    has_unc = len(header) == 3
    vals = {}
    uncs = {}
    for lineno, line in rows:
        parts = [p.strip() for p in next(csv.reader([line], skipinitialspace=True))]
        if len(parts) != len(header):
            hint = ""
            if len(parts) > len(header) and any(
                    _DECIMAL_COMMA.match(f"{a},{b}") for a, b in zip(parts[1:], parts[2:])):
                hint = ("; if a value has a decimal comma: decimal commas are not accepted, write the decimal "
                        "point ('1.5', not '1,5')")
            raise DataError(f"{name}, line {lineno}: expected {len(header)} fields ({','.join(header)}), "
                            f"got {len(parts)}{hint}")
        where = _component_index(parts[0], prop, lay)
        if where is None:
            raise DataError(f"{name}, line {lineno}: {_cut(parts[0])!r} is not a component of {prop.name}: "
                            f"give a Voigt label such as {lay.labels[0]!r} ({len(prop.voigt_groups)} digits) or "
                            f"{lay.rank} Cartesian indices 1-3")
        nums = [_number(p, lineno, name) for p in parts[1:]]
        c, sign, factor = where
        if c == "zero":
            if nums[0] != 0:
                raise DataError(f"{name}, line {lineno}: {parts[0]} vanishes by the index symmetry of "
                                f"{prop.name} but is given as {nums[0]:g}")
            continue
        vals.setdefault(c, []).append((nums[0] * sign / factor, lineno))
        if has_unc:
            if nums[1] <= 0:
                raise DataError(f"{name}, line {lineno}: the uncertainty must be strictly positive, "
                                f"got {nums[1]:g}")
            uncs.setdefault(c, []).append((nums[1] / factor, lineno))
    if not vals:
        raise DataError(f"{name}: no components: the long-form table has its header but no 'component,value' "
                        "lines" + (" other than components the index symmetry makes zero" if rows else ""))
    scale = max([abs(v) for lst in vals.values() for v, _ in lst] + [0.0])
    x = np.full(lay.n, np.nan)  # components the file does not list are unknown
    for c, lst in vals.items():
        v0, l0 = lst[0]
        for v, ln in lst[1:]:
            if abs(v - v0) > tol * scale:
                raise DataError(f"{name}: {lay.labels[c]} is {v0:g} on line {l0} but {v:g} on line {ln}; "
                                "entries the index symmetry makes equal must agree (they are not averaged)")
        x[c] = np.mean([v for v, _ in lst])
    sigma = None
    if has_unc:
        sigma = np.full(lay.n, np.nan)
        for c, lst in uncs.items():
            s0 = lst[0][0]
            if any(abs(s - s0) > tol * max(abs(s0), 1e-300) for s, _ in lst[1:]):
                raise DataError(f"{name}: the uncertainties given for {lay.labels[c]} disagree")
            sigma[c] = s0
    return _partial_data(name, x, prop, sigma, units=units, source=source, hint="a line 'LABEL,0'")


def _partial_data(name, x, prop, sigma, *, hint, **kw):
    """TensorData of the distinct components ``x`` (NaN: not given, unknown), errors prefixed with the file name.

    Where tensor_data refuses unknown (NaN) components, the refusal says which
    components are missing and how to mark a zero, instead of speaking of NaN.
    """
    try:
        return tensor_data(x, prop, sigma=sigma, layout="components", **kw)
    except DataError as exc:
        unknown = np.isnan(x)
        if not unknown.any():
            raise DataError(f"{name}: {exc}") from exc
        probe_sigma = None if sigma is None else np.where(np.isnan(sigma), 1.0, sigma)
        try:  # the same data with the unknowns set: does anything else fail?
            tensor_data(np.where(unknown, 0.0, x), prop, sigma=probe_sigma, layout="components", **kw)
        except DataError as exc0:
            raise DataError(f"{name}: {exc0}") from exc0
        lay = _layout(prop)
        missing = [lay.labels[c] for c in np.flatnonzero(unknown)]
        raise DataError(f"{name} gives {lay.n - len(missing)} of the {lay.n} distinct components of {prop.name}; "
                        f"the others are unknown, not zero, and tensor data need every component (missing: "
                        f"{', '.join(missing[:8])}{', ...' if len(missing) > 8 else ''}); mark a zero "
                        f"component with 0 ({hint})") from exc


def _from_json(obj, what, units, tol, name):
    if not isinstance(obj, dict):
        raise DataError(f"{name}: a tensym data file holds one JSON object, got {type(obj).__name__}")
    known = {"format", "property", "units", "layout", "values", "uncertainty", "covariance", "source", "note"}
    extra = sorted(set(obj) - known)
    if extra:
        raise DataError(f"{name}: unknown keys {', '.join(repr(_cut(k)) for k in extra[:5])}"
                        f"{', ...' if len(extra) > 5 else ''}; accepted: {', '.join(sorted(known))}")
    for key in ("units", "source", "note"):  # optional: null is the same as leaving the key out
        if key in obj and obj[key] is None:
            del obj[key]
    for key in ("format", "property", "units", "layout", "source", "note"):
        if key in obj and not isinstance(obj[key], str):
            raise DataError(f"{name}: \"{key}\" must be a string, got {_json_kind(obj[key])}")
    tag = obj.get("format", FORMAT_TAG)
    if tag != FORMAT_TAG:
        raise DataError(f"{name}: format {_cut(tag)!r} is not {FORMAT_TAG!r}")
    prop_arg = _merge(obj.get("property"), what, "property", name)
    if prop_arg is None:
        raise DataError(f"{name} does not say which property it holds; pass what=... (--property NAME on the "
                        "command line) or add \"property\"")
    prop = _file_property(prop_arg, what, name)
    lay = _layout(prop)
    u = _merge(obj.get("units"), units, "units", name)
    if "values" not in obj:
        raise DataError(f"{name}: no \"values\"")
    layout = obj.get("layout", "auto")
    if layout not in LAYOUTS:
        raise DataError(f"{name}: layout {_cut(layout)!r} is not one of {', '.join(LAYOUTS)}")
    values, unc = obj["values"], obj.get("uncertainty")
    if isinstance(values, dict):
        values = _dict_components(values, prop, lay, name, "values")
        unc = None if unc is None else _dict_components(unc, prop, lay, name, "uncertainty")
        layout = "components"
    elif isinstance(unc, dict):
        raise DataError(f"{name}: \"uncertainty\" must have the form of \"values\"")
    else:
        values = _json_array(values, name, "values")
        unc = None if unc is None else _json_array(unc, name, "uncertainty")
    cov = None
    if "covariance" in obj:
        if unc is not None:
            raise DataError(f"{name}: give \"uncertainty\" or \"covariance\", not both")
        cv = obj["covariance"]
        if not isinstance(cv, dict) or set(cv) != {"labels", "matrix"}:
            raise DataError(f"{name}: \"covariance\" must be {{\"labels\": [...], \"matrix\": [[...]]}}")
        if not isinstance(cv["labels"], list) or not all(isinstance(v, str) for v in cv["labels"]):
            raise DataError(f"{name}: covariance \"labels\" must be a list of component labels (strings)")
        labels = list(cv["labels"])
        if sorted(labels) != sorted(lay.labels) or len(labels) != lay.n:
            missing = sorted(set(lay.labels) - set(labels))
            raise DataError(f"{name}: the covariance must cover every distinct component exactly once"
                            + (f"; missing: {', '.join(missing[:8])}" if missing else ""))
        rows = _json_array(cv["matrix"], name, "covariance.matrix")
        if not isinstance(rows, list) or len(rows) != lay.n or any(
                not isinstance(r, list) or len(r) != lay.n or any(isinstance(x, list) for x in r) for r in rows):
            shape = np.shape(rows) if isinstance(rows, list) and len({len(r) if isinstance(r, list) else -1
                                                                     for r in rows}) == 1 else "ragged rows"
            raise DataError(f"{name}: covariance matrix must be {lay.n} x {lay.n}, got {shape}")
        m = np.array(rows, dtype=np.float64)
        perm = [labels.index(lb) for lb in lay.labels]
        cov = m[np.ix_(perm, perm)]
    if layout == "components" and isinstance(values, np.ndarray):  # an object of components
        return _partial_data(name, values, prop, unc, covariance=cov, units=u, source=obj.get("source", name),
                             hint="\"LABEL\": 0 in \"values\"")
    return _tensor_data(name, values, prop, sigma=unc, covariance=cov, units=u, layout=layout,
                        symmetry_tol=tol, source=obj.get("source", name))


def _file_property(prop_arg, what, name):
    """The property named by the file (or by ``what``); a file's unknown name is reported with the file."""
    try:
        return as_property(prop_arg)
    except UnknownPropertyError as exc:
        if what is not None:
            raise
        raise UnknownPropertyError(f"{name}: {exc}") from exc


def _tensor_data(name, values, prop, **kw):
    """tensor_data(values, prop, **kw), its errors prefixed with the file name."""
    try:
        return tensor_data(values, prop, **kw)
    except DataError as exc:
        raise DataError(f"{name}: {exc}") from exc


def _json_kind(value):
    if isinstance(value, _BadNumber):
        return f"the number {_cut(value.text)}"
    kinds = {bool: "true/false", type(None): "null", list: "a list", dict: "an object", int: "a number",
             float: "a number"}
    return kinds.get(type(value), type(value).__name__)


def _dict_components(d, prop, lay, name, what):
    x = np.full(lay.n, np.nan)  # components not given are unknown
    seen = set()
    for key, val in d.items():
        where = _component_index(str(key), prop, lay)
        if where is None or where[0] == "zero":
            raise DataError(f"{name}: {_cut(key)!r} in {what} is not a component of {prop.name}")
        c, sign, factor = where
        v = _json_number(val, name, f"{what}[{_cut(key)!r}]")
        v = abs(v) / factor if what == "uncertainty" else v * sign / factor
        if c in seen and not np.isclose(x[c], v, rtol=1e-12, atol=0):
            raise DataError(f"{name}: {lay.labels[c]} is given twice in {what} with different values")
        seen.add(c)
        x[c] = v
    return x
