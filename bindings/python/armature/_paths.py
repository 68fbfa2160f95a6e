"""Dotted field paths into a request ("slab.spans_m[0]"), shared by sweep
axes, `request_for` and the per-code overrides of `compare`. Whether a
path names a request field is judged by the kernel's own request parser."""
import copy
import difflib
import re

from . import _core
from ._core import InputError

_PATH = re.compile(r"[^.\[\]]+(?:\.[^.\[\]]+|\[\d+\])*")
_TOKEN = re.compile(r"\[(\d+)\]|([^.\[\]]+)")


def _path_tokens(path):
    """The keys and list indices of a dotted path: "slab.spans_m[0]" gives
    ["slab", "spans_m", 0]. Raises InputError naming the path."""
    if not isinstance(path, str) or not _PATH.fullmatch(path):
        raise InputError(f"{path}: not a field path (keys joined by dots, list entries as [0], "
                         "for example slab.spans_m[0])")
    return [int(i) if i else key for i, key in _TOKEN.findall(path)]


def _set_path(request, path, value, base=None):
    """Sets `value` at the dotted `path` of the request dict, as the sweep of
    the kernel does (kernel/src/studies/sweep.cpp set_axis_value): objects missing on
    the way are made, list entries must exist. The path "code" takes "ID" or
    "ID:variant"; "ID" alone keeps the variant of `base` when `base` is of
    that code, else none (the code's default)."""
    if path == "code" and isinstance(value, str):
        code, sep, variant = value.partition(":")
        request["code"] = code
        if sep:
            request["variant"] = variant
        elif base is not None and "variant" in base and base.get("code") == code:
            request["variant"] = copy.deepcopy(base["variant"])
        else:
            request.pop("variant", None)
        return
    tokens = _path_tokens(path)
    node = request
    for i, tok in enumerate(tokens):
        last = i == len(tokens) - 1
        if isinstance(tok, int):
            if not isinstance(node, list) or tok >= len(node):
                raise InputError(f"{path}: the request has no list entry {tok} here")
            if last:
                node[tok] = value
            else:
                node = node[tok]
        else:
            if not isinstance(node, dict):
                raise InputError(f"{path}: '{tok}' is not inside an object")
            if last:
                node[tok] = value
            else:
                if node.get(tok) is None:
                    node[tok] = {}
                node = node[tok]


def _is_within(field, path):
    """True when the problem's `field` is `path` or one of its parents."""
    return path == field or path.startswith(field + ".") or path.startswith(field + "[")


def _names_path(field, message, path):
    """True when a problem at `field` is about the field at `path`: an
    unknown field at the path or above it, or a field given both under its
    plain name and its unit name ("give either thickness or thickness_mm")
    with the path as one of the two."""
    if message == "unknown field":
        return _is_within(field, path)
    if message.startswith("give either"):
        parent = field.rpartition(".")[0]
        head, _, last = path.rpartition(".")
        return head == parent and last in re.findall(r"\w+", message)
    return False


def _suggestion(base, path):
    """A close key of the base request at the same level, if any."""
    tokens = _path_tokens(path)
    node = base
    for tok in tokens[:-1]:
        try:
            node = node[tok]
        except (KeyError, IndexError, TypeError):
            return ""
    if not isinstance(node, dict) or isinstance(tokens[-1], int):
        return ""
    close = difflib.get_close_matches(tokens[-1], [k for k in node if isinstance(k, str)], n=1)
    return f" (did you mean {path[: len(path) - len(tokens[-1])] + close[0]}?)" if close else ""


def _check_paths(base, assignments, what):
    """Raises one InputError naming every path of `assignments` (path,
    value pairs, applied to a copy of `base` in order) that is not a field
    of a request; `what` says what the paths are ("sweep axis"). The
    kernel's own parser judges (no list of fields is kept in Python).
    Problems of the values themselves are left to the design, which names
    them per row or per code."""
    req = copy.deepcopy(base)
    bad = []
    for path, value in assignments:
        try:
            _set_path(req, path, copy.deepcopy(value), base)
        except InputError as e:
            bad.append(f"{e} ({what})")
    if not bad:
        paths = [p for p, _ in assignments]
        for field, message in _core.request_problems(req):
            for path in paths:
                if not _names_path(field, message, path):
                    continue
                if message != "unknown field":
                    bad.append(f"{path}: {message} ({what})")
                elif field == path:
                    bad.append(f"{path}: the {what} is not a request field{_suggestion(base, path)}")
                else:
                    bad.append(f"{path}: the {what} is not a request field ({field} is unknown)")
    if bad:
        raise InputError("\n".join(dict.fromkeys(bad)))
